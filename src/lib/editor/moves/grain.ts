import type { AnchoredPoint } from '$lib/pattern/anchors/anchor-pick';
import { pickedPoint } from './anchored';
import { editableSelected, movePiece, pickPiece, reportReadouts, stepPreview, type OnPiece } from './common';
import { NOTHING, outcome, type MoveDef } from './types';

export interface GrainState extends OnPiece {
	id: 'grain';
	/** The middle of the grainline (piece coordinates), with its anchor. */
	target: AnchoredPoint | null;
	lengthMm: number;
	direction: 'lengthwise' | 'crosswise' | 'bias';
	/** Both: either way up; one: nap or a one-way print. */
	arrowheads: 'both' | 'one';
}

export function grainStep(st: GrainState) {
	if (!st.target) return null;
	return { op: 'grain', params: { through: st.target, lengthMm: st.lengthMm, direction: st.direction, arrowheads: st.arrowheads } };
}

/** Grain: the grainline through a point of the piece. */
export const grainMove: MoveDef<GrainState> = {
	id: 'grain',
	name: 'Grain',
	key: 'g',
	icon: 'M12 3 L12 21 M8 7 L12 3 L16 7 M8 17 L12 21 L16 17',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'grain', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), target: null, lengthMm: prev?.lengthMm ?? 200, direction: prev?.direction ?? 'lengthwise', arrowheads: prev?.arrowheads ?? 'both' }),
	started: (st) => st.target !== null,
	hint: (_ctx, st) => (st.target ? 'Type the length and direction; Enter applies.' : 'Click inside a piece where the middle of the grainline goes.'),
	down(ctx, st, p) {
		const h = p.hit;
		if (!h || !pickPiece(ctx, st, h.pieceKey)) return false;
		st.target = pickedPoint(ctx, st.pieceKey, ctx.local(h.pieceKey, p.world));
		return true;
	},
	move(ctx, st, p) {
		if (st.pieceKey) st.target = pickedPoint(ctx, st.pieceKey, ctx.local(st.pieceKey, p.world));
	},
	commit(ctx, st) {
		const s = grainStep(st);
		return s && st.pieceKey && movePiece(ctx, st) ? outcome(ctx.apply(st.pieceKey, s)) : NOTHING;
	},
	preview(ctx, st) {
		const s = grainStep(st);
		if (!s || !st.target || !movePiece(ctx, st)) return null;
		return stepPreview(ctx, st, s, [{ kind: 'point', at: st.target, tone: 'preview' }], reportReadouts(ctx.unit));
	}
};
