import { segmentPointAt } from '../geometry/segment';
import type { Outline, Segment, SegmentLocation, Vec } from '../geometry/types';

/**
 * Nearest point on an outline to a given point.
 * TO MOVE to the geometry kernel (outlineNearestPoint) once it exists there; kept private here.
 */
function nearestOnSegment(s: Segment, p: Vec): { t: number; distance: number } {
	if (s.kind === 'line') {
		const dx = s.p1.x - s.p0.x;
		const dy = s.p1.y - s.p0.y;
		const l2 = dx * dx + dy * dy;
		const t = l2 === 0 ? 0 : Math.min(1, Math.max(0, ((p.x - s.p0.x) * dx + (p.y - s.p0.y) * dy) / l2));
		return { t, distance: Math.hypot(s.p0.x + dx * t - p.x, s.p0.y + dy * t - p.y) };
	}
	const d = (t: number) => {
		const q = segmentPointAt(s, t);
		return Math.hypot(q.x - p.x, q.y - p.y);
	};
	const samples = 64;
	let bestT = 0;
	let best = Infinity;
	for (let i = 0; i <= samples; i++) {
		const t = i / samples;
		const v = d(t);
		if (v < best) {
			best = v;
			bestT = t;
		}
	}
	// golden-section refinement in the bracketing interval
	let a = Math.max(0, bestT - 1 / samples);
	let b = Math.min(1, bestT + 1 / samples);
	const g = (Math.sqrt(5) - 1) / 2;
	let c = b - g * (b - a);
	let e = a + g * (b - a);
	let fc = d(c);
	let fe = d(e);
	for (let k = 0; k < 80 && b - a > 1e-14; k++) {
		if (fc < fe) {
			b = e;
			e = c;
			fe = fc;
			c = b - g * (b - a);
			fc = d(c);
		} else {
			a = c;
			c = e;
			fc = fe;
			e = a + g * (b - a);
			fe = d(e);
		}
	}
	const t = (a + b) / 2;
	const v = d(t);
	return v < best ? { t, distance: v } : { t: bestT, distance: best };
}

export function outlineNearestLocation(outline: Outline | { segments: readonly Segment[] }, p: Vec): SegmentLocation & { point: Vec; distance: number } {
	let best = { segmentIndex: 0, t: 0, distance: Infinity };
	outline.segments.forEach((s, i) => {
		const r = nearestOnSegment(s, p);
		if (r.distance < best.distance) best = { segmentIndex: i, t: r.t, distance: r.distance };
	});
	return { ...best, point: segmentPointAt(outline.segments[best.segmentIndex], best.t) };
}
