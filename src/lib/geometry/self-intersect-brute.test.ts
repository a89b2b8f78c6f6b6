import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ChainHit } from './intersect';
import { outlineFromPolyline, pathFromPolyline } from './path';
import { outlineSelfIntersections, outlineSelfIntersectionsByAllPairs, outlineSelfIntersectionsByGrid } from './self-intersect';
import { monotoneChainPairs } from './self-intersect-chains';
import { touchReach } from './curve-curve';
import { arbOutline } from './test-support/arbitraries';
import type { Segment, SegmentChain, Vec } from './types';

/**
 * Both self-crossing searches (monotone chains, the default; and the uniform grid) against brute force:
 * every pair of segments tested (outlineSelfIntersectionsByAllPairs). On random small outlines, with a
 * fixed seed each, all three must report exactly the same crossings. The outlines are made to be hard:
 * vertices on a small integer grid (mostly crossing, with flat runs, collinear overlaps, touching
 * corners, zero-width spikes), star-sorted simple polygons, and mixed lines and cubics, closed and open.
 */

const canonical = (hits: readonly ChainHit[]) =>
	hits
		.map((h) => [h.segmentIndex, h.otherSegmentIndex, h.t, h.otherT, h.point.x, h.point.y])
		.sort((a, b) => a[0] - b[0] || a[1] - b[1] || a[2] - b[2] || a[3] - b[3]);

function expectSameAsBruteForce(chain: SegmentChain, closed = true): void {
	const brute = canonical(outlineSelfIntersectionsByAllPairs(chain, closed));
	expect(canonical(outlineSelfIntersections(chain, closed))).toEqual(brute);
	expect(canonical(outlineSelfIntersectionsByGrid(chain, closed))).toEqual(brute);
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

const gridVertex = (max: number) => fc.record({ x: fc.integer({ min: 0, max }), y: fc.integer({ min: 0, max }) });

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
		const seg = fc.record({ curve: fc.boolean(), p1: gridVertex(8), p2: gridVertex(8), p3: gridVertex(8) });
		fc.assert(
			fc.property(gridVertex(8), fc.array(seg, { minLength: 3, maxLength: 24 }), (start, raw) => {
				const first: Vec = { x: start.x * 5, y: start.y * 5 };
				const segs: Segment[] = [];
				let p0 = first;
				raw.forEach((s, k) => {
					const p3 = k === raw.length - 1 ? first : { x: s.p3.x * 5, y: s.p3.y * 5 };
					if (p3.x === p0.x && p3.y === p0.y) return;
					segs.push(s.curve ? { kind: 'cubic', p0, p1: { x: s.p1.x * 5, y: s.p1.y * 5 }, p2: { x: s.p2.x * 5, y: s.p2.y * 5 }, p3 } : { kind: 'line', p0, p1: p3 });
					p0 = p3;
				});
				fc.pre(segs.length >= 3);
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
