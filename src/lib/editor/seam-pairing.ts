import type { SeamPair } from '$lib/pattern/panels';
import { edgeEnds } from '$lib/pattern/panels/seam-edge-ends';
import type { SeamPairInfo } from './api';
import { seamPairCreate, seamPairDelete } from './api';
import type { PieceEdit } from './doc';

/**
 * Pairing seams by hand: two edges picked on two pieces (Join or True seam: click the two ends of an
 * edge on each piece) are stored as a seam pair of the style; a pair can be undone (unpaired); the
 * pairs of a piece are listed beside it. Pairs are stored at once, apart from the pieces' versions.
 */

/** Seams paired by hand are sewn to match, trued to 1/16 in (reference-values row 25, C/P). */
export const PAIRED_SEAM_TOLERANCE_MM = 25.4 / 16;

/** What pairing seams needs of the editor. */
export interface SeamPairingHost {
	readonly studioId: string;
	readonly styleId: string;
	readonly seamPairs: readonly SeamPairInfo[];
	readonly docs: { piece(key: string | null): PieceEdit | null };
	refreshSeamPairs(): Promise<void>;
	announce: string;
}

export async function seamsPair(s: SeamPairingHost, pair: SeamPair, label: string, allowedEaseMm = 0): Promise<string | null> {
	const a = s.docs.piece(pair.a.pieceId);
	const b = s.docs.piece(pair.b.pieceId);
	if (!a || !b || a.retired || b.retired) return 'Both pieces must be on the table.';
	if (a.key === b.key) return 'Pick the matching edge on another piece.';
	if (a.key.startsWith('new-') || b.key.startsWith('new-')) return 'Save the new pieces first: a seam pair joins stored pieces.';
	try {
		await seamPairCreate(s.studioId, s.styleId, {
			label: label.trim().slice(0, 120),
			a: { pieceId: a.key, ...edgeEnds(a.geometry, pair.a.edge) },
			b: { pieceId: b.key, ...edgeEnds(b.geometry, pair.b.edge) },
			allowedEaseMm,
			toleranceMm: PAIRED_SEAM_TOLERANCE_MM
		});
	} catch (e) {
		return `The seam pair was not stored: ${e instanceof Error ? e.message : String(e)}`;
	}
	await s.refreshSeamPairs();
	s.announce = `${a.name} and ${b.name} paired${label ? ` (${label})` : ''}.`;
	return null;
}

export async function seamsUnpair(s: SeamPairingHost, seamPairId: string): Promise<string | null> {
	const sp = s.seamPairs.find((x) => x.id === seamPairId);
	try {
		await seamPairDelete(s.studioId, s.styleId, seamPairId);
	} catch (e) {
		return `The seam pair was not removed: ${e instanceof Error ? e.message : String(e)}`;
	}
	await s.refreshSeamPairs();
	s.announce = `${sp?.label || 'Seam pair'} unpaired.`;
	return null;
}

/** The stored seam pairs one of whose edges is on the piece, with the other piece's name. */
export function seamPairsOfPiece(s: SeamPairingHost, key: string | null): { pair: SeamPairInfo; other: string }[] {
	if (!key) return [];
	return s.seamPairs
		.filter((sp) => sp.aPieceId === key || sp.bPieceId === key)
		.map((sp) => ({ pair: sp, other: s.docs.piece(sp.aPieceId === key ? sp.bPieceId : sp.aPieceId)?.name ?? 'a piece not on the table' }));
}
