/**
 * Every tolerance of the geometry kernel, in one place. Lengths in millimetres.
 * Functions that use one take it as an optional argument defaulting to the constant here.
 */

/** Two points closer than this are the same point (snapping chain ends, closing outlines). */
export const POINT_TOLERANCE_MM = 1e-6;

/** An outline whose consecutive segment ends are further apart than this is "not closed" (checks). */
export const CLOSURE_TOLERANCE_MM = 1e-3;

/** Segments shorter than this are reported as "too short" by the checks. */
export const MIN_SEGMENT_LENGTH_MM = 0.01;

/** Relative accuracy asked of adaptive Gauss–Legendre arc length. */
export const LENGTH_RELATIVE_TOLERANCE = 1e-10;

/** A curve parameter t this close to 0 or 1 is treated as the end point of its segment. */
export const PARAMETER_TOLERANCE = 1e-9;

/** A distance this small (mm) counts as zero when solving for roots / intersections. */
export const ROOT_TOLERANCE_MM = 1e-9;

/** Cubic–cubic intersection: subdivide until both pieces are smaller than this, then refine by Newton. */
export const INTERSECTION_TOLERANCE_MM = 1e-7;

/** Default flattening tolerance for drawing (maximum distance between curve and polyline). */
export const FLATTEN_TOLERANCE_MM = 0.05;

/** Default Ramer–Douglas–Peucker tolerance (before offsets). */
export const SIMPLIFY_TOLERANCE_MM = 0.01;
