import { vecDistance, type Vec } from '$lib/geometry';
import { lengthReadoutText } from '$lib/pattern/measurements/units';
import type { MoveContext } from './context';
import { editableSelected, movePiece, pickPiece, stepPreview, type OnPiece } from './common';
import { emptyPreview, NOTHING, outcome, type CommitOutcome, type MoveDef, type OverlayItem } from './types';

export interface FoldState extends OnPiece {
	id: 'fold';
	/** Both ends of the straight edge that goes on the fold. */
	ends: Vec[];
}

/** Fold: the piece is cut on the fold along one straight edge. */
export const foldMove: MoveDef<FoldState> = {
	id: 'fold',
	name: 'Fold',
	key: 'f',
	icon: 'M6 3 L6 21 M10 5 L18 5 L18 19 L10 19 M6 8 L9 8 M6 12 L9 12 M6 16 L9 16',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'fold', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), ends: [] }),
	started: (st) => st.ends.length > 0,
	hint: (_ctx, st) => (st.ends.length < 2 ? 'Click both ends of the straight edge that goes on the fold.' : 'Enter or Apply marks the fold.'),
	down(ctx, st, p) {
		const h = p.hit;
		if (!h || !(h.kind === 'edge' || h.kind === 'point')) return false;
		if (h.pieceKey !== st.pieceKey) st.ends = [];
		if (!pickPiece(ctx, st, h.pieceKey)) return false;
		st.ends = st.ends.length >= 2 ? [h.local] : [...st.ends, h.local];
		return false;
	},
	commit(ctx, st) {
		const [a, b] = st.ends;
		return a && b && st.pieceKey ? outcome(ctx.apply(st.pieceKey, { op: 'fold', params: { from: a, to: b } })) : NOTHING;
	},
	preview(ctx, st) {
		const [a, b] = st.ends;
		if (!movePiece(ctx, st) || !a) return null;
		const overlay: OverlayItem[] = [{ kind: 'point', at: a, tone: 'preview' }, ...(b ? [{ kind: 'line' as const, points: [a, b], tone: 'preview' as const }] : [])];
		if (!b) return { ...emptyPreview(st.pieceKey), overlay };
		return stepPreview(ctx, st, { op: 'fold', params: { from: a, to: b } }, overlay, () => [{ label: 'Fold length', value: lengthReadoutText(vecDistance(a, b), ctx.unit) }]);
	}
};

/** The fold taken off again (the piece is cut flat). */
export function foldRemove(ctx: MoveContext, st: FoldState): CommitOutcome {
	return st.pieceKey ? outcome(ctx.apply(st.pieceKey, { op: 'unfold', params: {} })) : NOTHING;
}
