import { vecDot, vecLerp, vecNormalize, vecSub } from '$lib/geometry';
import { dartApex, dartStart, deg, localOf, mm, pickDart, movePiece, stepPreview, type OnDart } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef } from './types';

export interface PullBackState extends OnDart {
	id: 'pull_back';
	/** From the apex to the new sewn point, along the dart's centre. */
	clearanceMm: number;
}

const step = (st: PullBackState) => (st.dartId ? { op: 'pull_back', params: { dartId: st.dartId, clearanceMm: st.clearanceMm } } : null);

/** Pull back: move the sewn point of a dart back from the apex along its centre (clearance). */
export const pullBackMove: MoveDef<PullBackState> = {
	id: 'pull_back',
	name: 'Pull back',
	key: 'b',
	icon: 'M4 20 L12 8 L20 20 M12 8 L12 3 M9.5 5.5 L12 3 L14.5 5.5',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'pull_back', ...(prev ? { pieceKey: prev.pieceKey, dartId: null } : dartStart(ctx)), clearanceMm: prev?.clearanceMm ?? 20 }),
	started: () => false,
	hint: (_ctx, st) => (st.dartId ? 'Type the clearance or drag along the dart centre; Enter applies.' : 'Click the dart whose point to pull back.'),
	down(ctx, st, p) {
		if (!st.dartId || p.hit?.pieceKey !== st.pieceKey) return pickDart(ctx, st, p);
		return true;
	},
	move(ctx, st, p) {
		const piece = movePiece(ctx, st);
		const w = piece && dartApex(piece, st.dartId);
		if (!w) return;
		const axis = vecNormalize(vecSub(vecLerp(w.leg1End, w.leg2End, 0.5), w.apex));
		const c = vecDot(vecSub(localOf(ctx, st, p.world), w.apex), axis);
		st.clearanceMm = Math.max(0.5, Math.round(c * 2) / 2);
	},
	commit(ctx, st) {
		const s = step(st);
		return s && st.pieceKey ? outcome(ctx.apply(st.pieceKey, s)) : NOTHING;
	},
	preview(ctx, st) {
		const piece = movePiece(ctx, st);
		if (!piece || !st.dartId) return null;
		const w = dartApex(piece, st.dartId);
		if (!w) return emptyPreview(st.pieceKey, 'That dart is not on this piece.');
		return stepPreview(ctx, st, step(st)!, [{ kind: 'line', points: [w.apex, vecLerp(w.leg1End, w.leg2End, 0.5)], tone: 'select', dashed: true }], (v) =>
			Object.entries(v).map(([k, x]) => ({
				label: k.replace(/([A-Z])/g, ' $1').replace(' Rad', '').replace(' Mm', '').toLowerCase(),
				value: k.endsWith('Rad') ? deg(x) : mm(ctx.unit, x)
			}))
		);
	}
};
