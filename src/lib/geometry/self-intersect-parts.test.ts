import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ChainHit } from './intersect';
import { outlineFromPolyline } from './path';
import { outlineSelfIntersections, outlineSelfIntersectionsByAllPairs } from './self-intersect';
import { outlineSelfIntersectionsBetweenParts } from './self-intersect-parts';
import { arbCoarseGridSegments, hitsCanonical } from './test-support/self-intersect-cases';
import { pointRotateAbout } from './transform';
import type { SegmentChain, Vec } from './types';

/**
 * The search between parts against brute force (every pair of segments) restricted to what it promises:
 * every pair except two segments of one part, and the loops of segments in no part. Random labels, random
 * crossing-heavy outlines, fixed seeds.
 */

function bruteRestricted(chain: SegmentChain, partOf: readonly number[], closed = true): ChainHit[] {
	return outlineSelfIntersectionsByAllPairs(chain, closed).filter((h) => partOf[h.segmentIndex] < 0 || partOf[h.segmentIndex] !== partOf[h.otherSegmentIndex]);
}

function expectSameAsRestrictedBruteForce(chain: SegmentChain, partOf: readonly number[], closed = true): void {
	expect(hitsCanonical(outlineSelfIntersectionsBetweenParts(chain, partOf, closed))).toEqual(hitsCanonical(bruteRestricted(chain, partOf, closed)));
}

/** A wavy ring of n corners. */
function ring(n: number, cx = 0, cy = 0): Vec[] {
	return Array.from({ length: n }, (_, i) => {
		const a = (2 * Math.PI * i) / n;
		const r = 100 * (1 + 0.05 * Math.sin(9 * a));
		return { x: cx + r * Math.cos(a), y: cy + r * Math.sin(a) };
	});
}

describe('self-crossing search between parts known to be clean', () => {
	it('gives exactly the brute-force crossings across parts on mixed lines and cubics on a coarse grid, with random part labels', () => {
		fc.assert(
			fc.property(
				arbCoarseGridSegments(24).chain((segs) =>
					fc.tuple(fc.constant(segs), fc.array(fc.integer({ min: -1, max: 3 }), { minLength: segs.length, maxLength: segs.length }))
				),
				([segs, labels]) => {
					expectSameAsRestrictedBruteForce({ segments: segs }, labels);
					expectSameAsRestrictedBruteForce({ segments: segs }, labels, false);
				}
			),
			{ numRuns: 300, seed: 23 }
		);
	});

	it('gives exactly the brute-force crossings across parts on a ring of 300 corners cut into runs, a stretch turned about a corner', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 1, max: 298 }),
				fc.integer({ min: 1, max: 298 }),
				fc.double({ min: -0.6, max: 0.6, noNaN: true }),
				(a, b, angleRad) => {
					const [from, to] = a < b ? [a, b] : [b, a];
					fc.pre(to - from >= 2);
					const pts = ring(300);
					const centre = pts[from];
					// the stretch from … to turns about its first corner; the segments at its far end join it to the rest
					const turned = pts.map((p, i) => (i > from && i <= to ? pointRotateAbout(p, centre, angleRad) : p));
					const labels = turned.map((_, i) => (i < from ? 0 : i < to ? 1 : i === to ? -1 : 2));
					expectSameAsRestrictedBruteForce(outlineFromPolyline(turned), labels);
				}
			),
			{ numRuns: 60, seed: 5 }
		);
	});

	it('finds a turned side crossing the still side, as the full search does', () => {
		// a ring whose stretch 10 … 60 is turned 0.3 rad about the centre, onward along the ring: its end runs
		// over the still stretch after it
		const pts = ring(200);
		const turned = pts.map((p, i) => (i > 10 && i <= 60 ? pointRotateAbout(p, { x: 0, y: 0 }, 0.3) : p));
		const labels = turned.map((_, i) => (i === 10 || i === 60 ? -1 : i > 10 && i < 60 ? 1 : 0));
		const o = outlineFromPolyline(turned);
		const hits = outlineSelfIntersectionsBetweenParts(o, labels);
		expect(hits.some((h) => labels[h.segmentIndex] === 1 && labels[h.otherSegmentIndex] === 0)).toBe(true);
		expect(hitsCanonical(hits)).toEqual(hitsCanonical(outlineSelfIntersections(o)));
	});

	it('finds a long straight segment of no part crossing a part far from its ends', () => {
		// a long diagonal chord (no part) runs across a thin finger of part 0 in the middle of the outline
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 1000, y: 0 },
			{ x: 1000, y: 1000 },
			{ x: 520, y: 1000 },
			{ x: 520, y: 400 },
			{ x: 480, y: 400 },
			{ x: 480, y: 1000 },
			{ x: 0, y: 1000 },
			{ x: 900, y: 50 }
		]);
		const labels = [0, 0, 0, 0, 0, 0, 0, -1, -1];
		const hits = outlineSelfIntersectionsBetweenParts(o, labels);
		expect(hits.length).toBeGreaterThan(0);
		expectSameAsRestrictedBruteForce(o, labels);
	});

	it('leaves out crossings within one part, and with every segment in no part is the full search', () => {
		// a bow tie: its two crossing segments in one part are not searched; in no part they are
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 10, y: 10 },
			{ x: 10, y: 0 },
			{ x: 0, y: 10 }
		]);
		expect(outlineSelfIntersectionsBetweenParts(o, [0, 0, 0, 0])).toEqual([]);
		expect(hitsCanonical(outlineSelfIntersectionsBetweenParts(o, [-1, -1, -1, -1]))).toEqual(hitsCanonical(outlineSelfIntersections(o)));
	});
});
