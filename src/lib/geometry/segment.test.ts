import { describe, expect, it } from 'vitest';
import { segmentBetween, segmentNormalAt, segmentPointAt, segmentReverse, segmentTangentAt } from './segment';
import type { CubicSegment } from './types';
import { vecDistance } from './vec';

const c: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 0, y: 0 }, p2: { x: 50, y: 50 }, p3: { x: 100, y: 0 } };

describe('segment evaluation', () => {
	it('tangent of a line is its unit direction; normal is it turned +90° (toward +y from +x)', () => {
		const l = { kind: 'line' as const, p0: { x: 0, y: 0 }, p1: { x: 10, y: 0 } };
		expect(segmentTangentAt(l, 0.3)).toEqual({ x: 1, y: 0 });
		const n = segmentNormalAt(l, 0.3);
		expect(n.x).toBeCloseTo(0, 15);
		expect(n.y).toBe(1);
	});

	it('tangent stays defined where a control point sits on the end point', () => {
		const t = segmentTangentAt(c, 0);
		expect(t.x).toBeCloseTo(Math.SQRT1_2, 12);
		expect(t.y).toBeCloseTo(Math.SQRT1_2, 12);
		const e = segmentTangentAt(c, 1);
		expect(Math.hypot(e.x, e.y)).toBeCloseTo(1, 12);
	});

	it('tangent matches a finite difference of the curve', () => {
		for (const t of [0.1, 0.5, 0.9]) {
			const a = segmentPointAt(c, t - 1e-6), b = segmentPointAt(c, t + 1e-6);
			const d = Math.hypot(b.x - a.x, b.y - a.y);
			const tg = segmentTangentAt(c, t);
			expect(tg.x).toBeCloseTo((b.x - a.x) / d, 6);
			expect(tg.y).toBeCloseTo((b.y - a.y) / d, 6);
		}
	});

	it('reverse runs the same points backwards; between(t0,t1) is that piece', () => {
		const r = segmentReverse(c);
		expect(vecDistance(segmentPointAt(r, 0.3), segmentPointAt(c, 0.7))).toBeLessThan(1e-12);
		const piece = segmentBetween(c, 0.2, 0.6);
		expect(vecDistance(segmentPointAt(piece, 0.5), segmentPointAt(c, 0.4))).toBeLessThan(1e-12);
		expect(vecDistance(piece.p0, segmentPointAt(c, 0.2))).toBeLessThan(1e-12);
	});
});
