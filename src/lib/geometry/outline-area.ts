import type { Outline, Segment } from './types';

/**
 * Exact area by Green's theorem: A = ½∮(x dy − y dx), in closed form on each line and cubic.
 * Sign: positive when the outline runs from +x toward +y (clockwise on a y-down screen),
 * i.e. the sign of the shoelace sum Σ(xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ)/2.
 */

/** Contribution ½∫(x y' − y x') dt of one segment (closed form). */
export function segmentAreaContribution(s: Segment): number {
	if (s.kind === 'line') return 0.5 * (s.p0.x * s.p1.y - s.p1.x * s.p0.y);
	const { p0, p1, p2, p3 } = s;
	const c01 = p0.x * p1.y - p1.x * p0.y;
	const c02 = p0.x * p2.y - p2.x * p0.y;
	const c03 = p0.x * p3.y - p3.x * p0.y;
	const c12 = p1.x * p2.y - p2.x * p1.y;
	const c13 = p1.x * p3.y - p3.x * p1.y;
	const c23 = p2.x * p3.y - p3.x * p2.y;
	return (6 * c01 + 3 * c02 + c03 + 3 * c12 + 3 * c13 + 6 * c23) / 20;
}

/**
 * Signed area of a closed outline (mm²). To keep precision far from the origin, coordinates are taken
 * relative to the first point (the result is translation invariant for closed outlines).
 */
export function outlineSignedArea(outline: Outline): number {
	const segs = outline.segments;
	const n = segs.length;
	if (n === 0) return 0;
	const ox = segs[0].p0.x;
	const oy = segs[0].p0.y;
	let twice = 0;
	let cubic = 0;
	for (let i = 0; i < n; i++) {
		const s = segs[i];
		if (s.kind === 'line') {
			const x0 = s.p0.x - ox, y0 = s.p0.y - oy, x1 = s.p1.x - ox, y1 = s.p1.y - oy;
			twice += x0 * y1 - x1 * y0;
		} else {
			const x0 = s.p0.x - ox, y0 = s.p0.y - oy;
			const x1 = s.p1.x - ox, y1 = s.p1.y - oy;
			const x2 = s.p2.x - ox, y2 = s.p2.y - oy;
			const x3 = s.p3.x - ox, y3 = s.p3.y - oy;
			cubic +=
				6 * (x0 * y1 - x1 * y0) + 3 * (x0 * y2 - x2 * y0) + (x0 * y3 - x3 * y0) +
				3 * (x1 * y2 - x2 * y1) + 3 * (x1 * y3 - x3 * y1) + 6 * (x2 * y3 - x3 * y2);
		}
	}
	return 0.5 * twice + cubic / 20;
}

/** Unsigned area of a closed outline (mm²). */
export function outlineArea(outline: Outline): number {
	return Math.abs(outlineSignedArea(outline));
}

/** Signed area of a closed polygon given by its vertices (no repeated closing vertex needed). */
export function polygonSignedArea(points: readonly { x: number; y: number }[]): number {
	const n = points.length;
	if (n < 3) return 0;
	const ox = points[0].x, oy = points[0].y;
	let twice = 0;
	for (let i = 0, j = n - 1; i < n; j = i++) {
		twice += (points[j].x - ox) * (points[i].y - oy) - (points[i].x - ox) * (points[j].y - oy);
	}
	return 0.5 * twice;
}
