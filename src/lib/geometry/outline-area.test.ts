import Flatten from '@flatten-js/core';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineArea, outlineSignedArea, polygonSignedArea, segmentAreaContribution } from './outline-area';
import { outlineFromPolyline } from './path';
import { segmentDerivativeAt, segmentPointAt } from './segment';
import type { CubicSegment, Outline } from './types';
import { arbOutline, bezierCircle, starPolygon } from './test-support/arbitraries';

/** ½∮(x y' − y x') by composite Gauss–Legendre, independent of the closed form. */
function numericArea(o: Outline): number {
	const xs = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
	const ws = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];
	let sum = 0;
	for (const s of o.segments) {
		const pieces = 64;
		for (let k = 0; k < pieces; k++) {
			const a = k / pieces, b = (k + 1) / pieces;
			for (let i = 0; i < 5; i++) {
				const t = 0.5 * (a + b) + 0.5 * (b - a) * xs[i];
				const p = segmentPointAt(s, t);
				const d = segmentDerivativeAt(s, t);
				sum += ws[i] * 0.5 * (b - a) * 0.5 * (p.x * d.y - p.y * d.x);
			}
		}
	}
	return sum;
}

describe('outline area (Green, closed form)', () => {
	it('unit square running +x then +y has area +1 (positive = clockwise on a y-down screen)', () => {
		const sq = outlineFromPolyline([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 1 }, { x: 0, y: 1 }]);
		expect(outlineSignedArea(sq)).toBe(1);
		const rev = outlineFromPolyline([{ x: 0, y: 0 }, { x: 0, y: 1 }, { x: 1, y: 1 }, { x: 1, y: 0 }]);
		expect(outlineSignedArea(rev)).toBe(-1);
		expect(outlineArea(rev)).toBe(1);
	});

	it('a cubic with control points on its chord contributes exactly what the straight line does', () => {
		const c: CubicSegment = { kind: 'cubic', p0: { x: 3, y: 7 }, p1: { x: 5, y: 8 }, p2: { x: 7, y: 9 }, p3: { x: 9, y: 10 } };
		expect(segmentAreaContribution(c)).toBeCloseTo(segmentAreaContribution({ kind: 'line', p0: c.p0, p1: c.p3 }), 12);
	});

	// D: derived. Quarter of the 4-cubic circle with handle k: closed-form Green integral
	// A = r²·(10 + 12k − 3k²)/5 (≈ 3.14247·r² for k = 4(√2−1)/3, 0.028 % above πr²).
	it('circle of four cubics has the Bézier-circle area r²(10 + 12k − 3k²)/5', () => {
		const k = (4 * (Math.SQRT2 - 1)) / 3;
		for (const r of [1, 25, 123.4]) {
			const o = bezierCircle({ x: 40, y: -70 }, r);
			const expected = (r * r * (10 + 12 * k - 3 * k * k)) / 5;
			expect(outlineSignedArea(o)).toBeCloseTo(expected, 9);
			expect(Math.abs(outlineArea(o) - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(3e-4);
		}
	});

	it('matches an independent numerical Green integral on random outlines of lines and cubics', () => {
		fc.assert(
			fc.property(arbOutline, (o) => {
				const a = outlineSignedArea(o);
				expect(Math.abs(a - numericArea(o))).toBeLessThan(1e-7 * Math.max(1, Math.abs(a)));
			}),
			{ numRuns: 100 }
		);
	});

	// Reference library: @flatten-js/core 1.6.15, Polygon.area() (shoelace) on random star polygons.
	it('agrees with @flatten-js/core Polygon.area on random polygons', () => {
		for (let seed = 1; seed <= 50; seed++) {
			const pts = starPolygon(3 + (seed % 40), seed * 7919, { x: seed * 10, y: -seed * 5 });
			const poly = new Flatten.Polygon(pts.map((p) => [p.x, p.y] as [number, number]));
			const ours = outlineArea(outlineFromPolyline(pts));
			expect(Math.abs(ours - Math.abs(poly.area()))).toBeLessThan(1e-9 * ours);
			expect(Math.abs(polygonSignedArea(pts))).toBeCloseTo(ours, 8);
		}
	});

	it('is unaffected by a far-away origin (relative coordinates)', () => {
		const pts = starPolygon(100, 3);
		const far = pts.map((p) => ({ x: p.x + 1e6, y: p.y - 1e6 }));
		expect(outlineArea(outlineFromPolyline(far))).toBeCloseTo(outlineArea(outlineFromPolyline(pts)), 5);
	});
});
