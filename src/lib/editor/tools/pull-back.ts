import { vecDot, vecLerp, vecNormalize, vecSub } from '$lib/geometry';
import type { EditorState } from '../editor-state.svelte';
import { emptyPreview, type ToolDef } from './types';
import { dartApex, deg, localOf, mm, pickDart, stepPreview, toolPiece } from './common';

function step(s: EditorState) {
	return s.input.dartId ? { op: 'pull_back', params: { dartId: s.input.dartId, clearanceMm: s.input.clearanceMm } } : null;
}

/** Pull back: move the sewn point of a dart back from the apex along its centre (clearance). */
export const pullBackTool: ToolDef = {
	id: 'pull_back',
	name: 'Pull back',
	key: 'b',
	icon: 'M4 20 L12 8 L20 20 M12 8 L12 3 M9.5 5.5 L12 3 L14.5 5.5',
	edits: true,
	hint: (s) => (s.input.dartId ? 'Type the clearance or drag along the dart centre; Enter applies.' : 'Click the dart whose point to pull back.'),
	down(s, p) {
		if (!s.input.dartId || p.hit?.pieceKey !== s.input.pieceKey) return pickDart(s, p);
		return true;
	},
	move(s, p) {
		const piece = toolPiece(s);
		const w = piece && dartApex(piece, s.input.dartId);
		if (!w) return;
		const axis = vecNormalize(vecSub(vecLerp(w.leg1End, w.leg2End, 0.5), w.apex));
		const c = vecDot(vecSub(localOf(s, p.world), w.apex), axis);
		s.input.clearanceMm = Math.max(0.5, Math.round(c * 2) / 2);
	},
	commit(s) {
		const st = step(s);
		if (st) s.commitStep(st);
	},
	preview(s) {
		const piece = toolPiece(s);
		if (!piece || !s.input.dartId) return null;
		const w = dartApex(piece, s.input.dartId);
		if (!w) return emptyPreview(s.input.pieceKey, 'That dart is not on this piece.');
		return stepPreview(s, step(s)!, [{ kind: 'line', points: [w.apex, vecLerp(w.leg1End, w.leg2End, 0.5)], tone: 'select', dashed: true }], (v) =>
			Object.entries(v).map(([k, x]) => ({
				label: k.replace(/([A-Z])/g, ' $1').replace(' Rad', '').replace(' Mm', '').toLowerCase(),
				value: k.endsWith('Rad') ? deg(x) : mm(s, x)
			}))
		);
	}
};
