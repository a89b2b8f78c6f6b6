import { vecAdd, vecDistance, vecScale, type CubicSegment, type LineSegment, type Segment, type Vec } from '../../geometry';

/** Small builders for outlines made of lines and cubic Béziers. */

export function line(p0: Vec, p1: Vec): LineSegment {
	return { kind: 'line', p0, p1 };
}

/**
 * A cubic from a to b leaving a along `startDir` and arriving at b along `endDir` (unit vectors,
 * both in the direction of travel); handle lengths are fractions of the chord.
 */
export function cubicByTangents(a: Vec, startDir: Vec, b: Vec, endDir: Vec, startHandle = 0.4, endHandle = 0.4): CubicSegment {
	const chord = vecDistance(a, b);
	return {
		kind: 'cubic',
		p0: a,
		p1: vecAdd(a, vecScale(startDir, chord * startHandle)),
		p2: vecAdd(b, vecScale(endDir, -chord * endHandle)),
		p3: b
	};
}

/** Lines through the points in order (open chain). */
export function polyline(points: readonly Vec[]): LineSegment[] {
	const out: LineSegment[] = [];
	for (let i = 0; i + 1 < points.length; i++) out.push(line(points[i], points[i + 1]));
	return out;
}

export function segmentPoints(segs: readonly Segment[]): Vec[] {
	return segs.map((s) => s.p0);
}
