import { Bezier } from 'bezier-js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pathBoundingBox, segmentBoundingBox } from './bbox';
import { segmentPointAt } from './segment';
import type { CubicSegment } from './types';
import { arbOutline, arbPoint, bezierCircle } from './test-support/arbitraries';

describe('bounding boxes (exact, from the derivative roots)', () => {
	it('a circle of cubics of radius r has the box ±r exactly (extremes at the joints)', () => {
		expect(pathBoundingBox(bezierCircle({ x: 10, y: 20 }, 50))).toEqual({ minX: -40, minY: -30, maxX: 60, maxY: 70 });
	});

	// Reference library: bezier-js 6.1.4, Bezier.bbox() (extrema from derivative roots).
	it('matches bezier-js bbox() and contains a dense sample touching every side', () => {
		fc.assert(
			fc.property(arbPoint(300), arbPoint(300), arbPoint(300), arbPoint(300), (p0, p1, p2, p3) => {
				const c: CubicSegment = { kind: 'cubic', p0, p1, p2, p3 };
				const b = segmentBoundingBox(c);
				const ref = new Bezier(p0.x, p0.y, p1.x, p1.y, p2.x, p2.y, p3.x, p3.y).bbox();
				expect(b.minX).toBeCloseTo(ref.x.min, 6);
				expect(b.maxX).toBeCloseTo(ref.x.max, 6);
				expect(b.minY).toBeCloseTo(ref.y.min, 6);
				expect(b.maxY).toBeCloseTo(ref.y.max, 6);
				let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
				for (let k = 0; k <= 1000; k++) {
					const q = segmentPointAt(c, k / 1000);
					minX = Math.min(minX, q.x); maxX = Math.max(maxX, q.x); minY = Math.min(minY, q.y); maxY = Math.max(maxY, q.y);
				}
				expect(minX).toBeGreaterThanOrEqual(b.minX - 1e-9);
				expect(maxX).toBeLessThanOrEqual(b.maxX + 1e-9);
				expect(minX - b.minX).toBeLessThan(0.01);
				expect(b.maxY - maxY).toBeLessThan(0.01);
			})
		);
	});

	it('the box of an outline is the union of its segment boxes', () => {
		fc.assert(
			fc.property(arbOutline, (o) => {
				const b = pathBoundingBox(o);
				const boxes = o.segments.map(segmentBoundingBox);
				expect(b.minX).toBe(Math.min(...boxes.map((x) => x.minX)));
				expect(b.maxY).toBe(Math.max(...boxes.map((x) => x.maxY)));
			}),
			{ numRuns: 50 }
		);
	});
});
