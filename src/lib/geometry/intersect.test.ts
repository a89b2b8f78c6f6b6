import Flatten from '@flatten-js/core';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
	outlineLineIntersections,
	outlinePolylineIntersections,
	outlineRayIntersections,
	outlineSegmentIntersections,
	pathIntersections,
	segmentIntersections,
	segmentLineIntersections
} from './intersect';
import { outlineSelfIntersections, segmentSelfIntersection } from './self-intersect';
import { segmentFlatten } from './flatten';
import { outlineFromPolyline, pathFromPolyline } from './path';
import { segmentPointAt } from './segment';
import type { CubicSegment, Segment } from './types';
import { vecDistance } from './vec';
import { MIN_SEGMENT_LENGTH_MM } from './tolerance';
import { arbOutline, arbPoint, bezierCircle, starPolygon } from './test-support/arbitraries';

describe('line against outline', () => {
	const square = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }]);

	it('infinite line through a square meets it twice, sorted along the line', () => {
		const hits = outlineLineIntersections(square, { x: -50, y: 30 }, { x: 1, y: 0 });
		expect(hits.map((h) => h.u)).toEqual([50, 150]);
		expect(hits.map((h) => h.segmentIndex)).toEqual([3, 1]);
		expect(hits[0].point).toEqual({ x: 0, y: 30 });
	});

	it('a crossing through a vertex is reported once', () => {
		const hits = outlineLineIntersections(square, { x: -10, y: -10 }, { x: 1, y: 1 });
		expect(hits.length).toBe(2);
		expect(hits.map((h) => [h.segmentIndex, h.t])).toEqual([[0, 0], [2, 0]]);
	});

	it('ray and segment queries keep only their part of the line', () => {
		expect(outlineRayIntersections(square, { x: 50, y: 50 }, { x: 0, y: -1 }).map((h) => h.point)).toEqual([{ x: 50, y: 0 }]);
		expect(outlineSegmentIntersections(square, { x: 50, y: 50 }, { x: 50, y: 150 }).map((h) => h.u)).toEqual([0.5]);
		expect(outlineSegmentIntersections(square, { x: 10, y: 10 }, { x: 20, y: 20 })).toEqual([]);
	});

	it('line against a circle of cubics: exact points lie on both the line and the curve', () => {
		const c = bezierCircle({ x: 0, y: 0 }, 100);
		fc.assert(
			fc.property(fc.double({ min: -95, max: 95, noNaN: true }), fc.double({ min: 0, max: Math.PI, noNaN: true }), (off, ang) => {
				const dir = { x: Math.cos(ang), y: Math.sin(ang) };
				const origin = { x: -dir.y * off, y: dir.x * off };
				const hits = outlineLineIntersections(c, origin, dir);
				expect(hits.length).toBe(2);
				for (const h of hits) {
					expect(vecDistance(h.point, segmentPointAt(c.segments[h.segmentIndex], h.t))).toBeLessThan(1e-9);
					// a crossing within PARAMETER_TOLERANCE of a joint is snapped onto the joint (moves it < 1e-6 mm)
					expect(vecDistance(h.point, { x: origin.x + dir.x * h.u, y: origin.y + dir.y * h.u })).toBeLessThan(1e-6);
				}
			})
		);
	});

	it('on random outlines of lines and cubics every hit is on the curve and on the line, sorted by u', () => {
		fc.assert(
			fc.property(arbOutline, arbPoint(300), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (o, origin, ang) => {
				const dir = { x: Math.cos(ang), y: Math.sin(ang) };
				const hits = outlineLineIntersections(o, origin, dir);
				for (let k = 0; k < hits.length; k++) {
					const h = hits[k];
					expect(vecDistance(h.point, segmentPointAt(o.segments[h.segmentIndex], h.t))).toBeLessThan(1e-9);
					expect(vecDistance(h.point, { x: origin.x + dir.x * h.u, y: origin.y + dir.y * h.u })).toBeLessThan(1e-6);
					if (k > 0) expect(h.u).toBeGreaterThanOrEqual(hits[k - 1].u);
				}
			}),
			{ numRuns: 200 }
		);
	});

	it('a line tangent to a cubic is found once (double root)', () => {
		const c: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 0, y: 40 }, p2: { x: 100, y: 40 }, p3: { x: 100, y: 0 } };
		const hits = segmentLineIntersections(c, { x: 0, y: 30 }, { x: 1, y: 0 });
		expect(hits.length).toBe(1);
		expect(hits[0].t).toBeCloseTo(0.5, 6);
	});

	// Reference library: @flatten-js/core 1.6.15, Polygon.intersect(Line) on random polygons.
	it('agrees with @flatten-js/core on the number and places of line crossings of random polygons', () => {
		for (let seed = 1; seed <= 40; seed++) {
			const pts = starPolygon(5 + seed, seed * 104729);
			const ang = seed * 0.37;
			const origin = { x: Math.cos(seed) * 20, y: Math.sin(seed) * 20 };
			const dir = { x: Math.cos(ang), y: Math.sin(ang) };
			const ours = outlineLineIntersections(outlineFromPolyline(pts), origin, dir);
			const poly = new Flatten.Polygon(pts.map((p) => [p.x, p.y] as [number, number]));
			const line = new Flatten.Line(new Flatten.Point(origin.x, origin.y), new Flatten.Vector(-dir.y, dir.x));
			const theirs = poly.intersect(line) as Flatten.Point[];
			expect(ours.length).toBe(theirs.length);
			for (const p of theirs) expect(Math.min(...ours.map((h) => vecDistance(h.point, p)))).toBeLessThan(1e-6);
		}
	});

	it('polyline crossings carry the polyline edge index', () => {
		const hits = outlinePolylineIntersections(square, [{ x: 50, y: -10 }, { x: 50, y: 50 }, { x: 150, y: 50 }]);
		expect(hits.map((h) => [h.polylineIndex, h.segmentIndex])).toEqual([[0, 0], [1, 1]]);
	});
});

