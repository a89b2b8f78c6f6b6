import type { Piece } from '$lib/pattern/piece-schema';
import type { AnchoredPoint } from '$lib/pattern/anchors/anchor-pick';
import { anchoredOn, pickedPoint } from './anchored';
import { editableSelected, movePiece, pickPiece, reportReadouts, stepPreview, type OnPiece } from './common';
import { NOTHING, outcome, type MoveDef } from './types';

export interface NotchState extends OnPiece {
	id: 'notch';
	/** On the stitching line (piece coordinates), with its anchor: a distance from the nearer end of its seam. */
	target: AnchoredPoint | null;
	/** One notch marks the front, two the back. */
	count: 1 | 2;
}

/** An id not yet used on the piece (`notch-3`). */
export function uniqueId(taken: readonly string[], base: string): string {
	let n = taken.length + 1;
	while (taken.includes(`${base}-${n}`)) n++;
	return `${base}-${n}`;
}

export function notchStep(g: Piece | null, st: NotchState) {
	if (!g || !st.target) return null;
	return { op: 'notch', params: { id: uniqueId(g.notches.map((n) => n.id), 'notch'), at: anchoredOn(g, st.target, 'distance'), count: st.count } };
}

/** Notch: a balance mark on the stitching line. */
export const notchMove: MoveDef<NotchState> = {
	id: 'notch',
	name: 'Notch',
	key: 'n',
	icon: 'M3 6 L21 6 M12 6 L12 13 M9 18 L15 18',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'notch', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), target: null, count: prev?.count ?? 1 }),
	started: (st) => st.target !== null,
	hint: (_ctx, st) => (st.target ? 'Enter or Apply places the notch; drag it along the outline to move it.' : 'Click the stitching line where the notch goes (one notch front, two back).'),
	down(ctx, st, p) {
		const h = p.hit;
		if (!h || !(h.kind === 'edge' || h.kind === 'point') || !pickPiece(ctx, st, h.pieceKey)) return false;
		st.target = pickedPoint(ctx, st.pieceKey, h.local, 'distance');
		return true;
	},
	move(ctx, st, p) {
		if (!st.pieceKey) return;
		const snap = ctx.snapAt(p.world, { onlyPiece: st.pieceKey, outlineOnly: true });
		ctx.showSnap(snap);
		if (snap.local) st.target = pickedPoint(ctx, st.pieceKey, snap.local, 'distance');
	},
	up: (ctx) => void ctx.showSnap(null),
	commit(ctx, st) {
		const s = notchStep(movePiece(ctx, st), st);
		return s && st.pieceKey ? outcome(ctx.apply(st.pieceKey, s)) : NOTHING;
	},
	preview(ctx, st) {
		const s = notchStep(movePiece(ctx, st), st);
		if (!s || !st.target) return null;
		return stepPreview(ctx, st, s, [{ kind: 'point', at: st.target, tone: 'preview' }], reportReadouts(ctx.unit));
	}
};
