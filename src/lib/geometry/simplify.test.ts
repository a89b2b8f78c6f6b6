import { describe, expect, it } from 'vitest';
import { outlineFlatten } from './flatten';
import { segmentNearestPoint } from './nearest';
import { polygonSimplify, polylineSimplify } from './simplify';
import type { Vec } from './types';
import { bezierCircle } from './test-support/arbitraries';

function distToPolyline(p: Vec, pts: readonly Vec[], closed: boolean): number {
	let best = Infinity;
	const n = pts.length;
	for (let i = 0; i < (closed ? n : n - 1); i++) best = Math.min(best, segmentNearestPoint({ kind: 'line', p0: pts[i], p1: pts[(i + 1) % n] }, p).distance);
	return best;
}

describe('Ramer–Douglas–Peucker', () => {
	it('drops collinear points and keeps the ends', () => {
		const pts = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0.001 }, { x: 3, y: 0 }, { x: 3, y: 5 }];
		expect(polylineSimplify(pts, 0.01)).toEqual([{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 5 }]);
	});

	it('every dropped point of a dense closed curve stays within the tolerance', () => {
		const dense = outlineFlatten(bezierCircle({ x: 0, y: 0 }, 150), 0.00002);
		for (const tol of [0.01, 0.1]) {
			const s = polygonSimplify(dense, tol);
			expect(s.length).toBeLessThan(dense.length / 4);
			for (const p of dense) expect(distToPolyline(p, s, true)).toBeLessThanOrEqual(tol);
		}
	});
});
