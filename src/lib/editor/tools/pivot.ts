import { vecDistance } from '$lib/geometry';
import { pointOnFold } from '$lib/pattern/operations/still-side';
import { emptyPreview, type OverlayItem, type ToolDef } from './types';
import { dartApex, deg, mm, pickDart, stepPreview, toolPiece } from './common';
import { dartNear } from '../hit';
import { seamsOf, seamTargetText } from '../pivot-target';

/** Pivot: close a dart and open it at a new point on the outline (drag the opening along the outline). */
export const pivotTool: ToolDef = {
	id: 'pivot',
	name: 'Pivot',
	key: 'p',
	icon: 'M12 20 L5 6 M12 20 L12 5 M19 9 A8 8 0 0 0 8 5 M19 9 L19.5 5 M19 9 L15.5 8',
	edits: true,
	hint(s) {
		if (!s.input.dartId) return 'Click a dart to pivot (or choose it in the form).';
		if (!s.input.target) return 'Drag from the dart along the outline to the new opening point, click a point on a seam, or choose the seam and the distance in the form.';
		return 'Release, press Enter or Apply to pivot; Escape cancels.';
	},
	down(s, p) {
		const h = p.hit;
		if (!h) return false;
		const g = s.piece(h.pieceKey)?.geometry;
		if (!g) return false;
		const near = dartNear(g, s.local(h.pieceKey, p.world), s.tolMm(14));
		if (!s.input.dartId || h.pieceKey !== s.input.pieceKey || (near && near !== s.input.dartId)) {
			if (!pickDart(s, p)) return false;
			s.input.target = null;
			s.input.dragging = true;
			return true;
		}
		if (near === s.input.dartId) {
			s.input.dragging = true;
			return true;
		}
		if (h.kind === 'edge' || h.kind === 'point') {
			s.input.target = h.local;
			s.input.dragging = true;
			return true;
		}
		return false;
	},
	move(s, p) {
		if (!s.input.dragging || !s.input.pieceKey) return;
		const snap = s.snapAt(p.world, { onlyPiece: s.input.pieceKey, outlineOnly: true });
		s.snapShown = snap;
		if (snap.local) s.input.target = snap.local;
	},
	up(s, _p, moved) {
		s.input.dragging = false;
		s.snapShown = null;
		if (moved && s.preview?.canCommit) pivotTool.commit!(s);
	},
	commit(s) {
		if (!s.input.dartId || !s.input.target) return;
		s.commitStep({ op: 'pivot', params: { dartId: s.input.dartId, to: s.input.target } });
	},
	preview(s) {
		const piece = toolPiece(s);
		const key = s.input.pieceKey;
		if (!piece || !s.input.dartId) return null;
		const w = dartApex(piece, s.input.dartId);
		if (!w) return emptyPreview(key, 'That dart is not on this piece.');
		const overlay = [
			{ kind: 'line' as const, points: [w.apex, w.leg1End], tone: 'select' as const },
			{ kind: 'line' as const, points: [w.apex, w.leg2End], tone: 'select' as const }
		];
		if (!s.input.target) return { ...emptyPreview(key), overlay };
		const t = s.input.target;
		overlay.push({ kind: 'line', points: [w.apex, t], tone: 'select' });
		// on the fold the operation refuses; the canvas says so where the pointer is
		const marks: OverlayItem[] = pointOnFold(piece, t)
			? [{ kind: 'point', at: t, tone: 'bad' }, { kind: 'label', at: t, text: 'fold line: no dart opens here' }]
			: [{ kind: 'point', at: t, tone: 'preview' }];
		return stepPreview(s, { op: 'pivot', params: { dartId: s.input.dartId, to: t } }, [...overlay, ...marks], (v) => [
			{ label: 'Dart angle', value: deg(v.angleRad) },
			{ label: 'Intake before', value: mm(s, v.oldIntakeMm) },
			{ label: 'Intake after', value: mm(s, v.newIntakeMm) },
			{ label: 'Leg before', value: mm(s, v.oldLegLengthMm) },
			{ label: 'Leg after', value: mm(s, v.newLegLengthMm) },
			{ label: 'New opening', value: seamTargetText(piece, seamsOf(piece), t, (v) => mm(s, v)) },
			{ label: 'Apex to new point', value: mm(s, vecDistance(w.apex, t)) }
		]);
	}
};

