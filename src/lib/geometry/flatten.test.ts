import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineFlatten, pathFlatten, pointsToFlatArray, segmentFlatten } from './flatten';
import { segmentNearestPoint } from './nearest';
import { outlineArea } from './outline-area';
import { outlineFromPolyline } from './path';
import { segmentPointAt } from './segment';
import type { CubicSegment, Vec } from './types';
import { arbPoint, bezierCircle } from './test-support/arbitraries';

function distToPolyline(p: Vec, pts: readonly Vec[]): number {
	let best = Infinity;
	for (let i = 0; i + 1 < pts.length; i++) best = Math.min(best, segmentNearestPoint({ kind: 'line', p0: pts[i], p1: pts[i + 1] }, p).distance);
	return best;
}

describe('flattening (drawing only)', () => {
	it('every point of the curve is within the tolerance of the polyline', () => {
		fc.assert(
			fc.property(arbPoint(200), arbPoint(200), arbPoint(200), arbPoint(200), fc.constantFrom(0.5, 0.05, 0.01), (p0, p1, p2, p3, tol) => {
				const c: CubicSegment = { kind: 'cubic', p0, p1, p2, p3 };
				const pts = segmentFlatten(c, tol);
				expect(pts[0]).toBe(p0);
				expect(pts[pts.length - 1]).toBe(p3);
				for (let k = 0; k <= 200; k++) expect(distToPolyline(segmentPointAt(c, k / 200), pts)).toBeLessThanOrEqual(tol * (1 + 1e-9));
			}),
			{ numRuns: 40 }
		);
	});

	it('a flattened circle is close in area and does not repeat its closing point', () => {
		const c = bezierCircle({ x: 0, y: 0 }, 100);
		const pts = outlineFlatten(c, 0.01);
		expect(pts[pts.length - 1]).not.toEqual(pts[0]);
		expect(Math.abs(outlineArea(outlineFromPolyline(pts)) - outlineArea(c))).toBeLessThan(0.01 * 2 * Math.PI * 100);
		expect(pathFlatten(c, 0.01).length).toBe(pts.length + 1);
		expect(pointsToFlatArray([{ x: 1, y: 2 }, { x: 3, y: 4 }])).toEqual([1, 2, 3, 4]);
	});
});
