import type { Db } from '../db';
import type { Role, VersionState } from '../db/schema';
import { versionsById, versionsStateSet, versionsSupersedeOthers } from '../repositories/versions';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { pieceOr404 } from './access';
import { seamWarnings } from './save';

export type StateChange =
	| { ok: true; version: { id: string; state: VersionState } }
	| { ok: false; status: 404 | 409; code: string; message: string };

/**
 * draft → proposed (pattern cutter, owner); draft or proposed → signed_off (designer, owner), which
 * supersedes the piece's earlier signed-off version. A version with a seam out of tolerance cannot be
 * signed off until the seam is trued (in a later version).
 */
export async function versionStateChange(
	db: Db,
	input: { studioId: string; pieceId: string; versionId: string; state: 'proposed' | 'signed_off'; userId: string; role: Role }
): Promise<StateChange> {
	const piece = await pieceOr404(db, input.studioId, input.pieceId);
	return db.transaction().execute(async (tx): Promise<StateChange> => {
		const v = await versionsById(tx, input.pieceId, input.versionId);
		if (!v) return { ok: false, status: 404, code: 'not_found', message: 'No such version of this piece.' };
		if (v.state === 'superseded' || v.state === 'signed_off') {
			return { ok: false, status: 409, code: 'state', message: `Version ${v.number} is already ${v.state.replace('_', ' ')}.` };
		}
		if (input.state === 'proposed' && v.state !== 'draft') {
			return { ok: false, status: 409, code: 'state', message: `Version ${v.number} is ${v.state}, not a draft.` };
		}
		if (input.state === 'signed_off') {
			// Seams are measured again now, against the other pieces' current heads.
			const seams = await seamWarnings(tx, piece.styleId, piece.id, pieceSchema.parse(v.geometry));
			if (seams.length > 0) {
				return {
					ok: false,
					status: 409,
					code: 'seams_not_true',
					message: `Version ${v.number} cannot be signed off until its seams are trued: ${seams.map((s) => s.message).join(' ')}`
				};
			}
			await versionsSupersedeOthers(tx, input.pieceId, v.id);
		}
		await versionsStateSet(tx, v.id, input.state, input.userId);
		return { ok: true, version: { id: v.id, state: input.state } };
	});
}
