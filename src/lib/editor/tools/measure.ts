import { outlineNearestPoint, outlinePerimeter, pathLengthAt, vecAdd, vecDistance, type Vec } from '$lib/geometry';
import type { EditorState } from '../editor-state.svelte';
import type { Snap } from '../hit';
import { fmtLength } from '../units';
import type { Readout, ToolDef, ToolPreview } from './types';

function along(s: EditorState, a: Snap, b: Snap): Readout[] {
	if (!a.pieceKey || a.pieceKey !== b.pieceKey || !a.local || !b.local) return [];
	const g = s.piece(a.pieceKey)?.geometry;
	if (!g) return [];
	const na = outlineNearestPoint(g.outline, a.local);
	const nb = outlineNearestPoint(g.outline, b.local);
	if (na.distance > 0.05 || nb.distance > 0.05) return [];
	const total = outlinePerimeter(g.outline);
	const fwd = (((pathLengthAt(g.outline, nb) - pathLengthAt(g.outline, na)) % total) + total) % total;
	return [
		{ label: 'Along the outline (forward)', value: fmtLength(fwd, s.unit) },
		{ label: 'Along the outline (back)', value: fmtLength(total - fwd, s.unit) }
	];
}

/** Tape measure: any straight distance, and along the stitching line between two points of a piece. */
export const measureTool: ToolDef = {
	id: 'measure',
	name: 'Tape measure',
	key: 'm',
	icon: 'M3 8 L21 8 L21 16 L3 16 Z M7 8 L7 11 M11 8 L11 12 M15 8 L15 11 M19 8 L19 12',
	edits: false,
	hint: (s) => (s.input.points.length === 1 ? 'Click or drag to the second point.' : 'Click (or drag between) two points: they snap to outline points, apexes, midpoints, edges and the grid.'),
	down(s, p) {
		if (s.input.points.length !== 1) {
			s.input.points = [p.snap.world];
		} else {
			s.input.points = [s.input.points[0], p.snap.world];
		}
		s.snapShown = p.snap;
		return true;
	},
	move(s, p) {
		s.input.points = [s.input.points[0], p.snap.world];
		s.snapShown = p.snap;
	},
	up(s) {
		s.snapShown = null;
	},
	preview(s): ToolPreview | null {
		const [a, b] = s.input.points;
		if (!a) return null;
		const readouts: Readout[] = [];
		const overlay: ToolPreview['overlay'][number][] = [{ kind: 'point', at: a, tone: 'measure' }];
		if (b) {
			const d = vecDistance(a, b);
			readouts.push(
				{ label: 'Straight distance', value: fmtLength(d, s.unit) },
				{ label: 'Across (x)', value: fmtLength(Math.abs(b.x - a.x), s.unit) },
				{ label: 'Down (y)', value: fmtLength(Math.abs(b.y - a.y), s.unit) },
				...along(s, s.snapAt(a, { grid: false }), s.snapAt(b, { grid: false }))
			);
			const mid: Vec = vecAdd(a, { x: (b.x - a.x) / 2, y: (b.y - a.y) / 2 });
			overlay.push({ kind: 'line', points: [a, b], tone: 'measure' }, { kind: 'point', at: b, tone: 'measure' }, { kind: 'label', at: mid, text: fmtLength(d, s.unit) });
		}
		return { pieceKey: null, piece: null, error: null, readouts, ledger: [], overlay, notes: [], canCommit: false };
	}
};
