import Flatten from '@flatten-js/core';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineFlatten } from './flatten';
import { outlineNearestPoint } from './nearest';
import { outlineFromPolyline } from './path';
import { outlineContainsPoint, outlineWindingNumber } from './point-in';
import { outlineMirrorAcross } from './transform';
import { arbOutline, arbPoint, bezierCircle, starPolygon } from './test-support/arbitraries';

describe('point in outline', () => {
	// Reference library: @flatten-js/core 1.6.15, Polygon.contains(Point) on random star polygons.
	it('agrees with @flatten-js/core Polygon.contains on random polygons and points', () => {
		let s = 12345;
		const rnd = (): number => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
		for (let seed = 1; seed <= 30; seed++) {
			const pts = starPolygon(3 + seed * 3, seed * 31337);
			const o = outlineFromPolyline(pts);
			const poly = new Flatten.Polygon(pts.map((p) => [p.x, p.y] as [number, number]));
			for (let k = 0; k < 200; k++) {
				const p = { x: (rnd() - 0.5) * 340, y: (rnd() - 0.5) * 340 };
				expect(outlineContainsPoint(o, p)).toBe(poly.contains(new Flatten.Point(p.x, p.y)));
			}
		}
	});

	it('uses the true curves: points between a circle of cubics and its control polygon', () => {
		const c = bezierCircle({ x: 0, y: 0 }, 100);
		const d = 100 / Math.SQRT2;
		expect(outlineContainsPoint(c, { x: d - 0.01, y: d - 0.01 })).toBe(true);
		expect(outlineContainsPoint(c, { x: d + 0.05, y: d + 0.05 })).toBe(false);
		expect(outlineContainsPoint(c, { x: 99.99, y: 0.5 })).toBe(true);
		expect(outlineContainsPoint(c, { x: 0, y: -100.01 })).toBe(false);
		expect(outlineWindingNumber(c, { x: 0, y: 0 })).toBe(1);
		expect(outlineWindingNumber(outlineMirrorAcross(c, { x: 0, y: 0 }, { x: 1, y: 0 }), { x: 0, y: 0 })).toBe(-1);
	});

	// Reference: the same outline flattened at 1e-4 mm, whose polygon winding is checked against
	// @flatten-js/core above; points closer than 0.01 mm to the boundary are skipped.
	it('exact-curve winding equals the winding of a tightly flattened copy on random outlines with cubics', () => {
		fc.assert(
			fc.property(arbOutline, fc.array(arbPoint(450), { minLength: 20, maxLength: 20 }), (o, pts) => {
				const flat = outlineFromPolyline(outlineFlatten(o, 1e-4));
				for (const p of pts) {
					if (outlineNearestPoint(o, p).distance < 0.01) continue;
					expect(outlineWindingNumber(o, p)).toBe(outlineWindingNumber(flat, p));
				}
			}),
			{ numRuns: 60 }
		);
	});

	it('evenodd and nonzero differ on a doubly wound outline', () => {
		const sq = [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }];
		const twice = outlineFromPolyline([...sq, ...sq]);
		expect(outlineWindingNumber(twice, { x: 5, y: 5 })).toBe(2);
		expect(outlineContainsPoint(twice, { x: 5, y: 5 }, 'evenodd')).toBe(false);
		expect(outlineContainsPoint(twice, { x: 5, y: 5 })).toBe(true);
	});
});
