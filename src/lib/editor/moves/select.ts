import { vecAdd, vecSub, type Vec } from '$lib/geometry';
import { outlineNearestPoint } from '$lib/geometry';
import { dartNear, type Hit } from '../hit';
import type { SelectedPart } from '../state/selection.svelte';
import { docPieceMoved } from '../state/doc-edits';
import type { MoveContext } from './context';
import { storedPair } from './seams';
import type { MoveDef } from './types';

export interface SelectState {
	id: 'select';
	/** A piece being moved on the table: where the pointer went down, where the piece was, whether it has moved yet. */
	drag: { key: string; start: Vec; from: Vec; moved: boolean } | null;
}

/** Select pieces, edges and points; drag a piece to move it on the table (display only). */
export const selectMove: MoveDef<SelectState> = {
	id: 'select',
	name: 'Select',
	key: 'v',
	icon: 'M6 3 L6 19 L10 15 L13 21 L15.5 20 L12.5 14 L18 14 Z',
	edits: false,
	fresh: () => ({ id: 'select', drag: null }),
	started: () => false,
	hint: () => 'Click a piece, a dart, a seam or a point to see what can be done with it; Shift+click panels to pick them together; drag a piece to move it on the table; drag the paper to pan.',
	down(ctx, st, p) {
		if (p.shift && p.hit) {
			ctx.togglePanel(p.hit.pieceKey);
			return false;
		}
		ctx.selectHit(p.hit);
		const piece = p.hit && ctx.piece(p.hit.pieceKey);
		if (!piece) return false;
		const part = partAt(ctx, p.hit!, ctx.local(piece.key, p.world));
		if (part) ctx.selectPart(piece.key, part);
		st.drag = { key: piece.key, start: p.world, from: piece.offset, moved: false };
		return true;
	},
	move(ctx, st, p) {
		const d = st.drag;
		if (!d) return;
		// the piece moves in the document as the pointer goes; the whole drag is one undo step
		const offset = vecAdd(d.from, vecSub(p.world, d.start));
		if (!ctx.dragChange((doc) => docPieceMoved(doc, d.key, offset))) d.moved = true;
	},
	up(ctx, st) {
		const d = st.drag;
		st.drag = null;
		if (d?.moved) ctx.dragEnd(`${ctx.piece(d.key)?.name ?? 'Piece'} moved on the table`);
	}
};

/** The part of a piece a click chose: an apex, else a dart near it, else the stored seam pair of the edge. */
export function partAt(ctx: MoveContext, h: Hit, local: { x: number; y: number }): SelectedPart | null {
	const g = ctx.piece(h.pieceKey)?.geometry;
	if (!g) return null;
	if (h.kind === 'apex') {
		const a = g.apexes.find((x) => x.point.x === h.local.x && x.point.y === h.local.y);
		if (a) return { apexId: a.id };
	}
	const dartId = dartNear(g, local, ctx.tolMm(10));
	if (dartId) return { dartId };
	if (h.kind !== 'edge' && h.kind !== 'point') return null;
	for (const sp of ctx.seamPairs) {
		if (sp.aPieceId !== h.pieceKey && sp.bPieceId !== h.pieceKey) continue;
		const pair = storedPair(ctx, sp);
		const edge = pair && (sp.aPieceId === h.pieceKey ? pair.a.edge : pair.b.edge);
		if (edge && outlineNearestPoint(edge, h.local).distance <= ctx.tolMm(4)) return { seamPairId: sp.id };
	}
	return null;
}
