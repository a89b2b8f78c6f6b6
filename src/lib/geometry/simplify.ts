import type { Vec } from './types';
import { SIMPLIFY_TOLERANCE_MM } from './tolerance';

/** Ramer–Douglas–Peucker simplification of polylines (e.g. before offsetting). */

function segDistSq(p: Vec, a: Vec, b: Vec): number {
	const dx = b.x - a.x, dy = b.y - a.y;
	const l2 = dx * dx + dy * dy;
	let t = l2 === 0 ? 0 : ((p.x - a.x) * dx + (p.y - a.y) * dy) / l2;
	if (t < 0) t = 0;
	else if (t > 1) t = 1;
	const ex = a.x + t * dx - p.x, ey = a.y + t * dy - p.y;
	return ex * ex + ey * ey;
}

function rdpMarks(points: readonly Vec[], first: number, last: number, tol2: number, keep: Uint8Array): void {
	const stack: number[] = [first, last];
	while (stack.length > 0) {
		const hi = stack.pop() as number;
		const lo = stack.pop() as number;
		let maxD = -1;
		let idx = -1;
		for (let i = lo + 1; i < hi; i++) {
			const d = segDistSq(points[i], points[lo], points[hi]);
			if (d > maxD) { maxD = d; idx = i; }
		}
		if (idx >= 0 && maxD > tol2) {
			keep[idx] = 1;
			stack.push(lo, idx, idx, hi);
		}
	}
}

/**
 * Open polyline simplified so that every dropped point is within `tolerance` of the result.
 * End points are always kept.
 */
export function polylineSimplify(points: readonly Vec[], tolerance = SIMPLIFY_TOLERANCE_MM): Vec[] {
	const n = points.length;
	if (n <= 2) return [...points];
	const keep = new Uint8Array(n);
	keep[0] = 1;
	keep[n - 1] = 1;
	rdpMarks(points, 0, n - 1, tolerance * tolerance, keep);
	return points.filter((_, i) => keep[i] === 1);
}

/**
 * Closed polygon (closing point not repeated) simplified within `tolerance`. Keeps the first point and
 * the point farthest from it, and simplifies the two halves between them.
 */
export function polygonSimplify(points: readonly Vec[], tolerance = SIMPLIFY_TOLERANCE_MM): Vec[] {
	const n = points.length;
	if (n <= 3) return [...points];
	let far = 1;
	let farD = -1;
	for (let i = 1; i < n; i++) {
		const d = (points[i].x - points[0].x) ** 2 + (points[i].y - points[0].y) ** 2;
		if (d > farD) { farD = d; far = i; }
	}
	const keep = new Uint8Array(n + 1);
	keep[0] = 1;
	keep[far] = 1;
	keep[n] = 1;
	const ring = [...points, points[0]];
	const tol2 = tolerance * tolerance;
	rdpMarks(ring, 0, far, tol2, keep);
	rdpMarks(ring, far, n, tol2, keep);
	const out: Vec[] = [];
	for (let i = 0; i < n; i++) if (keep[i] === 1) out.push(points[i]);
	return out;
}
