import type { CubicSegment, LineSegment, Segment, Vec } from './types';

/** Construction, evaluation, derivatives, reversal and de Casteljau splitting of one segment. */

export function lineSegment(p0: Vec, p1: Vec): LineSegment {
	return { kind: 'line', p0, p1 };
}

export function cubicSegment(p0: Vec, p1: Vec, p2: Vec, p3: Vec): CubicSegment {
	return { kind: 'cubic', p0, p1, p2, p3 };
}

export function segmentStart(s: Segment): Vec {
	return s.p0;
}

export function segmentEnd(s: Segment): Vec {
	return s.kind === 'line' ? s.p1 : s.p3;
}

/** Control points in order (2 for a line, 4 for a cubic). */
export function segmentControlPoints(s: Segment): readonly Vec[] {
	return s.kind === 'line' ? [s.p0, s.p1] : [s.p0, s.p1, s.p2, s.p3];
}

/** Point at parameter t ∈ [0,1]. */
export function segmentPointAt(s: Segment, t: number): Vec {
	if (s.kind === 'line') {
		return { x: s.p0.x + (s.p1.x - s.p0.x) * t, y: s.p0.y + (s.p1.y - s.p0.y) * t };
	}
	const mt = 1 - t;
	const a = mt * mt * mt;
	const b = 3 * mt * mt * t;
	const c = 3 * mt * t * t;
	const d = t * t * t;
	return {
		x: a * s.p0.x + b * s.p1.x + c * s.p2.x + d * s.p3.x,
		y: a * s.p0.y + b * s.p1.y + c * s.p2.y + d * s.p3.y
	};
}

/** First derivative dB/dt at t (not normalised). */
export function segmentDerivativeAt(s: Segment, t: number): Vec {
	if (s.kind === 'line') return { x: s.p1.x - s.p0.x, y: s.p1.y - s.p0.y };
	const mt = 1 - t;
	const a = 3 * mt * mt;
	const b = 6 * mt * t;
	const c = 3 * t * t;
	return {
		x: a * (s.p1.x - s.p0.x) + b * (s.p2.x - s.p1.x) + c * (s.p3.x - s.p2.x),
		y: a * (s.p1.y - s.p0.y) + b * (s.p2.y - s.p1.y) + c * (s.p3.y - s.p2.y)
	};
}

/** Second derivative d²B/dt² at t. */
export function segmentSecondDerivativeAt(s: Segment, t: number): Vec {
	if (s.kind === 'line') return { x: 0, y: 0 };
	const mt = 1 - t;
	return {
		x: 6 * mt * (s.p2.x - 2 * s.p1.x + s.p0.x) + 6 * t * (s.p3.x - 2 * s.p2.x + s.p1.x),
		y: 6 * mt * (s.p2.y - 2 * s.p1.y + s.p0.y) + 6 * t * (s.p3.y - 2 * s.p2.y + s.p1.y)
	};
}

/**
 * Unit tangent at t, in the direction of travel. Where the derivative vanishes (a control point on
 * its end point, a cusp) the direction of the curve just after (or at t=1 just before) is used.
 */
export function segmentTangentAt(s: Segment, t: number): Vec {
	let d = segmentDerivativeAt(s, t);
	let l = Math.sqrt(d.x * d.x + d.y * d.y);
	if (l < 1e-12 && s.kind === 'cubic') {
		d = segmentSecondDerivativeAt(s, t);
		l = Math.sqrt(d.x * d.x + d.y * d.y);
		if (t >= 1 - 1e-12) {
			// approaching the end: direction of travel is −B'' sign-corrected by geometry
			d = { x: s.p3.x - s.p1.x, y: s.p3.y - s.p1.y };
			l = Math.sqrt(d.x * d.x + d.y * d.y);
		}
		if (l < 1e-12) {
			d = { x: s.p3.x - s.p0.x, y: s.p3.y - s.p0.y };
			l = Math.sqrt(d.x * d.x + d.y * d.y);
		}
	}
	return l === 0 ? { x: 0, y: 0 } : { x: d.x / l, y: d.y / l };
}

/**
 * Unit normal at t: the tangent turned by +90° (from +x toward +y). On an outline of positive signed
 * area (see outlineSignedArea) it points into the piece.
 */
export function segmentNormalAt(s: Segment, t: number): Vec {
	const tg = segmentTangentAt(s, t);
	return { x: -tg.y, y: tg.x };
}

/** The same segment travelled the other way. */
export function segmentReverse(s: Segment): Segment {
	return s.kind === 'line'
		? { kind: 'line', p0: s.p1, p1: s.p0 }
		: { kind: 'cubic', p0: s.p3, p1: s.p2, p2: s.p1, p3: s.p0 };
}

/** Split at t (de Casteljau). Both halves share the split point exactly. */
export function segmentSplitAt(s: Segment, t: number): [Segment, Segment] {
	if (s.kind === 'line') {
		const m = segmentPointAt(s, t);
		return [
			{ kind: 'line', p0: s.p0, p1: m },
			{ kind: 'line', p0: m, p1: s.p1 }
		];
	}
	const lerp = (a: Vec, b: Vec): Vec => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });
	const a = lerp(s.p0, s.p1);
	const b = lerp(s.p1, s.p2);
	const c = lerp(s.p2, s.p3);
	const d = lerp(a, b);
	const e = lerp(b, c);
	const m = lerp(d, e);
	return [
		{ kind: 'cubic', p0: s.p0, p1: a, p2: d, p3: m },
		{ kind: 'cubic', p0: m, p1: e, p2: c, p3: s.p3 }
	];
}

/** The part of a segment between parameters t0 < t1 (re-parametrised to [0,1]). */
export function segmentBetween(s: Segment, t0: number, t1: number): Segment {
	if (t0 <= 0 && t1 >= 1) return s;
	if (s.kind === 'line') {
		return { kind: 'line', p0: t0 <= 0 ? s.p0 : segmentPointAt(s, t0), p1: t1 >= 1 ? s.p1 : segmentPointAt(s, t1) };
	}
	let rest: Segment = s;
	if (t0 > 0) rest = segmentSplitAt(s, t0)[1];
	if (t1 < 1) rest = segmentSplitAt(rest, (t1 - t0) / (1 - t0))[0];
	return rest;
}

/** Copy of a segment with its start point replaced (the rest untouched). */
export function segmentWithStart(s: Segment, p0: Vec): Segment {
	return s.kind === 'line' ? { kind: 'line', p0, p1: s.p1 } : { kind: 'cubic', p0, p1: s.p1, p2: s.p2, p3: s.p3 };
}

/** Copy of a segment with its end point replaced (the rest untouched). */
export function segmentWithEnd(s: Segment, end: Vec): Segment {
	return s.kind === 'line' ? { kind: 'line', p0: s.p0, p1: end } : { kind: 'cubic', p0: s.p0, p1: s.p1, p2: s.p2, p3: end };
}

/** Apply a point map to every control point. */
export function segmentMapPoints(s: Segment, f: (p: Vec) => Vec): Segment {
	return s.kind === 'line'
		? { kind: 'line', p0: f(s.p0), p1: f(s.p1) }
		: { kind: 'cubic', p0: f(s.p0), p1: f(s.p1), p2: f(s.p2), p3: f(s.p3) };
}
