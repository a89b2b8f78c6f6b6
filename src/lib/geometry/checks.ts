import type { Outline, Vec } from './types';
import { outlineSelfIntersections } from './self-intersect';
import { outlineSelfIntersectionsBetweenParts } from './self-intersect-parts';
import { segmentLength } from './segment-length';
import { segmentEnd } from './segment';
import { CLOSURE_TOLERANCE_MM, INTERSECTION_TOLERANCE_MM, MIN_SEGMENT_LENGTH_MM } from './tolerance';

/** Checks of an outline. They never throw: each returns a list of problems (empty = fine). */

export type OutlineProblemCode = 'empty' | 'not-finite' | 'not-closed' | 'segment-too-short' | 'self-intersection';

export interface OutlineProblem {
	readonly code: OutlineProblemCode;
	readonly message: string;
	readonly segmentIndex?: number;
	readonly point?: Vec;
}

export interface OutlineTolerances {
	/** Largest allowed gap between one segment's end and the next one's start (mm). */
	readonly closure?: number;
	/** Shortest allowed segment (mm). */
	readonly minSegmentLength?: number;
	/** Accuracy of the intersection search (mm). */
	readonly intersection?: number;
}

const fmt = (mm: number): string => (mm >= 0.1 ? `${mm.toFixed(1)} mm` : `${mm.toPrecision(2)} mm`);
const at = (p: Vec): string => `(${p.x.toFixed(1)}, ${p.y.toFixed(1)}) mm`;

/** Segments with a NaN or infinite coordinate. */
export function outlineNonFiniteProblems(outline: Outline): OutlineProblem[] {
	const out: OutlineProblem[] = [];
	const segs = outline.segments;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		// the sum is finite only if every coordinate is (NaN and ±Infinity fail the comparison)
		const sum = s.kind === 'line'
			? Math.abs(s.p0.x) + Math.abs(s.p0.y) + Math.abs(s.p1.x) + Math.abs(s.p1.y)
			: Math.abs(s.p0.x) + Math.abs(s.p0.y) + Math.abs(s.p1.x) + Math.abs(s.p1.y) + Math.abs(s.p2.x) + Math.abs(s.p2.y) + Math.abs(s.p3.x) + Math.abs(s.p3.y);
		if (!(sum < Infinity)) out.push({ code: 'not-finite', segmentIndex: i, message: `Segment ${i + 1} has a point with a missing or infinite coordinate.` });
	}
	return out;
}

/** Gaps between consecutive segments (and from the last back to the first) larger than the tolerance. */
export function outlineClosureProblems(outline: Outline, tolerance = CLOSURE_TOLERANCE_MM): OutlineProblem[] {
	const segs = outline.segments;
	const out: OutlineProblem[] = [];
	for (let i = 0; i < segs.length; i++) {
		const end = segmentEnd(segs[i]);
		const next = segs[(i + 1) % segs.length].p0;
		const gx = end.x - next.x;
		const gy = end.y - next.y;
		if (gx * gx + gy * gy <= tolerance * tolerance) continue;
		const gap = Math.hypot(gx, gy);
		if (!(gap <= tolerance) && Number.isFinite(gap)) {
			const which = i + 1 === segs.length ? 'the outline does not close: the last segment ends' : `segment ${i + 1} ends`;
			out.push({
				code: 'not-closed',
				segmentIndex: i,
				point: end,
				message: `The outline has a gap: ${which} ${fmt(gap)} away from where ${i + 1 === segs.length ? 'the first segment starts' : `segment ${i + 2} starts`}, at ${at(end)}.`
			});
		}
	}
	return out;
}

/** Segments shorter than the minimum length. */
export function outlineShortSegmentProblems(outline: Outline, minLength = MIN_SEGMENT_LENGTH_MM): OutlineProblem[] {
	const out: OutlineProblem[] = [];
	const segs = outline.segments;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		// a curve is at least as long as its chord: it is measured only when the chord is short
		const end = segmentEnd(s);
		const cx = end.x - s.p0.x;
		const cy = end.y - s.p0.y;
		if (cx * cx + cy * cy >= minLength * minLength) continue;
		const l = segmentLength(s);
		if (l < minLength) {
			out.push({
				code: 'segment-too-short',
				segmentIndex: i,
				point: s.p0,
				message: `Segment ${i + 1} at ${at(s.p0)} is only ${fmt(l)} long (shorter than ${fmt(minLength)}); remove it or merge it with its neighbour.`
			});
		}
	}
	return out;
}

