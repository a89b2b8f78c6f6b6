import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineFromPolyline, pathFromPolyline } from './path';
import { outlineSelfIntersections, outlineSelfIntersectionsByGrid } from './self-intersect';
import { monotoneChainPairs } from './self-intersect-chains';
import { touchReach } from './curve-curve';
import type { Outline, Segment, SegmentChain, Vec } from './types';
import { hitsCanonical } from './test-support/self-intersect-cases';

/**
 * The self-crossing search by monotone chains is checked against the general search (a uniform grid
 * over the segments' boxes, every pair whose boxes meet) on outlines too large for brute force: smooth
 * or jagged, crossing or not, snapped polygons, closed and open. Small random outlines are checked
 * against brute force in self-intersect-brute.test.ts.
 */

function expectSameAsGrid(chain: SegmentChain, closed = true): void {
	expect(hitsCanonical(outlineSelfIntersections(chain, closed))).toEqual(hitsCanonical(outlineSelfIntersectionsByGrid(chain, closed)));
}

/** Smooth closed curve through points (Catmull–Rom to cubics), `tension` scaling the handles. */
function curvedThrough(pts: readonly Vec[], tension: number, closed = true): Segment[] {
	const m = pts.length;
	const at = (k: number) => pts[closed ? (k + m) % m : Math.max(0, Math.min(m - 1, k))];
	const segs: Segment[] = [];
	for (let i = 0; i < (closed ? m : m - 1); i++) {
		const p0 = at(i), p3 = at(i + 1), pm = at(i - 1), pn = at(i + 2);
		segs.push({
			kind: 'cubic',
			p0,
			p1: { x: p0.x + ((p3.x - pm.x) * tension) / 6, y: p0.y + ((p3.y - pm.y) * tension) / 6 },
			p2: { x: p3.x - ((pn.x - p0.x) * tension) / 6, y: p3.y - ((pn.y - p0.y) * tension) / 6 },
			p3
		});
	}
	return segs;
}

function radial(n: number, wobble: number, lobes: number, spike: number, phase = 0): Vec[] {
	return Array.from({ length: n }, (_, i) => {
		const a = (2 * Math.PI * i) / n + phase;
		const r = 100 * (1 + wobble * Math.sin(lobes * a)) + (i === Math.floor(n / 3) ? spike : 0);
		return { x: r * Math.cos(a), y: 0.8 * r * Math.sin(a) };
	});
}

const snap = (p: Vec, step: number): Vec => ({ x: Math.round(p.x / step) * step, y: Math.round(p.y / step) * step });

describe('self-crossing search by monotone chains', () => {
	it('gives exactly the crossings of the general search on smooth curved outlines, crossing or not', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 20, max: 400 }),
				fc.double({ min: 0, max: 0.7, noNaN: true }),
				fc.integer({ min: 1, max: 9 }),
				fc.double({ min: 0, max: 250, noNaN: true }),
				fc.double({ min: 0, max: 3, noNaN: true }),
				(n, wobble, lobes, spike, tension) => expectSameAsGrid({ segments: curvedThrough(radial(n, wobble, lobes, spike), tension) })
			),
			{ numRuns: 100, seed: 8 }
		);
	});

	it('gives exactly the crossings of the general search on snapped polygons and on open paths', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 30, max: 300 }),
				fc.double({ min: 0, max: 0.7, noNaN: true }),
				fc.integer({ min: 1, max: 7 }),
				fc.constantFrom(1, 2, 5, 10, 20),
				(n, wobble, lobes, step) => {
					const pts: Vec[] = [];
					for (const p of radial(n, wobble, lobes, 0).map((q) => snap(q, step))) {
						const last = pts[pts.length - 1];
						if (!last || last.x !== p.x || last.y !== p.y) pts.push(p);
					}
					while (pts.length > 1 && pts[0].x === pts[pts.length - 1].x && pts[0].y === pts[pts.length - 1].y) pts.pop();
					fc.pre(pts.length >= 4);
					expectSameAsGrid(outlineFromPolyline(pts));
					expectSameAsGrid(pathFromPolyline(pts), false);
					expectSameAsGrid({ segments: curvedThrough(pts, 1, false) }, false);
				}
			),
			{ numRuns: 150, seed: 12 }
		);
	});

	it('finds a curve that folds back along itself past a shared vertex, as the general search does', () => {
		// a hairpin: one cubic runs right, its neighbour comes back just above it
		const a: Segment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 30, y: 0 }, p2: { x: 70, y: 0 }, p3: { x: 100, y: 0 } };
		const b: Segment = { kind: 'cubic', p0: { x: 100, y: 0 }, p1: { x: 70, y: 0 }, p2: { x: 30, y: 0 }, p3: { x: 0, y: -1e-5 } };
		const c: Segment = { kind: 'line', p0: { x: 0, y: -1e-5 }, p1: { x: -20, y: 40 } };
		const d: Segment = { kind: 'line', p0: { x: -20, y: 40 }, p1: { x: 0, y: 0 } };
		const o: Outline = { segments: [a, b, c, d] };
		expect(outlineSelfIntersections(o).length).toBeGreaterThan(0);
		expectSameAsGrid(o);
	});

	it('follows chains (no grid) on a piece-like outline and leaves a zigzag of many turns to the grid', () => {
		const piece = curvedThrough(radial(3000, 0.04, 5, 0), 1);
		expect(monotoneChainPairs(piece, touchReach(1e-7), true)).not.toBeNull();
		const zigzag = outlineFromPolyline(Array.from({ length: 4000 }, (_, i) => ({ x: 100 * Math.cos((2 * Math.PI * i) / 4000) * (i % 2 ? 1 : 0.98), y: 100 * Math.sin((2 * Math.PI * i) / 4000) * (i % 2 ? 1 : 0.98) })));
		expect(monotoneChainPairs(zigzag.segments, touchReach(1e-7), true)).toBeNull();
		expectSameAsGrid(zigzag);
	});
});
