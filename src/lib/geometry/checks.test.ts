import { describe, expect, it } from 'vitest';
import { outlineProblems } from './checks';
import { outlineFromPolyline } from './path';
import type { Outline } from './types';
import { bezierCircle, starPolygon } from './test-support/arbitraries';

const square = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }]);

describe('outline problems', () => {
	it('a good outline has none', () => {
		expect(outlineProblems(square)).toEqual([]);
		expect(outlineProblems(bezierCircle({ x: 0, y: 0 }, 80))).toEqual([]);
		expect(outlineProblems(outlineFromPolyline(starPolygon(500, 4)))).toEqual([]);
	});

	it('empty outline', () => {
		expect(outlineProblems({ segments: [] }).map((p) => p.code)).toEqual(['empty']);
	});

	it('unclosed outline reports the gap, where, and how big', () => {
		const open: Outline = { segments: square.segments.map((s, i) => (i === 3 ? { kind: 'line', p0: s.p0, p1: { x: 0, y: 2 } } : s)) };
		const probs = outlineProblems(open);
		expect(probs.map((p) => p.code)).toEqual(['not-closed']);
		expect(probs[0].segmentIndex).toBe(3);
		expect(probs[0].point).toEqual({ x: 0, y: 2 });
		expect(probs[0].message).toMatch(/gap/);
		expect(probs[0].message).toMatch(/2\.0 mm/);
		// within tolerance is fine
		expect(outlineProblems(open, { closure: 3 })).toEqual([]);
	});

	it('NaN coordinate is reported and does not throw', () => {
		const bad: Outline = { segments: square.segments.map((s, i) => (i === 1 ? { kind: 'line', p0: s.p0, p1: { x: NaN, y: 100 } } : s)) };
		const probs = outlineProblems(bad);
		expect(probs.map((p) => p.code)).toEqual(['not-finite']);
		expect(probs[0].segmentIndex).toBe(1);
		expect(probs[0].message).toMatch(/Segment 2/);
	});

	it('figure-eight is reported as crossing itself, at the crossing', () => {
		const eight = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 100 }, { x: 100, y: 0 }, { x: 0, y: 100 }]);
		const probs = outlineProblems(eight);
		expect(probs.map((p) => p.code)).toEqual(['self-intersection']);
		expect(probs[0].point!.x).toBeCloseTo(50, 9);
		expect(probs[0].point!.y).toBeCloseTo(50, 9);
		expect(probs[0].message).toMatch(/crosses itself at \(50\.0, 50\.0\) mm/);
	});

	it('too short segment', () => {
		const tiny = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 0.005 }, { x: 100, y: 100 }, { x: 0, y: 100 }]);
		const probs = outlineProblems(tiny);
		expect(probs.map((p) => p.code)).toEqual(['segment-too-short']);
		expect(probs[0].segmentIndex).toBe(1);
		expect(probs[0].message).toMatch(/only/);
	});
});
