import type { Outline, PointOnPath, SegmentChain, SegmentLocation, Vec } from './types';
import { segmentLength, segmentParameterAtLength } from './segment-length';
import { segmentNormalAt, segmentPointAt, segmentTangentAt } from './segment';

/** Lengths along outlines and paths, measured on the true curves. */

/** Total length of an outline or path (mm). Lines summed without allocation. */
export function pathLength(chain: SegmentChain): number {
	const segs = chain.segments;
	let total = 0;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		if (s.kind === 'line') {
			const dx = s.p1.x - s.p0.x;
			const dy = s.p1.y - s.p0.y;
			total += Math.sqrt(dx * dx + dy * dy);
		} else {
			total += segmentLength(s);
		}
	}
	return total;
}

/** Perimeter of a closed outline (mm). */
export function outlinePerimeter(outline: Outline): number {
	return pathLength(outline);
}

/** Length of every segment, in order. */
export function pathSegmentLengths(chain: SegmentChain): number[] {
	return chain.segments.map((s) => segmentLength(s));
}

/** Arc length from the start of the chain to a location (segment index, t). */
export function pathLengthAt(chain: SegmentChain, at: SegmentLocation): number {
	let total = 0;
	const segs = chain.segments;
	for (let i = 0; i < at.segmentIndex && i < segs.length; i++) total += segmentLength(segs[i]);
	if (at.segmentIndex < segs.length) total += segmentLength(segs[at.segmentIndex], 0, at.t);
	return total;
}

/**
 * Location and point at arc length `length` from the start (clamped to the chain). For outlines,
 * `length` is not wrapped: pass `length % outlinePerimeter(o)` to go round.
 */
export function pathPointAtLength(chain: SegmentChain, length: number): PointOnPath {
	const segs = chain.segments;
	if (segs.length === 0) return { segmentIndex: -1, t: 0, point: { x: NaN, y: NaN } };
	if (length <= 0) return { segmentIndex: 0, t: 0, point: segs[0].p0 };
	let rest = length;
	for (let i = 0; i < segs.length; i++) {
		const l = segmentLength(segs[i]);
		if (rest <= l || i === segs.length - 1) {
			const t = segmentParameterAtLength(segs[i], rest, l);
			return { segmentIndex: i, t, point: segmentPointAt(segs[i], t) };
		}
		rest -= l;
	}
	/* c8 ignore next */
	return { segmentIndex: segs.length - 1, t: 1, point: segmentPointAt(segs[segs.length - 1], 1) };
}

/** Point at a location. */
export function pathPointAt(chain: SegmentChain, at: SegmentLocation): Vec {
	return segmentPointAt(chain.segments[at.segmentIndex], at.t);
}

/** Unit tangent (direction of travel) at a location. */
export function pathTangentAt(chain: SegmentChain, at: SegmentLocation): Vec {
	return segmentTangentAt(chain.segments[at.segmentIndex], at.t);
}

/** Unit normal (tangent turned +90°; inward on an outline of positive signed area) at a location. */
export function pathNormalAt(chain: SegmentChain, at: SegmentLocation): Vec {
	return segmentNormalAt(chain.segments[at.segmentIndex], at.t);
}

export const outlineLengthAt = pathLengthAt;
export const outlinePointAtLength = pathPointAtLength;
