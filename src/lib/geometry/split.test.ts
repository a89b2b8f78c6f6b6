import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineSignedArea } from './outline-area';
import { outlinePerimeter, pathLength, pathLengthAt, pathPointAtLength } from './outline-length';
import { outlineFromChains, outlineFromPolyline, outlineReverse, pathConcat, pathEnd, pathFromPolyline, pathReverse, pathStart } from './path';
import { segmentLength } from './segment-length';
import { segmentEnd, segmentPointAt, segmentSplitAt } from './segment';
import { locationsSortAlong, outlineBetween, outlineSplitAt, pathBetween, pathSplitAt } from './split';
import type { CubicSegment, SegmentLocation } from './types';
import { vecDistance } from './vec';
import { arbOutline, bezierCircle } from './test-support/arbitraries';

const arbLocations = fc.array(
	fc.record({ segmentIndex: fc.nat(11), t: fc.double({ min: 0, max: 1, noNaN: true }) }),
	{ minLength: 1, maxLength: 5 }
);

describe('splitting', () => {
	it('de Casteljau halves meet exactly, trace the same curve and add up to its length', () => {
		const c: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 30, y: 80 }, p2: { x: 90, y: -40 }, p3: { x: 120, y: 10 } };
		for (const t of [0.1, 0.37, 0.5, 0.93]) {
			const [a, b] = segmentSplitAt(c, t);
			expect(segmentEnd(a)).toBe(b.p0);
			expect(vecDistance(segmentEnd(a), segmentPointAt(c, t))).toBeLessThan(1e-12);
			expect(vecDistance(segmentPointAt(a, 0.5), segmentPointAt(c, t / 2))).toBeLessThan(1e-10);
			expect(vecDistance(segmentPointAt(b, 0.5), segmentPointAt(c, t + (1 - t) / 2))).toBeLessThan(1e-10);
			expect(segmentLength(a) + segmentLength(b)).toBeCloseTo(segmentLength(c), 9);
		}
	});

	it('cutting an outline into chains keeps total length; chains join end to start and rejoin to the same area', () => {
		fc.assert(
			fc.property(arbOutline, arbLocations, (o, locs0) => {
				const locs = locs0.map((l) => ({ segmentIndex: l.segmentIndex % o.segments.length, t: l.t }));
				const chains = outlineSplitAt(o, locs);
				const sorted = locationsSortAlong(o, locs, true);
				expect(chains.length).toBe(sorted.length);
				const total = chains.reduce((s, c) => s + pathLength(c), 0);
				expect(total).toBeCloseTo(outlinePerimeter(o), 6);
				for (let i = 0; i < chains.length; i++) {
					const next = chains[(i + 1) % chains.length];
					expect(vecDistance(pathEnd(chains[i])!, pathStart(next)!)).toBeLessThan(1e-9);
				}
				const back = outlineFromChains(chains);
				expect(outlineSignedArea(back)).toBeCloseTo(outlineSignedArea(o), 5);
			}),
			{ numRuns: 100 }
		);
	});

	it('sub-path between two locations has the length between them, forward and wrapping', () => {
		const o = bezierCircle({ x: 0, y: 0 }, 100);
		const from: SegmentLocation = { segmentIndex: 3, t: 0.5 };
		const to: SegmentLocation = { segmentIndex: 1, t: 0.25 };
		const per = outlinePerimeter(o);
		const wrapped = outlineBetween(o, from, to);
		const expected = per - pathLengthAt(o, from) + pathLengthAt(o, to);
		expect(pathLength(wrapped)).toBeCloseTo(expected, 8);
		const forward = outlineBetween(o, to, from);
		expect(pathLength(forward) + pathLength(wrapped)).toBeCloseTo(per, 8);
		expect(vecDistance(pathStart(forward)!, pathEnd(wrapped)!)).toBe(0);
	});

	it('open path: split into k+1 pieces, sub-path backwards is the reverse', () => {
		const p = pathFromPolyline([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 20, y: 10 }]);
		const parts = pathSplitAt(p, [{ segmentIndex: 1, t: 0.5 }, { segmentIndex: 0, t: 0.25 }]);
		expect(parts.map(pathLength)).toEqual([2.5, 12.5, 15]);
		const back = pathBetween(p, { segmentIndex: 2, t: 0.5 }, { segmentIndex: 0, t: 0.5 });
		expect(pathLength(back)).toBeCloseTo(20, 12);
		expect(pathStart(back)).toEqual({ x: 15, y: 10 });
		expect(pathEnd(back)).toEqual({ x: 5, y: 0 });
		expect(pathReverse(pathReverse(p))).toEqual(p);
	});

	it('a cut at a vertex (t = 1) is the same as the next segment start and adds no empty chain', () => {
		const o = outlineFromPolyline([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }]);
		const chains = outlineSplitAt(o, [{ segmentIndex: 0, t: 1 }, { segmentIndex: 1, t: 0 }, { segmentIndex: 2, t: 1 }]);
		expect(chains.map((c) => c.segments.length)).toEqual([2, 2]);
		expect(chains.map(pathLength)).toEqual([20, 20]);
	});

	it('point at arc length walks the outline and inverts length-at', () => {
		const o = bezierCircle({ x: 5, y: 5 }, 50);
		const per = outlinePerimeter(o);
		for (const f of [0, 0.1, 0.33, 0.5, 0.77, 1]) {
			const at = pathPointAtLength(o, f * per);
			expect(pathLengthAt(o, at)).toBeCloseTo(f * per, 8);
			expect(Math.abs(vecDistance(at.point, { x: 5, y: 5 }) - 50)).toBeLessThan(0.02);
		}
	});

	it('joining chains snaps tiny gaps and bridges larger ones with a line', () => {
		const a = pathFromPolyline([{ x: 0, y: 0 }, { x: 10, y: 0 }]);
		const b = pathFromPolyline([{ x: 10, y: 1e-8 }, { x: 10, y: 10 }]);
		const c = pathFromPolyline([{ x: 5, y: 10 }, { x: 0, y: 10 }]);
		const o = outlineFromChains([a, b, c]);
		expect(o.segments.length).toBe(5);
		expect(o.segments[1].p0).toBe(o.segments[0].p1);
		expect(outlineSignedArea(o)).toBeCloseTo(100, 6);
		expect(outlineSignedArea(outlineReverse(o))).toBeCloseTo(-100, 6);
		expect(pathConcat([a, b], { gaps: 'keep' }).segments.length).toBe(2);
	});
});
