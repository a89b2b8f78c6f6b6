import type { Outline, Path, Segment, Vec } from './types';

/**
 * Rigid transforms of points, segments, outlines and paths.
 * Positive rotation angle = from +x toward +y (clockwise on a y-down screen).
 * Mirroring reverses the orientation (sign of the signed area); segment order is kept.
 */

type PointMap = (p: Vec) => Vec;

function mapSegments(segs: readonly Segment[], f: PointMap): Segment[] {
	const out = new Array<Segment>(segs.length);
	// shared point objects (one segment's end === next one's start) are mapped once and stay shared
	let lastIn: Vec | null = null;
	let lastOut: Vec | null = null;
	const m = (p: Vec): Vec => {
		if (p === lastIn) return lastOut as Vec;
		return f(p);
	};
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		if (s.kind === 'line') {
			const p0 = m(s.p0);
			const p1 = f(s.p1);
			lastIn = s.p1;
			lastOut = p1;
			out[i] = { kind: 'line', p0, p1 };
		} else {
			const p0 = m(s.p0);
			const p3 = f(s.p3);
			out[i] = { kind: 'cubic', p0, p1: f(s.p1), p2: f(s.p2), p3 };
			lastIn = s.p3;
			lastOut = p3;
		}
	}
	return out;
}

function rotation(center: Vec, angle: number): PointMap {
	const c = Math.cos(angle);
	const s = Math.sin(angle);
	const cx = center.x;
	const cy = center.y;
	return (p) => {
		const dx = p.x - cx;
		const dy = p.y - cy;
		return { x: cx + c * dx - s * dy, y: cy + s * dx + c * dy };
	};
}

function translation(d: Vec): PointMap {
	const dx = d.x;
	const dy = d.y;
	return (p) => ({ x: p.x + dx, y: p.y + dy });
}

/** Reflection across the infinite line through a and b (a ≠ b). */
function mirror(a: Vec, b: Vec): PointMap {
	const ux0 = b.x - a.x;
	const uy0 = b.y - a.y;
	const l = Math.sqrt(ux0 * ux0 + uy0 * uy0);
	const ux = ux0 / l;
	const uy = uy0 / l;
	return (p) => {
		const dx = p.x - a.x;
		const dy = p.y - a.y;
		const k = 2 * (dx * ux + dy * uy);
		return { x: a.x + k * ux - dx, y: a.y + k * uy - dy };
	};
}

// ---- points
/** p' = center + R(angle)(p − center). */
export function pointRotateAbout(p: Vec, center: Vec, angle: number): Vec {
	return rotation(center, angle)(p);
}
export function pointTranslate(p: Vec, offset: Vec): Vec {
	return { x: p.x + offset.x, y: p.y + offset.y };
}
/** Mirror image of p across the line through a and b. */
export function pointMirrorAcross(p: Vec, a: Vec, b: Vec): Vec {
	return mirror(a, b)(p);
}
export function pointsRotateAbout(points: readonly Vec[], center: Vec, angle: number): Vec[] {
	return points.map(rotation(center, angle));
}
export function pointsTranslate(points: readonly Vec[], offset: Vec): Vec[] {
	return points.map(translation(offset));
}
export function pointsMirrorAcross(points: readonly Vec[], a: Vec, b: Vec): Vec[] {
	return points.map(mirror(a, b));
}

// ---- segments
export function segmentRotateAbout(s: Segment, center: Vec, angle: number): Segment {
	return mapSegments([s], rotation(center, angle))[0];
}
export function segmentTranslate(s: Segment, offset: Vec): Segment {
	return mapSegments([s], translation(offset))[0];
}
export function segmentMirrorAcross(s: Segment, a: Vec, b: Vec): Segment {
	return mapSegments([s], mirror(a, b))[0];
}

// ---- outlines
export function outlineRotateAbout(o: Outline, center: Vec, angle: number): Outline {
	return { segments: mapSegments(o.segments, rotation(center, angle)) };
}
export function outlineTranslate(o: Outline, offset: Vec): Outline {
	return { segments: mapSegments(o.segments, translation(offset)) };
}
/** Mirror across the line through a and b; the signed area changes sign. */
export function outlineMirrorAcross(o: Outline, a: Vec, b: Vec): Outline {
	return { segments: mapSegments(o.segments, mirror(a, b)) };
}

// ---- paths
export function pathRotateAbout(p: Path, center: Vec, angle: number): Path {
	return { segments: mapSegments(p.segments, rotation(center, angle)) };
}
export function pathTranslate(p: Path, offset: Vec): Path {
	return { segments: mapSegments(p.segments, translation(offset)) };
}
export function pathMirrorAcross(p: Path, a: Vec, b: Vec): Path {
	return { segments: mapSegments(p.segments, mirror(a, b)) };
}
