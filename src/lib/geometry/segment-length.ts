import type { Segment } from './types';
import { LENGTH_RELATIVE_TOLERANCE } from './tolerance';

/** Arc length of segments: closed form for lines, adaptive Gauss–Legendre (16 points) for cubics. */

// 16-point Gauss–Legendre nodes/weights on [-1,1] (positive half; symmetric).
const GL_X = [
	0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438, 0.755404408355003,
	0.8656312023878318, 0.9445750230732326, 0.9894009349916499
];
const GL_W = [
	0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165767, 0.1246289712555339,
	0.0951585116824928, 0.0622535239386479, 0.0271524594117541
];

/** |B'(t)| of a cubic given by its difference vectors (allocation-free). */
function speed(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, t: number): number {
	const mt = 1 - t;
	const k0 = 3 * mt * mt;
	const k1 = 6 * mt * t;
	const k2 = 3 * t * t;
	const dx = k0 * ax + k1 * bx + k2 * cx;
	const dy = k0 * ay + k1 * by + k2 * cy;
	return Math.sqrt(dx * dx + dy * dy);
}

function glOn(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, a: number, b: number): number {
	const h = 0.5 * (b - a);
	const m = 0.5 * (a + b);
	let sum = 0;
	for (let i = 0; i < 8; i++) {
		const dx = h * GL_X[i];
		sum += GL_W[i] * (speed(ax, ay, bx, by, cx, cy, m - dx) + speed(ax, ay, bx, by, cx, cy, m + dx));
	}
	return sum * h;
}

function adaptive(
	ax: number, ay: number, bx: number, by: number, cx: number, cy: number,
	a: number, b: number, whole: number, absTol: number, depth: number
): number {
	const m = 0.5 * (a + b);
	const left = glOn(ax, ay, bx, by, cx, cy, a, m);
	const right = glOn(ax, ay, bx, by, cx, cy, m, b);
	const both = left + right;
	if (depth >= 40 || Math.abs(both - whole) <= absTol) return both;
	return (
		adaptive(ax, ay, bx, by, cx, cy, a, m, left, absTol * 0.5, depth + 1) +
		adaptive(ax, ay, bx, by, cx, cy, m, b, right, absTol * 0.5, depth + 1)
	);
}

/**
 * Arc length of a segment between parameters t0 and t1 (default the whole segment).
 * Cubics: adaptive Gauss–Legendre, relative accuracy `relativeTolerance` of the control polygon length.
 */
export function segmentLength(s: Segment, t0 = 0, t1 = 1, relativeTolerance = LENGTH_RELATIVE_TOLERANCE): number {
	if (s.kind === 'line') {
		const dx = s.p1.x - s.p0.x;
		const dy = s.p1.y - s.p0.y;
		return Math.sqrt(dx * dx + dy * dy) * Math.abs(t1 - t0);
	}
	if (t1 === t0) return 0;
	if (t1 < t0) return segmentLength(s, t1, t0, relativeTolerance);
	const ax = s.p1.x - s.p0.x, ay = s.p1.y - s.p0.y;
	const bx = s.p2.x - s.p1.x, by = s.p2.y - s.p1.y;
	const cx = s.p3.x - s.p2.x, cy = s.p3.y - s.p2.y;
	const poly = Math.sqrt(ax * ax + ay * ay) + Math.sqrt(bx * bx + by * by) + Math.sqrt(cx * cx + cy * cy);
	if (poly === 0) return 0;
	const absTol = Math.max(poly * relativeTolerance * (t1 - t0), 1e-15);
	const whole = glOn(ax, ay, bx, by, cx, cy, t0, t1);
	return adaptive(ax, ay, bx, by, cx, cy, t0, t1, whole, absTol, 0);
}

/** Arc length from the start of the segment to parameter t. */
export function segmentLengthAt(s: Segment, t: number): number {
	return segmentLength(s, 0, t);
}

/**
 * Parameter t at which the arc length from the start equals `length` (clamped to [0,1]).
 * Safeguarded Newton on s(t) − length.
 */
export function segmentParameterAtLength(s: Segment, length: number, total = segmentLength(s)): number {
	if (length <= 0) return 0;
	if (length >= total) return 1;
	if (s.kind === 'line') return total === 0 ? 0 : length / total;
	let lo = 0;
	let hi = 1;
	let t = length / total;
	for (let i = 0; i < 60; i++) {
		const f = segmentLength(s, 0, t) - length;
		if (Math.abs(f) <= total * 1e-12) return t;
		if (f > 0) hi = t;
		else lo = t;
		const d = segmentDerivativeSpeed(s, t);
		let next = d > 0 ? t - f / d : NaN;
		if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
		if (hi - lo < 1e-15) return next;
		t = next;
	}
	return t;
}

function segmentDerivativeSpeed(s: Segment, t: number): number {
	if (s.kind === 'line') return Math.hypot(s.p1.x - s.p0.x, s.p1.y - s.p0.y);
	return speed(s.p1.x - s.p0.x, s.p1.y - s.p0.y, s.p2.x - s.p1.x, s.p2.y - s.p1.y, s.p3.x - s.p2.x, s.p3.y - s.p2.y, t);
}
