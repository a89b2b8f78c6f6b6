import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineFromPolyline, pathFromPolyline } from './path';
import { outlineSelfIntersections, outlineSelfIntersectionsByAllPairs, outlineSelfIntersectionsByGrid } from './self-intersect';
import { monotoneChainPairs } from './self-intersect-chains';
import { touchReach } from './curve-curve';
import { arbOutline } from './test-support/arbitraries';
import { arbCoarseGridSegments, gridVertex, hitsCanonical } from './test-support/self-intersect-cases';
import type { Segment, SegmentChain, Vec } from './types';

/**
 * Both self-crossing searches (monotone chains, the default; and the uniform grid) against brute force:
 * every pair of segments tested (outlineSelfIntersectionsByAllPairs). On random small outlines, with a
 * fixed seed each, all three must report exactly the same crossings. The outlines are made to be hard:
 * vertices on a small integer grid (mostly crossing, with flat runs, collinear overlaps, touching
 * corners, zero-width spikes), star-sorted simple polygons, and mixed lines and cubics, closed and open.
 */

function expectSameAsBruteForce(chain: SegmentChain, closed = true): void {
	const brute = hitsCanonical(outlineSelfIntersectionsByAllPairs(chain, closed));
	expect(hitsCanonical(outlineSelfIntersections(chain, closed))).toEqual(brute);
	expect(hitsCanonical(outlineSelfIntersectionsByGrid(chain, closed))).toEqual(brute);
}

/** Points with repeats (and a repeated closing point) dropped. */
function distinct(pts: readonly Vec[]): Vec[] {
	const out: Vec[] = [];
	for (const p of pts) {
		const last = out[out.length - 1];
		if (!last || last.x !== p.x || last.y !== p.y) out.push(p);
	}
	while (out.length > 1 && out[0].x === out[out.length - 1].x && out[0].y === out[out.length - 1].y) out.pop();
	return out;
}

describe('self-crossing search against brute force (every pair of segments)', () => {
	it('gives exactly the brute-force crossings on small random outlines of lines and cubics', () => {
		fc.assert(
			fc.property(arbOutline, (o) => expectSameAsBruteForce(o)),
			{ numRuns: 300, seed: 31 }
		);
	});

	it('gives exactly the brute-force crossings on random polygons on a small integer grid (mostly crossing, many collinear and touching), closed and open', () => {
		fc.assert(
			fc.property(fc.array(gridVertex(12), { minLength: 4, maxLength: 40 }), (raw) => {
				const pts = distinct(raw.map((p) => ({ x: p.x * 5, y: p.y * 5 })));
				fc.pre(pts.length >= 4);
				expectSameAsBruteForce(outlineFromPolyline(pts));
				expectSameAsBruteForce(pathFromPolyline(pts), false);
			}),
			{ numRuns: 400, seed: 3 }
		);
	});

	it('gives exactly the brute-force crossings on polygons made by sorting random points around their centre (simple but for points on one ray)', () => {
		const vertex = fc.record({ x: fc.integer({ min: -40, max: 40 }), y: fc.integer({ min: -40, max: 40 }) });
		fc.assert(
			fc.property(fc.uniqueArray(vertex, { minLength: 5, maxLength: 60, selector: (p) => `${p.x},${p.y}` }), (raw) => {
				const pts = raw
					.filter((p) => p.x !== 0 || p.y !== 0)
					.sort((p, q) => Math.atan2(p.y, p.x) - Math.atan2(q.y, q.x) || Math.hypot(p.x, p.y) - Math.hypot(q.x, q.y));
				fc.pre(pts.length >= 4);
				expectSameAsBruteForce(outlineFromPolyline(pts));
			}),
			{ numRuns: 300, seed: 9 }
		);
	});

	it('gives exactly the brute-force crossings on mixed lines and cubics whose points lie on a coarse grid (cusps, loops, overlaps)', () => {
		fc.assert(
			fc.property(arbCoarseGridSegments(24), (segs) => {
				expectSameAsBruteForce({ segments: segs });
				expectSameAsBruteForce({ segments: segs }, false);
			}),
			{ numRuns: 300, seed: 17 }
		);
	});

	it('finds two corners of a stepped outline that touch', () => {
		// two squares meeting corner to corner at (10, 10), travelled as one outline
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 10, y: 0 },
			{ x: 10, y: 10 },
			{ x: 20, y: 10 },
			{ x: 20, y: 20 },
			{ x: 10, y: 20 },
			{ x: 10, y: 10 },
			{ x: 0, y: 10 }
		]);
		expect(outlineSelfIntersections(o).some((h) => Math.hypot(h.point.x - 10, h.point.y - 10) < 1e-9)).toBe(true);
		expectSameAsBruteForce(o);
	});

	it('finds a flat run that doubles back over an earlier one', () => {
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 30, y: 0 },
			{ x: 30, y: 10 },
			{ x: 20, y: 10 },
			{ x: 20, y: 0 },
			{ x: 10, y: 0 },
			{ x: 10, y: -10 },
			{ x: 0, y: -10 }
		]);
		expect(outlineSelfIntersections(o).length).toBeGreaterThan(0);
		expectSameAsBruteForce(o);
	});

	it('finds a zero-width spike (a segment turning straight back along the one before it)', () => {
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 40, y: 0 },
			{ x: 40, y: 40 },
			{ x: 20, y: 40 },
			{ x: 20, y: 60 },
			{ x: 20, y: 50 },
			{ x: 0, y: 40 }
		]);
		expect(outlineSelfIntersections(o).length).toBeGreaterThan(0);
		expectSameAsBruteForce(o);
	});

	it('follows chains along x for a comb whose teeth turn in y but run on in x, and finds its crossing', () => {
		const pts: Vec[] = [];
		for (let i = 0; i < 100; i++) pts.push({ x: i * 2, y: 0 }, { x: i * 2 + 1, y: 30 });
		pts.push({ x: 200, y: 40 }, { x: -5, y: 40 }, { x: 1.5, y: -5 });
		const o = outlineFromPolyline(pts);
		expect(monotoneChainPairs(o.segments, touchReach(1e-7), true)).not.toBeNull();
		expect(outlineSelfIntersections(o).length).toBeGreaterThan(0);
		expectSameAsBruteForce(o);
	});
});
