import Flatten from '@flatten-js/core';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { outlineNearestPoint, segmentNearestPoint } from './nearest';
import { outlineFromPolyline } from './path';
import { segmentPointAt } from './segment';
import type { CubicSegment } from './types';
import { vecDistance } from './vec';
import { arbPoint, bezierCircle } from './test-support/arbitraries';

describe('nearest point', () => {
	it('on a square: segment index, t, point and distance', () => {
		const sq = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }]);
		const r = outlineNearestPoint(sq, { x: 130, y: 25 });
		expect(r).toEqual({ segmentIndex: 1, t: 0.25, point: { x: 100, y: 25 }, distance: 30 });
	});

	it('on a circle of cubics: distance is |r − |p − c|| within the Bézier-circle error', () => {
		const c = bezierCircle({ x: 10, y: 20 }, 100);
		fc.assert(
			fc.property(arbPoint(300), (p) => {
				const r = outlineNearestPoint(c, p);
				expect(Math.abs(r.distance - Math.abs(vecDistance(p, { x: 10, y: 20 }) - 100))).toBeLessThan(0.03);
				expect(vecDistance(r.point, segmentPointAt(c.segments[r.segmentIndex], r.t))).toBeLessThan(1e-9);
			})
		);
	});

	it('is never farther than a dense sample of the cubic', () => {
		fc.assert(
			fc.property(arbPoint(100), arbPoint(100), arbPoint(100), arbPoint(100), arbPoint(150), (p0, p1, p2, p3, q) => {
				const c: CubicSegment = { kind: 'cubic', p0, p1, p2, p3 };
				const r = segmentNearestPoint(c, q);
				let dense = Infinity;
				for (let k = 0; k <= 2000; k++) dense = Math.min(dense, vecDistance(segmentPointAt(c, k / 2000), q));
				// 1e-6 mm slack: on degenerate (collinear, doubling back) cubics Newton stops within a micron
				expect(r.distance).toBeLessThanOrEqual(dense + 1e-6);
			}),
			{ numRuns: 100 }
		);
	});

	// Reference: @flatten-js/core's point-to-segment distance, smallest over the edges (points on a 0.1 mm
	// grid: flatten-js compares with its own 1e-6 tolerance, so sub-micron shapes are not a fair reference).
	it('on straight outlines matches @flatten-js/core distance, and the point lies on the reported segment', () => {
		const gridPoint = (r: number) => fc.record({ x: fc.integer({ min: -10 * r, max: 10 * r }), y: fc.integer({ min: -10 * r, max: 10 * r }) }).map((p) => ({ x: p.x / 10, y: p.y / 10 }));
		fc.assert(
			fc.property(fc.uniqueArray(gridPoint(100), { minLength: 3, maxLength: 60, selector: (p) => `${p.x},${p.y}` }), gridPoint(150), (pts, q) => {
				const o = outlineFromPolyline(pts);
				const r = outlineNearestPoint(o, q);
				const fq = new Flatten.Point(q.x, q.y);
				const d = Math.min(...pts.map((p, i) => new Flatten.Segment(new Flatten.Point(p.x, p.y), new Flatten.Point(pts[(i + 1) % pts.length].x, pts[(i + 1) % pts.length].y)).distanceTo(fq)[0]));
				expect(Math.abs(r.distance - d)).toBeLessThan(1e-9);
				expect(vecDistance(r.point, segmentPointAt(o.segments[r.segmentIndex], r.t))).toBeLessThan(1e-9);
				expect(Math.abs(vecDistance(r.point, q) - r.distance)).toBeLessThan(1e-9);
			}),
			{ numRuns: 200 }
		);
	});
});
