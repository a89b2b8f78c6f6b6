import type { Vec } from '$lib/geometry';
import type { EditorState } from '../editor-state.svelte';
import { emptyPreview, type ToolDef } from './types';
import { dartApex, deg, distanceAlongOutline, mm, pickDart, pointAlongOutline, stepPreview, toolPiece } from './common';

/** Where the pleats open: from the dart's leg-2 end forward (positive) or its leg-1 end backward (negative). */
export function pleatPoints(s: EditorState): Vec[] | null {
	const piece = toolPiece(s);
	const w = piece && dartApex(piece, s.input.dartId);
	if (!piece || !w) return null;
	const n = Math.max(1, Math.min(12, Math.round(s.input.count)));
	const first = s.input.firstAtMm;
	const from = first >= 0 ? w.leg2End : w.leg1End;
	const dir = first >= 0 ? 1 : -1;
	return Array.from({ length: n }, (_, i) => pointAlongOutline(piece.outline, from, first + dir * i * s.input.spacingMm));
}

function pleatStep(s: EditorState) {
	const at = pleatPoints(s);
	if (!at || !s.input.dartId) return null;
	return {
		op: 'pleat',
		params: {
			dartId: s.input.dartId,
			at,
			mode: s.input.mode,
			kind: s.input.kind,
			...(s.input.foldToward !== 'auto' ? { foldToward: s.input.foldToward } : {}),
			...(s.input.parallelMm > 0 ? { parallel: { pivotRadiusMm: s.input.parallelMm } } : {})
		}
	};
}

/** Pleat: turn a dart that sits at a seam into pleats or tucks; numbers typed, first position clickable. */
export const pleatTool: ToolDef = {
	id: 'pleat',
	name: 'Pleat',
	key: 'l',
	icon: 'M3 18 L7 6 L11 18 L15 6 L19 18 M3 21 L21 21',
	edits: true,
	hint(s) {
		if (!s.input.dartId) return 'Click the dart to turn into pleats (it should already sit at the seam).';
		return 'Type the count, first position and spacing, or click the outline where the first pleat goes; Enter applies.';
	},
	down(s, p) {
		if (pickDart(s, p)) return false;
		const piece = toolPiece(s);
		const w = piece && dartApex(piece, s.input.dartId);
		if (!piece || !w || p.hit?.pieceKey !== s.input.pieceKey || !(p.hit.kind === 'edge' || p.hit.kind === 'point')) return false;
		const d2 = distanceAlongOutline(piece.outline, w.leg2End, p.hit.local);
		const d1 = distanceAlongOutline(piece.outline, w.leg1End, p.hit.local);
		s.input.firstAtMm = Math.round((d2 >= 0 ? d2 : d1) * 10) / 10;
		return true;
	},
	move(s, p) {
		const piece = toolPiece(s);
		const w = piece && dartApex(piece, s.input.dartId);
		if (!piece || !w || !s.input.pieceKey) return;
		const snap = s.snapAt(p.world, { onlyPiece: s.input.pieceKey, outlineOnly: true });
		s.snapShown = snap;
		if (!snap.local) return;
		const d2 = distanceAlongOutline(piece.outline, w.leg2End, snap.local);
		const d1 = distanceAlongOutline(piece.outline, w.leg1End, snap.local);
		s.input.firstAtMm = Math.round((d2 >= 0 ? d2 : d1) * 10) / 10;
	},
	up(s) {
		s.snapShown = null;
	},
	commit(s) {
		const step = pleatStep(s);
		if (step) s.commitStep(step);
	},
	preview(s) {
		const piece = toolPiece(s);
		if (!piece || !s.input.dartId) return null;
		const w = dartApex(piece, s.input.dartId);
		if (!w) return emptyPreview(s.input.pieceKey, 'That dart is not on this piece.');
		const step = pleatStep(s);
		const at = pleatPoints(s) ?? [];
		const overlay = at.flatMap((q) => [
			{ kind: 'line' as const, points: [w.apex, q], tone: 'select' as const, dashed: true },
			{ kind: 'point' as const, at: q, tone: 'preview' as const }
		]);
		if (!step) return { ...emptyPreview(s.input.pieceKey), overlay };
		return stepPreview(s, step, overlay, (v) => {
			const out = [{ label: 'Dart angle', value: deg(v.angleRad) }];
			for (let i = 1; i <= (v.count ?? 0); i++) {
				out.push({ label: `Pleat ${i} angle`, value: deg(v[`pleat${i}AngleRad`]) });
				out.push({ label: `Pleat ${i} intake`, value: mm(s, v[`pleat${i}IntakeMm`]) });
				out.push({ label: `Pleat ${i} depth`, value: mm(s, v[`pleat${i}DepthMm`]) });
			}
			return out;
		});
	}
};