describe('segment against segment', () => {
	it('two crossing lines', () => {
		const h = segmentIntersections({ kind: 'line', p0: { x: 0, y: 0 }, p1: { x: 10, y: 10 } }, { kind: 'line', p0: { x: 0, y: 10 }, p1: { x: 10, y: 0 } });
		expect(h.length).toBe(1);
		expect(h[0].point).toEqual({ x: 5, y: 5 });
	});

	it('two cubics crossing in several places: every hit lies on both curves', () => {
		const a: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 30, y: 200 }, p2: { x: 70, y: -200 }, p3: { x: 100, y: 0 } };
		const b: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 10 }, p1: { x: 50, y: -20 }, p2: { x: 50, y: 20 }, p3: { x: 100, y: -10 } };
		const hits = segmentIntersections(a, b);
		expect(hits.length).toBe(3);
		for (const h of hits) {
			expect(vecDistance(segmentPointAt(a, h.ta), h.point)).toBeLessThan(1e-7);
			expect(vecDistance(segmentPointAt(b, h.tb), h.point)).toBeLessThan(1e-7);
		}
	});

	// Reference: crossings of the two curves flattened at 1e-4 mm (line–line, closed form).
	it('generic random cubic pairs: every hit is on both curves, every crossing of the flattened curves is found', () => {
		let seed = 424242;
		const rnd = (): number => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 200 - 100;
		let found = 0;
		for (let k = 0; k < 200; k++) {
			const q = Array.from({ length: 8 }, () => ({ x: rnd(), y: rnd() }));
			const a: CubicSegment = { kind: 'cubic', p0: q[0], p1: q[1], p2: q[2], p3: q[3] };
			const b: CubicSegment = { kind: 'cubic', p0: q[4], p1: q[5], p2: q[6], p3: q[7] };
			const hits = segmentIntersections(a, b);
			found += hits.length;
			for (const h of hits) {
				expect(vecDistance(segmentPointAt(a, h.ta), h.point)).toBeLessThan(1e-6);
				expect(vecDistance(segmentPointAt(b, h.tb), h.point)).toBeLessThan(1e-6);
			}
			const fa = pathFromPolyline(segmentFlatten(a, 1e-4));
			const fb = pathFromPolyline(segmentFlatten(b, 1e-4));
			for (const c of pathIntersections(fa, fb)) {
				expect(Math.min(...hits.map((h) => vecDistance(h.point, c.point)))).toBeLessThan(0.05);
			}
		}
		expect(found).toBeGreaterThan(50);
	});

	it('degenerate pairs (collinear, overlapping, point-like) return quickly with hits on both curves within 1e-3 mm', () => {
		const arbSmall = fc.record({ x: fc.integer({ min: -3, max: 3 }), y: fc.constantFrom(0, 0, 0, 1) });
		fc.assert(
			fc.property(fc.array(arbSmall, { minLength: 8, maxLength: 8 }), (p) => {
				const a: CubicSegment = { kind: 'cubic', p0: p[0], p1: p[1], p2: p[2], p3: p[3] };
				const b: CubicSegment = { kind: 'cubic', p0: p[4], p1: p[5], p2: p[6], p3: p[7] };
				const started = performance.now();
				const hits = segmentIntersections(a, b);
				expect(performance.now() - started).toBeLessThan(500);
				expect(hits.length).toBeLessThanOrEqual(64);
				for (const h of hits) {
					expect(vecDistance(segmentPointAt(a, h.ta), h.point)).toBeLessThan(1e-3);
					expect(vecDistance(segmentPointAt(b, h.tb), h.point)).toBeLessThan(1e-3);
				}
			}),
			{ numRuns: 100 }
		);
	});

	it('cubic–cubic agrees with line–cubic when one cubic is straight', () => {
		const curve: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 20, y: 90 }, p2: { x: 80, y: -90 }, p3: { x: 100, y: 0 } };
		const straight: CubicSegment = { kind: 'cubic', p0: { x: -5, y: 3 }, p1: { x: 30, y: 3 }, p2: { x: 70, y: 3 }, p3: { x: 105, y: 3 } };
		const asLine: Segment = { kind: 'line', p0: straight.p0, p1: straight.p3 };
		const cc = segmentIntersections(curve, straight);
		const cl = segmentIntersections(curve, asLine);
		expect(cc.length).toBe(cl.length);
		cc.forEach((h, i) => expect(vecDistance(h.point, cl[i].point)).toBeLessThan(1e-7));
	});

	it('finds the loop of a single looping cubic', () => {
		const loop: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 150, y: 100 }, p2: { x: -50, y: 100 }, p3: { x: 100, y: 0 } };
		const h = segmentSelfIntersection(loop);
		expect(h.length).toBe(1);
		expect(vecDistance(segmentPointAt(loop, h[0].ta), segmentPointAt(loop, h[0].tb))).toBeLessThan(1e-9);
		expect(segmentSelfIntersection({ ...loop, p1: { x: 30, y: 50 }, p2: { x: 70, y: 50 } })).toEqual([]);
	});
});

