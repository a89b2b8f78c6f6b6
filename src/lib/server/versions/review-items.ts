import { fitNoteShowsOn } from '$lib/fittings/notes';
import { FIT_NOTE_CATEGORY_LABELS } from '$lib/fittings/notes';
import { pieceSchema } from '$lib/pattern/piece-schema';
import type { DbOrTx } from '../db';
import { fitNotesOfPieces } from '../repositories/fit-notes';
import type { Acknowledgement } from '../repositories/version-reviews';
import type { VersionRow } from '../repositories/versions';
import { seamWarnings } from './save';

/**
 * What a signer must acknowledge before signing this version off: each seam out of tolerance (measured
 * now, against the other pieces' current heads) and each fit note not yet done that shows on it.
 * Ids are `seam:<seam pair id>` and `note:<fit note id>`.
 */
export async function reviewItems(db: DbOrTx, styleId: string, pieceId: string, v: VersionRow): Promise<Acknowledgement[]> {
	const seams = await seamWarnings(db, styleId, pieceId, pieceSchema.parse(v.geometry));
	const notes = (await fitNotesOfPieces(db, [pieceId])).filter((n) => n.status !== 'done' && fitNoteShowsOn(n, pieceId, v.number));
	return [
		...seams.map((s) => ({ kind: 'seam' as const, id: `seam:${s.seamPairId}`, message: `Seam ${s.message}` })),
		...notes.map((n) => ({
			kind: 'fit_note' as const,
			id: `note:${n.id}`,
			message: `Fit note (${n.status === 'in_hand' ? 'in hand' : 'open'}) from "${n.fittingTitle}": ${FIT_NOTE_CATEGORY_LABELS[n.category]}, ${n.body}`
		}))
	];
}
