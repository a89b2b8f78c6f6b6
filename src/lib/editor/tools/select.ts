import { vecAdd, vecSub } from '$lib/geometry';
import type { ToolDef } from './types';

/** Select pieces, edges and points; drag a piece to move it on the table (display only). */
export const selectTool: ToolDef = {
	id: 'select',
	name: 'Select',
	key: 'v',
	icon: 'M6 3 L6 19 L10 15 L13 21 L15.5 20 L12.5 14 L18 14 Z',
	edits: false,
	hint: () => 'Click a piece, an edge or a point to select it; drag a piece to move it on the table; drag the paper to pan.',
	down(s, p) {
		const h = p.hit;
		if (!h) {
			s.selection.segmentIndex = -1;
			s.selection.point = null;
			return false;
		}
		s.selection.pieceKey = h.pieceKey;
		s.selection.segmentIndex = h.kind === 'edge' || h.kind === 'point' ? h.segmentIndex : -1;
		s.selection.point = h.kind === 'point' || h.kind === 'apex' ? h.local : null;
		const piece = s.piece(h.pieceKey);
		if (!piece) return false;
		s.input.points = [p.world, piece.offset];
		return true;
	},
	move(s, p) {
		const key = s.selection.pieceKey;
		const [start, orig] = s.input.points;
		if (!key || !start) return;
		s.moving = { key, offset: vecAdd(orig, vecSub(p.world, start)) };
	},
	up(s, _p, moved) {
		const m = s.moving;
		s.moving = null;
		s.input.points = [];
		if (moved && m) s.movePiece(m.key, m.offset);
	}
};