describe('self-intersection', () => {
	it('a simple outline (polygon or circle of cubics) does not cross itself', () => {
		expect(outlineSelfIntersections(outlineFromPolyline(starPolygon(300, 9)))).toEqual([]);
		expect(outlineSelfIntersections(bezierCircle({ x: 0, y: 0 }, 50))).toEqual([]);
	});

	it('grid search finds the same crossings as testing every pair (random self-crossing polygons)', () => {
		let seed = 777;
		const rnd = (): number => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 300;
		for (let k = 0; k < 20; k++) {
			const pts = Array.from({ length: 10 + k * 5 }, () => ({ x: rnd(), y: rnd() }));
			const o = outlineFromPolyline(pts);
			const n = o.segments.length;
			let brute = 0;
			for (let i = 0; i < n; i++) {
				for (let j = i + 2; j < n; j++) {
					if (i === 0 && j === n - 1) continue;
					brute += segmentIntersections(o.segments[i], o.segments[j]).length;
				}
			}
			expect(outlineSelfIntersections(o).length).toBe(brute);
		}
	});

	it('a figure-eight crosses itself once, where the diagonals meet', () => {
		const eight = outlineFromPolyline([{ x: 0, y: 0 }, { x: 100, y: 100 }, { x: 100, y: 0 }, { x: 0, y: 100 }]);
		const hits = outlineSelfIntersections(eight);
		expect(hits.length).toBe(1);
		expect(vecDistance(hits[0].point, { x: 50, y: 50 })).toBeLessThan(1e-9);
	});

	it('neighbouring cubics that cross away from their shared vertex are reported, on both curves', () => {
		const a: CubicSegment = { kind: 'cubic', p0: { x: 0, y: 0 }, p1: { x: 3, y: 0.5 }, p2: { x: 7, y: -0.5 }, p3: { x: 10, y: 0 } };
		const b: CubicSegment = { kind: 'cubic', p0: { x: 10, y: 0 }, p1: { x: 20, y: 10 }, p2: { x: -5, y: 10 }, p3: { x: 5, y: -5 } };
		const c: Segment = { kind: 'line', p0: { x: 5, y: -5 }, p1: { x: 0, y: 0 } };
		const hits = outlineSelfIntersections({ segments: [a, b, c] });
		expect(hits.length).toBeGreaterThan(0);
		const ab = hits.filter((h) => h.segmentIndex === 0 && h.otherSegmentIndex === 1);
		expect(ab.length).toBe(1);
		expect(vecDistance(segmentPointAt(a, ab[0].t), segmentPointAt(b, ab[0].otherT))).toBeLessThan(1e-6);
		expect(vecDistance(ab[0].point, { x: 10, y: 0 })).toBeGreaterThan(1);
	});

	it('path against path gives the same crossings whichever chain is given first (the shorter one is indexed)', () => {
		// every segment at least the kernel's shortest segment (a 1e-6 mm segment is no stitching line, and a
		// crossing at it may be reported from one side only); fixed seed, so the same paths every run
		const polyline = (maxLength: number) =>
			fc.array(arbPoint(100), { minLength: 2, maxLength }).map((pts) => {
				const out = [pts[0]];
				for (const p of pts) if (vecDistance(p, out[out.length - 1]) >= MIN_SEGMENT_LENGTH_MM) out.push(p);
				return out;
			});
		fc.assert(
			fc.property(polyline(40), polyline(8), (pa, pb) => {
				fc.pre(pa.length >= 2 && pb.length >= 2);
				const a = pathFromPolyline(pa);
				const b = pathFromPolyline(pb);
				const ab = pathIntersections(a, b);
				const ba = pathIntersections(b, a);
				expect(ab.length).toBe(ba.length);
				for (const h of ab) {
					expect(vecDistance(segmentPointAt(a.segments[h.segmentIndex], h.t), h.point)).toBeLessThan(1e-6);
					expect(vecDistance(segmentPointAt(b.segments[h.otherSegmentIndex], h.otherT), h.point)).toBeLessThan(1e-6);
					expect(ba.some((g) => vecDistance(g.point, h.point) < 1e-6)).toBe(true);
				}
			}),
			{ numRuns: 200, seed: 228 }
		);
	});

	it('path against path finds the crossing of two polylines', () => {
		const hits = pathIntersections(pathFromPolyline([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }]), pathFromPolyline([{ x: 5, y: 5 }, { x: 15, y: 5 }]));
		expect(hits.map((h) => [h.segmentIndex, h.otherSegmentIndex, h.point.x, h.point.y])).toEqual([[1, 0, 10, 5]]);
	});
});
