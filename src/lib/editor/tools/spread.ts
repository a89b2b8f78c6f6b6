import { vecDistance } from '$lib/geometry';
import type { EditorState } from '../editor-state.svelte';
import { emptyPreview, type ToolDef } from './types';
import { mm, stepPreview, toolPiece } from './common';

/** Spread: slash from an edge (to a hinge, or right through) and open it by a typed width. */
function step(s: EditorState) {
	const [from, to] = s.input.points;
	if (!from || !to) return null;
	const hinged = s.input.foldToward !== 'leg2';
	return { op: 'spread', params: { mode: hinged ? 'hinged' : 'parallel', slashes: [{ from, to, widthMm: s.input.spacingMm }] } };
}

export const spreadTool: ToolDef = {
	id: 'spread',
	name: 'Spread',
	key: 'd',
	icon: 'M4 20 L10 4 M20 20 L14 4 M10 4 L14 4 M7 14 L17 14',
	edits: true,
	hint(s) {
		const n = s.input.points.length;
		if (n === 0) return 'Click the edge that spreads, where the slash starts.';
		if (n === 1) return s.input.foldToward === 'leg2' ? 'Click the opposite edge where the slash ends.' : 'Click the hinge point on the opposite edge.';
		return 'Type the spread width; Enter applies. Added fullness is declared in the ledger.';
	},
	down(s, p) {
		const h = p.hit;
		if (!h || !(h.kind === 'edge' || h.kind === 'point')) return false;
		if (s.input.points.length === 0 || s.input.points.length >= 2 || h.pieceKey !== s.input.pieceKey) {
			s.input.pieceKey = h.pieceKey;
			s.selection.pieceKey = h.pieceKey;
			s.input.points = [h.local];
		} else s.input.points = [...s.input.points, h.local];
		return false;
	},
	commit(s) {
		const st = step(s);
		if (st) s.commitStep(st);
	},
	preview(s) {
		const [a, b] = s.input.points;
		if (!toolPiece(s) || !a) return null;
		const overlay = [{ kind: 'point' as const, at: a, tone: 'preview' as const }, ...(b ? [{ kind: 'line' as const, points: [a, b], tone: 'preview' as const, dashed: true }] : [])];
		const st = step(s);
		if (!st) return { ...emptyPreview(s.input.pieceKey), overlay };
		return stepPreview(s, st, overlay, (v) => [
			{ label: 'Slash length', value: mm(s, vecDistance(a, b!)) },
			...Object.entries(v).map(([k, x]) => ({ label: k.replace(/([A-Z])/g, ' $1').toLowerCase(), value: k.endsWith('Mm') ? mm(s, x) : k.endsWith('Mm2') ? `${x.toFixed(0)} mm²` : k.endsWith('Rad') ? `${((x * 180) / Math.PI).toFixed(2)}°` : x.toFixed(2) }))
		]);
	}
};
