import { vecDistance } from '$lib/geometry';
import { pointOnFold } from '$lib/pattern/operations/still-side';
import { dartNear } from '../hit';
import { seamsOf, seamTargetText } from '../pivot-target';
import type { AnchoredPoint } from '$lib/pattern/anchors/anchor-pick';
import { pickedPoint } from './anchored';
import { dartApex, dartStart, deg, mm, pickDart, movePiece, stepPreview, type OnDart } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef, type OverlayItem } from './types';

export interface PivotState extends OnDart {
	id: 'pivot';
	/** Where the dart opens (piece coordinates), with its anchor. */
	target: AnchoredPoint | null;
	dragging: boolean;
}

/** Pivot: close a dart and open it at a new point on the outline (drag the opening along the outline). */
export const pivotMove: MoveDef<PivotState> = {
	id: 'pivot',
	name: 'Pivot',
	key: 'p',
	icon: 'M12 20 L5 6 M12 20 L12 5 M19 9 A8 8 0 0 0 8 5 M19 9 L19.5 5 M19 9 L15.5 8',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'pivot', ...(prev ? { pieceKey: prev.pieceKey, dartId: null } : dartStart(ctx)), target: null, dragging: false }),
	started: (st) => st.target !== null,
	hint(_ctx, st) {
		if (!st.dartId) return 'Click a dart to pivot (or choose it in the form).';
		if (!st.target) return 'Drag from the dart along the outline to the new opening point, click a point on a seam, or choose the seam and the distance in the form.';
		return 'Release, press Enter or Apply to pivot; Escape cancels.';
	},
	down(ctx, st, p) {
		const h = p.hit;
		if (!h) return false;
		const g = ctx.piece(h.pieceKey)?.geometry;
		if (!g) return false;
		const near = dartNear(g, ctx.local(h.pieceKey, p.world), ctx.tolMm(14));
		if (!st.dartId || h.pieceKey !== st.pieceKey || (near && near !== st.dartId)) {
			if (!pickDart(ctx, st, p)) return false;
			st.target = null;
			st.dragging = true;
			return true;
		}
		if (near === st.dartId) {
			st.dragging = true;
			return true;
		}
		if (h.kind === 'edge' || h.kind === 'point') {
			st.target = pickedPoint(ctx, st.pieceKey, h.local);
			st.dragging = true;
			return true;
		}
		return false;
	},
	move(ctx, st, p) {
		if (!st.dragging || !st.pieceKey) return;
		const snap = ctx.snapAt(p.world, { onlyPiece: st.pieceKey, outlineOnly: true });
		ctx.showSnap(snap);
		if (snap.local) st.target = pickedPoint(ctx, st.pieceKey, snap.local);
	},
	up(ctx, st, _p, moved) {
		st.dragging = false;
		ctx.showSnap(null);
		return moved ? 'commit' : undefined;
	},
	commit(ctx, st) {
		if (!st.pieceKey || !st.dartId || !st.target) return NOTHING;
		return outcome(ctx.apply(st.pieceKey, { op: 'pivot', params: { dartId: st.dartId, to: st.target } }));
	},
	preview(ctx, st) {
		const piece = movePiece(ctx, st);
		const key = st.pieceKey;
		if (!piece || !st.dartId) return null;
		const w = dartApex(piece, st.dartId);
		if (!w) return emptyPreview(key, 'That dart is not on this piece.');
		const overlay: OverlayItem[] = [
			{ kind: 'line', points: [w.apex, w.leg1End], tone: 'select' },
			{ kind: 'line', points: [w.apex, w.leg2End], tone: 'select' }
		];
		if (!st.target) return { ...emptyPreview(key), overlay };
		const t = st.target;
		overlay.push({ kind: 'line', points: [w.apex, t], tone: 'select' });
		// on the fold the operation refuses; the canvas says so where the pointer is
		const marks: OverlayItem[] = pointOnFold(piece, t)
			? [{ kind: 'point', at: t, tone: 'bad' }, { kind: 'label', at: t, text: 'fold line: no dart opens here' }]
			: [{ kind: 'point', at: t, tone: 'preview' }];
		const u = ctx.unit;
		return stepPreview(ctx, st, { op: 'pivot', params: { dartId: st.dartId, to: t } }, [...overlay, ...marks], (v) => [
			{ label: 'Dart angle', value: deg(v.angleRad) },
			{ label: 'Intake before', value: mm(u, v.oldIntakeMm) },
			{ label: 'Intake after', value: mm(u, v.newIntakeMm) },
			{ label: 'Leg before', value: mm(u, v.oldLegLengthMm) },
			{ label: 'Leg after', value: mm(u, v.newLegLengthMm) },
			{ label: 'New opening', value: seamTargetText(piece, seamsOf(piece), t, (x) => mm(u, x)) },
			{ label: 'Apex to new point', value: mm(u, vecDistance(w.apex, t)) }
		]);
	}
};
