import type { Segment, SegmentChain, Vec } from './types';
import { segmentPointAt } from './segment';
import { FLATTEN_TOLERANCE_MM } from './tolerance';

/**
 * Flattening curves to polylines FOR DRAWING ONLY (measure on the curves, never on these).
 * A cubic is cut into n equal parameter steps with n = ⌈√(0.75·M / tol)⌉, M = max(|p0 − 2p1 + p2|,
 * |p1 − 2p2 + p3|): since |B''| ≤ 6M, every chord is within tol of the curve.
 */

/** Number of equal parameter steps that keeps a cubic within `tolerance` of its chords. */
export function segmentFlattenSteps(s: Segment, tolerance = FLATTEN_TOLERANCE_MM): number {
	if (s.kind === 'line') return 1;
	const ax = s.p0.x - 2 * s.p1.x + s.p2.x, ay = s.p0.y - 2 * s.p1.y + s.p2.y;
	const bx = s.p1.x - 2 * s.p2.x + s.p3.x, by = s.p1.y - 2 * s.p2.y + s.p3.y;
	const m = Math.sqrt(Math.max(ax * ax + ay * ay, bx * bx + by * by));
	return Math.max(1, Math.min(10000, Math.ceil(Math.sqrt((0.75 * m) / Math.max(tolerance, 1e-9)))));
}

/** Points of one segment from start to end inclusive. */
export function segmentFlatten(s: Segment, tolerance = FLATTEN_TOLERANCE_MM): Vec[] {
	if (s.kind === 'line') return [s.p0, s.p1];
	const n = segmentFlattenSteps(s, tolerance);
	const out: Vec[] = [s.p0];
	for (let i = 1; i < n; i++) out.push(segmentPointAt(s, i / n));
	out.push(s.p3);
	return out;
}

/**
 * Polyline of a path or outline. For an outline (closed = true) the closing point is not repeated,
 * e.g. ready for a closed Konva line; for a path the last point is included.
 */
export function pathFlatten(chain: SegmentChain, tolerance = FLATTEN_TOLERANCE_MM, closed = false): Vec[] {
	const segs = chain.segments;
	if (segs.length === 0) return [];
	const out: Vec[] = [segs[0].p0];
	for (const s of segs) {
		const pts = segmentFlatten(s, tolerance);
		for (let i = 1; i < pts.length; i++) out.push(pts[i]);
	}
	if (closed && out.length > 1) out.pop();
	return out;
}

/** Closed polyline of an outline (closing point not repeated). */
export function outlineFlatten(chain: SegmentChain, tolerance = FLATTEN_TOLERANCE_MM): Vec[] {
	return pathFlatten(chain, tolerance, true);
}

/** Flat number array [x0, y0, x1, y1, ...] (as canvas libraries take it). */
export function pointsToFlatArray(points: readonly Vec[]): number[] {
	const out = new Array<number>(points.length * 2);
	for (let i = 0; i < points.length; i++) {
		out[2 * i] = points[i].x;
		out[2 * i + 1] = points[i].y;
	}
	return out;
}
