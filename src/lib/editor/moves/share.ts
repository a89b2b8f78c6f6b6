import { vecDistance } from '$lib/geometry';
import type { AnchoredPoint } from '$lib/pattern/anchors/anchor-pick';
import { pickedPoint } from './anchored';
import { dartApex, dartStart, deg, mm, pickDart, movePiece, stepPreview, type OnDart } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef, type OverlayItem } from './types';

export interface ShareState extends OnDart {
	id: 'share';
	/** Where the parts of the dart open, and each part's share of its angle. */
	points: AnchoredPoint[];
	fractions: number[];
	/** The share left in the dart. */
	keepFraction: number;
	dragIndex: number;
}

/** Equal shares of what is not kept in the dart. */
export function equalise(fr: readonly number[], keep: number): number[] {
	const n = fr.length;
	return n ? fr.map(() => (1 - keep) / n) : [];
}

export function sharePartAdd(st: ShareState, at: AnchoredPoint) {
	st.points = [...st.points, at];
	st.fractions = equalise([...st.fractions, 0], st.keepFraction);
}

export function sharePartRemove(st: ShareState, i: number) {
	st.points = st.points.filter((_, k) => k !== i);
	st.fractions = equalise(st.fractions.filter((_, k) => k !== i), st.keepFraction);
}

export function shareStep(st: ShareState) {
	if (!st.dartId || st.points.length === 0) return null;
	return {
		op: 'share',
		params: { dartId: st.dartId, parts: st.points.map((to, i) => ({ to, fraction: st.fractions[i] ?? 0 })), ...(st.keepFraction > 0 ? { keep: { fraction: st.keepFraction } } : {}) }
	};
}

/** Share: split a dart between several new points on the outline (fractions of its angle). */
export const shareMove: MoveDef<ShareState> = {
	id: 'share',
	name: 'Share',
	key: 'h',
	icon: 'M12 20 L4 8 M12 20 L9 4 M12 20 L15 4 M12 20 L20 8',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'share', ...(prev ? { pieceKey: prev.pieceKey, dartId: null } : dartStart(ctx)), points: [], fractions: [], keepFraction: 0, dragIndex: -1 }),
	started: (st) => st.points.length > 0,
	hint(_ctx, st) {
		if (!st.dartId) return 'Click the dart to share out.';
		if (st.points.length === 0) return 'Click points on the outline where parts of the dart will open.';
		return 'Add more points, type the fractions, then Enter or Apply. Drag a point to move it.';
	},
	down(ctx, st, p) {
		if (!st.dartId || p.hit?.pieceKey !== st.pieceKey) return pickDart(ctx, st, p) && false;
		if (!(p.hit.kind === 'edge' || p.hit.kind === 'point')) return pickDart(ctx, st, p) && false;
		const i = st.points.findIndex((q) => vecDistance(q, p.hit!.local) < ctx.tolMm(10));
		if (i >= 0) {
			st.dragIndex = i;
			return true;
		}
		sharePartAdd(st, pickedPoint(ctx, st.pieceKey, p.hit.local));
		st.dragIndex = st.points.length - 1;
		return true;
	},
	move(ctx, st, p) {
		if (st.dragIndex < 0 || !st.pieceKey) return;
		const snap = ctx.snapAt(p.world, { onlyPiece: st.pieceKey, outlineOnly: true });
		ctx.showSnap(snap);
		if (snap.local) {
			const at = pickedPoint(ctx, st.pieceKey, snap.local);
			st.points = st.points.map((q, i) => (i === st.dragIndex ? at : q));
		}
	},
	up(ctx, st) {
		st.dragIndex = -1;
		ctx.showSnap(null);
	},
	commit(ctx, st) {
		const step = shareStep(st);
		return step && st.pieceKey ? outcome(ctx.apply(st.pieceKey, step)) : NOTHING;
	},
	preview(ctx, st) {
		const piece = movePiece(ctx, st);
		if (!piece || !st.dartId) return null;
		const w = dartApex(piece, st.dartId);
		if (!w) return emptyPreview(st.pieceKey, 'That dart is not on this piece.');
		const overlay: OverlayItem[] = st.points.flatMap((q): OverlayItem[] => [
			{ kind: 'line', points: [w.apex, q], tone: 'select' },
			{ kind: 'point', at: q, tone: 'preview' }
		]);
		const step = shareStep(st);
		if (!step) return { ...emptyPreview(st.pieceKey), overlay };
		const sum = st.fractions.reduce((a, b) => a + b, 0) + st.keepFraction;
		return stepPreview(ctx, st, step, overlay, (v) => [
			...Object.entries(v)
				.filter(([k]) => k.endsWith('AngleRad') || k.endsWith('IntakeMm'))
				.map(([k, x]) => ({ label: k.replace(/([A-Z])/g, ' $1').replace('Rad', '').replace('Mm', '').toLowerCase(), value: k.endsWith('Rad') ? deg(x) : mm(ctx.unit, x) })),
			{ label: 'Shares total', value: `${(sum * 100).toFixed(1)} %`, tone: Math.abs(sum - 1) < 1e-6 ? 'ok' : 'bad' }
		]);
	}
};