/**
 * Places where the outline crosses or touches itself. With `cleanParts` (segment i's part, or −1) the
 * segments of one part are taken to be free of crossings among themselves and only pairs across parts
 * (and the segments of no part) are searched: outlineSelfIntersectionsBetweenParts.
 */
export function outlineSelfIntersectionProblems(outline: Outline, tolerance = INTERSECTION_TOLERANCE_MM, cleanParts?: ArrayLike<number>): OutlineProblem[] {
	const hits = cleanParts ? outlineSelfIntersectionsBetweenParts(outline, cleanParts, true, tolerance) : outlineSelfIntersections(outline, true, tolerance);
	return hits.map((h) => ({
		code: 'self-intersection' as const,
		segmentIndex: h.segmentIndex,
		point: h.point,
		message:
			h.segmentIndex === h.otherSegmentIndex
				? `Segment ${h.segmentIndex + 1} loops over itself at ${at(h.point)}.`
				: `The outline crosses itself at ${at(h.point)} (segments ${h.segmentIndex + 1} and ${h.otherSegmentIndex + 1}).`
	}));
}

/** What outlineProblems searches (see there). */
export interface OutlineCheckOptions {
	readonly selfIntersection?: boolean;
	readonly cleanParts?: ArrayLike<number>;
}

/**
 * Every problem of an outline: empty, non-finite coordinates, not closed, too-short segments,
 * self-intersections. Never throws. Non-finite outlines are not checked further.
 * `selfIntersection: false` leaves out the crossing search (for parts whose construction already rules
 * crossings out). `cleanParts` names, for each segment, a part known to be free of crossings on its own
 * (or −1): the crossing search then tests only pairs across parts (outlineSelfIntersectionsBetweenParts);
 * without it every pair is searched.
 */
export function outlineProblems(outline: Outline, tolerances: OutlineTolerances = {}, options: OutlineCheckOptions = {}): OutlineProblem[] {
	if (outline.segments.length === 0) return [{ code: 'empty', message: 'The outline has no segments.' }];
	const closure = tolerances.closure ?? CLOSURE_TOLERANCE_MM;
	const minLength = tolerances.minSegmentLength ?? MIN_SEGMENT_LENGTH_MM;
	const intersection = tolerances.intersection ?? INTERSECTION_TOLERANCE_MM;
	const crossings = (): OutlineProblem[] => (options.selfIntersection === false ? [] : outlineSelfIntersectionProblems(outline, intersection, options.cleanParts));
	if (plainlyClean(outline, closure, minLength)) return crossings();
	const nonFinite = outlineNonFiniteProblems(outline);
	if (nonFinite.length > 0) return nonFinite;
	return [...outlineClosureProblems(outline, closure), ...outlineShortSegmentProblems(outline, minLength), ...crossings()];
}

/**
 * One lean pass that answers true only when the single checks would find nothing: every coordinate
 * finite, every gap within the closure tolerance, every chord at least the shortest length (a curve is
 * at least as long as its chord). Anything else goes through the single checks, for their messages.
 */
function plainlyClean(outline: Outline, closure: number, minLength: number): boolean {
	const segs = outline.segments;
	const n = segs.length;
	const gap2 = closure * closure;
	const min2 = minLength * minLength;
	for (let i = 0; i < n; i++) {
		const s = segs[i];
		const end = s.kind === 'line' ? s.p1 : s.p3;
		const next = segs[i + 1 === n ? 0 : i + 1].p0;
		const gx = end.x - next.x;
		const gy = end.y - next.y;
		const cx = end.x - s.p0.x;
		const cy = end.y - s.p0.y;
		// written so that NaN and ±Infinity fail
		if (!(gx * gx + gy * gy <= gap2) || !(cx * cx + cy * cy >= min2 && cx * cx + cy * cy < Infinity)) return false;
		if (s.kind === 'cubic' && !(Math.abs(s.p1.x) + Math.abs(s.p1.y) + Math.abs(s.p2.x) + Math.abs(s.p2.y) < Infinity)) return false;
	}
	return true;
}
