/**
 * Core data of the geometry kernel. Units: millimetres. Axes: x right, y DOWN (canvas convention).
 * Angles: radians. All data is readonly: functions return new values, never mutate.
 */
export interface Vec {
	readonly x: number;
	readonly y: number;
}

/** A straight segment from p0 to p1. */
export interface LineSegment {
	readonly kind: 'line';
	readonly p0: Vec;
	readonly p1: Vec;
}

/** A cubic Bézier from p0 to p3 with control points p1, p2. */
export interface CubicSegment {
	readonly kind: 'cubic';
	readonly p0: Vec;
	readonly p1: Vec;
	readonly p2: Vec;
	readonly p3: Vec;
}

export type Segment = LineSegment | CubicSegment;

/**
 * A closed outline: segments in order, each one's end equal to the next one's start, the last
 * one's end equal to the first one's start (within the closure tolerance).
 */
export interface Outline {
	readonly segments: readonly Segment[];
}

/** An open path (style lines, slash lines, internal lines): same segments, not closed. */
export interface Path {
	readonly segments: readonly Segment[];
}

export interface BoundingBox {
	readonly minX: number;
	readonly minY: number;
	readonly maxX: number;
	readonly maxY: number;
}

/** A place on an outline or path: segment index and curve parameter t ∈ [0,1] on that segment. */
export interface SegmentLocation {
	readonly segmentIndex: number;
	readonly t: number;
}

/** A place on an outline or path together with the point there. */
export interface PointOnPath extends SegmentLocation {
	readonly point: Vec;
}

/** Anything made of segments in order: an Outline (closed) or a Path (open). */
export type SegmentChain = Outline | Path;
