import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { chordWidth } from './angle';
import { outlineSignedArea } from './outline-area';
import { outlinePerimeter, pathSegmentLengths } from './outline-length';
import {
	outlineMirrorAcross,
	outlineRotateAbout,
	outlineTranslate,
	pathRotateAbout,
	pointMirrorAcross,
	pointRotateAbout,
	pointTranslate
} from './transform';
import { vecDistance } from './vec';
import { arbOutline, arbPoint } from './test-support/arbitraries';

const arbAngle = fc.double({ min: -2 * Math.PI, max: 2 * Math.PI, noNaN: true });

describe('rigid transforms', () => {
	it('positive angle turns +x toward +y', () => {
		const p = pointRotateAbout({ x: 1, y: 0 }, { x: 0, y: 0 }, Math.PI / 2);
		expect(p.x).toBeCloseTo(0, 15);
		expect(p.y).toBeCloseTo(1, 15);
	});

	it('rotation keeps signed area, perimeter and every segment length', () => {
		fc.assert(
			fc.property(arbOutline, arbPoint(), arbAngle, (o, c, a) => {
				const r = outlineRotateAbout(o, c, a);
				const A = outlineSignedArea(o);
				expect(Math.abs(outlineSignedArea(r) - A)).toBeLessThan(1e-9 * Math.abs(A) + 1e-6);
				expect(outlinePerimeter(r)).toBeCloseTo(outlinePerimeter(o), 7);
				const l0 = pathSegmentLengths(o);
				pathSegmentLengths(r).forEach((l, i) => expect(Math.abs(l - l0[i])).toBeLessThan(1e-8 * l0[i] + 1e-9));
			}),
			{ numRuns: 100 }
		);
	});

	it('mirroring keeps lengths and the size of the area, and flips its sign', () => {
		fc.assert(
			fc.property(arbOutline, arbPoint(), arbPoint(), (o, a, b) => {
				fc.pre(vecDistance(a, b) > 1e-3);
				const m = outlineMirrorAcross(o, a, b);
				const A = outlineSignedArea(o);
				expect(Math.abs(outlineSignedArea(m) + A)).toBeLessThan(1e-9 * Math.abs(A) + 1e-6);
				const l0 = pathSegmentLengths(o);
				pathSegmentLengths(m).forEach((l, i) => expect(Math.abs(l - l0[i])).toBeLessThan(1e-8 * l0[i] + 1e-9));
			}),
			{ numRuns: 100 }
		);
	});

	it('translation keeps the signed area and perimeter', () => {
		fc.assert(
			fc.property(arbOutline, arbPoint(1000), (o, d) => {
				const t = outlineTranslate(o, d);
				const A = outlineSignedArea(o);
				expect(Math.abs(outlineSignedArea(t) - A)).toBeLessThan(1e-9 * Math.abs(A) + 1e-6);
				expect(outlinePerimeter(t)).toBeCloseTo(outlinePerimeter(o), 7);
			}),
			{ numRuns: 100 }
		);
	});

	it('mirror is an involution and fixes points on the mirror line', () => {
		fc.assert(
			fc.property(arbPoint(), arbPoint(), arbPoint(), (p, a, b) => {
				fc.pre(vecDistance(a, b) > 1e-2);
				const back = pointMirrorAcross(pointMirrorAcross(p, a, b), a, b);
				expect(vecDistance(back, p)).toBeLessThan(1e-9);
				const onLine = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
				expect(vecDistance(pointMirrorAcross(onLine, a, b), onLine)).toBeLessThan(1e-9);
			})
		);
	});

	// Reference-values row 17 (D): chord intake w = 2r·sin(θ/2) between a point and its rotation.
	it('distance between a point and its rotation about P by θ is the chord 2r·sin(θ/2) (row 17)', () => {
		fc.assert(
			fc.property(arbPoint(), arbPoint(), fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), (p, c, a) => {
				const r = vecDistance(p, c);
				const q = pointRotateAbout(p, c, a);
				expect(Math.abs(vecDistance(p, q) - Math.abs(chordWidth(r, a)))).toBeLessThan(1e-9 * (1 + r));
				expect(Math.abs(vecDistance(q, c) - r)).toBeLessThan(1e-9 * (1 + r));
			})
		);
	});

	it('keeps shared end points shared (one object) after a transform', () => {
		const a = { x: 0, y: 0 }, b = { x: 10, y: 0 }, c = { x: 10, y: 10 };
		const p = pathRotateAbout({ segments: [{ kind: 'line', p0: a, p1: b }, { kind: 'line', p0: b, p1: c }] }, a, 0.3);
		expect(p.segments[0].p1).toBe(p.segments[1].p0);
		expect(pointTranslate({ x: 1, y: 2 }, { x: 3, y: 4 })).toEqual({ x: 4, y: 6 });
	});
});
