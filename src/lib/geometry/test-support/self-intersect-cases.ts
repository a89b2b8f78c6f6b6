import fc from 'fast-check';
import type { ChainHit } from '../intersect';
import type { Segment, Vec } from '../types';

/** Shared by the self-crossing search tests: hits in one order, and outlines on a coarse grid. */

/** Hits as sorted number rows, so two searches' answers compare with toEqual. */
export const hitsCanonical = (hits: readonly ChainHit[]) =>
	hits
		.map((h) => [h.segmentIndex, h.otherSegmentIndex, h.t, h.otherT, h.point.x, h.point.y])
		.sort((a, b) => a[0] - b[0] || a[1] - b[1] || a[2] - b[2] || a[3] - b[3]);

/** A vertex on the integer grid 0 … max. */
export const gridVertex = (max: number) => fc.record({ x: fc.integer({ min: 0, max }), y: fc.integer({ min: 0, max }) });

/**
 * Chains of mixed lines and cubics whose points lie on a 5 mm grid of 9 × 9 points, closing back to
 * their first point (cusps, loops, flat runs, collinear overlaps, touching corners), at least 3 segments.
 */
export function arbCoarseGridSegments(maxLength: number) {
	const seg = fc.record({ curve: fc.boolean(), p1: gridVertex(8), p2: gridVertex(8), p3: gridVertex(8) });
	return fc
		.tuple(gridVertex(8), fc.array(seg, { minLength: 3, maxLength }))
		.map(([start, raw]) => {
			const first: Vec = { x: start.x * 5, y: start.y * 5 };
			const segs: Segment[] = [];
			let p0 = first;
			raw.forEach((s, k) => {
				const p3 = k === raw.length - 1 ? first : { x: s.p3.x * 5, y: s.p3.y * 5 };
				if (p3.x === p0.x && p3.y === p0.y) return;
				segs.push(s.curve ? { kind: 'cubic', p0, p1: { x: s.p1.x * 5, y: s.p1.y * 5 }, p2: { x: s.p2.x * 5, y: s.p2.y * 5 }, p3 } : { kind: 'line', p0, p1: p3 });
				p0 = p3;
			});
			return segs;
		})
		.filter((segs) => segs.length >= 3);
}
