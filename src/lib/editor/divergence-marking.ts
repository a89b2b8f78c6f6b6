import { outlineNearestPoint } from '$lib/geometry';
import type { Apex, Piece } from '$lib/pattern/piece-schema';
import type { MoveContext } from './moves/context';

/**
 * Marking a divergence point in the editor: an apex on the stitching line that is not one yet (the
 * bust point a separate left on the new seam) can be marked, as a `divergence_point` step the server
 * replays; the apex keeps its id, so its ledger goes on.
 */
export function divergenceMarkable(piece: Piece, apex: Apex): boolean {
	return apex.kind !== 'divergence' && outlineNearestPoint(piece.outline, apex.point).distance <= 0.1;
}

export function divergenceMark(ctx: MoveContext, key: string, apexId: string): string | null {
	const p = ctx.piece(key);
	const apex = p?.geometry.apexes.find((a) => a.id === apexId);
	if (!p || !apex) return 'No such point on this piece.';
	return ctx.apply(key, { op: 'divergence_point', params: { apexId } }, { label: `${p.name}: ${apex.label || apex.id} marked as a divergence point` });
}

/** Apexes a separate leaves on the outline of its parts (proposed as divergence points). */
export function divergenceProposals(pieces: readonly Piece[]): string[] {
	const names = new Set<string>();
	for (const p of pieces) for (const a of p.apexes) if (divergenceMarkable(p, a)) names.add(a.label || a.id);
	return [...names];
}
