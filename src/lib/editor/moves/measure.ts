import { outlineNearestPoint, outlinePerimeter, pathLengthAt, vecAdd, vecDistance, type Vec } from '$lib/geometry';
import type { Snap } from '../hit';
import { lengthReadoutText } from '$lib/pattern/measurements/units';
import type { MoveContext } from './context';
import type { MoveDef, MovePreview, OverlayItem, Readout } from './types';

export interface MeasureState {
	id: 'measure';
	/** World points: the first, then the second once placed. */
	points: Vec[];
}

function along(ctx: MoveContext, a: Snap, b: Snap): Readout[] {
	if (!a.pieceKey || a.pieceKey !== b.pieceKey || !a.local || !b.local) return [];
	const g = ctx.piece(a.pieceKey)?.geometry;
	if (!g) return [];
	const na = outlineNearestPoint(g.outline, a.local);
	const nb = outlineNearestPoint(g.outline, b.local);
	if (na.distance > 0.05 || nb.distance > 0.05) return [];
	const total = outlinePerimeter(g.outline);
	const fwd = (((pathLengthAt(g.outline, nb) - pathLengthAt(g.outline, na)) % total) + total) % total;
	return [
		{ label: 'Along the outline (forward)', value: lengthReadoutText(fwd, ctx.unit) },
		{ label: 'Along the outline (back)', value: lengthReadoutText(total - fwd, ctx.unit) }
	];
}

/** Tape measure: any straight distance, and along the stitching line between two points of a piece. */
export const measureMove: MoveDef<MeasureState> = {
	id: 'measure',
	name: 'Tape measure',
	key: 'm',
	icon: 'M3 8 L21 8 L21 16 L3 16 Z M7 8 L7 11 M11 8 L11 12 M15 8 L15 11 M19 8 L19 12',
	edits: false,
	fresh: () => ({ id: 'measure', points: [] }),
	started: (st) => st.points.length > 0,
	hint: (_ctx, st) => (st.points.length === 1 ? 'Click or drag to the second point.' : 'Click (or drag between) two points: they snap to outline points, apexes, midpoints, edges and the grid.'),
	down(ctx, st, p) {
		st.points = st.points.length !== 1 ? [p.snap.world] : [st.points[0], p.snap.world];
		ctx.showSnap(p.snap);
		return true;
	},
	move(ctx, st, p) {
		// the second end also snaps to 15° steps from the first
		const snap = st.points[0] ? ctx.snapAt(p.world, { angleFrom: st.points[0] }) : p.snap;
		st.points = [st.points[0], snap.world];
		ctx.showSnap(snap);
	},
	up(ctx) {
		ctx.showSnap(null);
	},
	preview(ctx, st): MovePreview | null {
		const [a, b] = st.points;
		if (!a) return null;
		const readouts: Readout[] = [];
		const overlay: OverlayItem[] = [{ kind: 'point', at: a, tone: 'measure' }];
		if (b) {
			const d = vecDistance(a, b);
			readouts.push(
				{ label: 'Straight distance', value: lengthReadoutText(d, ctx.unit) },
				{ label: 'Across (x)', value: lengthReadoutText(Math.abs(b.x - a.x), ctx.unit) },
				{ label: 'Down (y)', value: lengthReadoutText(Math.abs(b.y - a.y), ctx.unit) },
				...along(ctx, ctx.snapAt(a, { grid: false }), ctx.snapAt(b, { grid: false }))
			);
			const mid: Vec = vecAdd(a, { x: (b.x - a.x) / 2, y: (b.y - a.y) / 2 });
			overlay.push({ kind: 'line', points: [a, b], tone: 'measure' }, { kind: 'point', at: b, tone: 'measure' }, { kind: 'label', at: mid, text: lengthReadoutText(d, ctx.unit) });
		}
		return { pieceKey: null, piece: null, error: null, readouts, ledger: [], overlay, notes: [], canCommit: false };
	}
};
