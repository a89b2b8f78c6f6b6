import { vecAdd, vecSub, type Vec } from '$lib/geometry';
import { docPieceMoved } from '../state/doc-edits';
import type { MoveDef } from './types';

export interface SelectState {
	id: 'select';
	/** A piece being moved on the table: where the pointer went down, where the piece was, where it would go. */
	drag: { key: string; start: Vec; from: Vec; offset: Vec | null } | null;
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
	hint: () => 'Click a piece, an edge or a point to select it; drag a piece to move it on the table; drag the paper to pan.',
	down(ctx, st, p) {
		ctx.selectHit(p.hit);
		const piece = p.hit && ctx.piece(p.hit.pieceKey);
		if (!piece) return false;
		st.drag = { key: piece.key, start: p.world, from: piece.offset, offset: null };
		return true;
	},
	move(_ctx, st, p) {
		const d = st.drag;
		if (d) d.offset = vecAdd(d.from, vecSub(p.world, d.start));
	},
	up(ctx, st, _p, moved) {
		const d = st.drag;
		st.drag = null;
		const offset = d?.offset;
		if (moved && d && offset) ctx.edit((doc) => docPieceMoved(doc, d.key, offset));
	}
};
