import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import { cubicSegment, lineSegment, outlineFromPolyline, pathFromPolyline, type Segment, type Vec } from '../kernel';
import type { Piece } from '../piece-schema';
import { pieceOf } from './fixtures/simple-pieces';
import type { SeamPair } from './panel-types';
import { TRUING_TOLERANCE_MM } from './panel-tolerances';
import { trueSeam } from './true-seam';

const bez = (s: Segment) => {
	if (s.kind !== 'cubic') throw new Error('cubic expected');
	return new Bezier(s.p0.x, s.p0.y, s.p1.x, s.p1.y, s.p2.x, s.p2.y, s.p3.x, s.p3.y);
};
/** Arc length from the start of a cubic to the point nearest p, by bezier-js (independent of the kernel). */
const lengthTo = (s: Segment, p: Vec) => {
	// bezier-js 6 ships no types; the shared shim (geometry/test-support) lists only length() and bbox()
	const b = bez(s) as unknown as { get(t: number): Vec; split(t0: number, t1: number): { length(): number } };
	// nearest parameter by a dense scan then golden-section refinement (bezier-js project() is coarse)
	const d = (t: number) => Math.hypot(b.get(t).x - p.x, b.get(t).y - p.y);
	let best = 0;
	for (let i = 0; i <= 4000; i++) if (d(i / 4000) < d(best)) best = i / 4000;
	let lo = Math.max(0, best - 1 / 4000);
	let hi = Math.min(1, best + 1 / 4000);
	for (let k = 0; k < 60; k++) {
		const m1 = lo + (hi - lo) / 3;
		const m2 = hi - (hi - lo) / 3;
		if (d(m1) < d(m2)) hi = m2;
		else lo = m1;
	}
	const t = (lo + hi) / 2;
	return t <= 0 ? 0 : b.split(0, t).length();
};

function curvedPair(bulgeA = 20, bulgeB = 35) {
	const ea = cubicSegment({ x: 100, y: 0 }, { x: 100 + bulgeA, y: 100 }, { x: 100 + bulgeA, y: 200 }, { x: 100, y: 300 });
	const eb = cubicSegment({ x: 100, y: 0 }, { x: 100 + bulgeB, y: 100 }, { x: 100 + bulgeB, y: 200 }, { x: 100, y: 300 });
	const a: Piece = pieceOf('a', { segments: [lineSegment({ x: 0, y: 0 }, { x: 100, y: 0 }), ea, lineSegment({ x: 100, y: 300 }, { x: 0, y: 300 }), lineSegment({ x: 0, y: 300 }, { x: 0, y: 0 })] });
	const ebRev = cubicSegment(eb.p3, eb.p2, eb.p1, eb.p0);
	const b: Piece = pieceOf('b', { segments: [lineSegment({ x: 100, y: 0 }, { x: 260, y: 0 }), lineSegment({ x: 260, y: 0 }, { x: 260, y: 300 }), lineSegment({ x: 260, y: 300 }, { x: 100, y: 300 }), ebRev] });
	const pair: SeamPair = { id: 'side', a: { pieceId: 'a', edge: { segments: [ea] } }, b: { pieceId: 'b', edge: { segments: [eb] } }, allowedEaseMm: 0, toleranceMm: TRUING_TOLERANCE_MM };
	return { a, b, pair };
}

describe('true_seam', () => {
	it('trues a curved seam to the professional tolerance of 1/16 in (reference-values row 25, C/P), checked with bezier-js', () => {
		const { a, b, pair } = curvedPair();
		const r = trueSeam([a, b], pair, { adjust: { side: 'b', end: 'end' }, notches: [{ atMm: 100 }, { atMm: 200, count: 2 }] });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.before.deviationMm).toBeGreaterThan(TRUING_TOLERANCE_MM); // it needed truing
		expect(r.before.withinTolerance).toBe(false);
		expect(r.after.withinTolerance).toBe(true);
		// bezier-js lengths of the two trued edges
		const la = bez(r.seamPairs[0].a.edge.segments[0]).length();
		const lb = bez(r.seamPairs[0].b.edge.segments[0]).length();
		expect(Math.abs(la - lb)).toBeLessThanOrEqual(TRUING_TOLERANCE_MM); // row 25: 1/16 in ≈ 1.6 mm
		expect(Math.abs(la - lb)).toBeLessThan(1e-3);
		// matching notches: same arc length from the shared start on both pieces (bezier-js)
		const [pa, pb] = r.pieces;
		for (const [k, at] of [100, 200].entries()) {
			const na = pa.notches.find((n) => n.id === `side-notch-${k + 1}`)!;
			const nb = pb.notches.find((n) => n.id === `side-notch-${k + 1}`)!;
			expect(lengthTo(r.seamPairs[0].a.edge.segments[0], na.at)).toBeCloseTo(at, 3);
			expect(lengthTo(r.seamPairs[0].b.edge.segments[0], nb.at)).toBeCloseTo(at, 3);
			expect(na.count).toBe(k === 0 ? 1 : 2);
		}
	});

	it('keeps a designed ease: a − b ends equal to the allowed ease', () => {
		const { a, b, pair } = curvedPair(30, 20);
		const r = trueSeam([a, b], { ...pair, allowedEaseMm: 4 }, { adjust: { side: 'a', end: 'end' } });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.after.differenceMm).toBeCloseTo(4, 6);
	});

	it('measures with darts folded out (trade-primer §7)', () => {
		// bottom edge of c has a 20 mm dart cut into it; d's top edge is 180 mm straight
		const c = pieceOf('c', outlineFromPolyline([{ x: 0, y: 0 }, { x: 200, y: 0 }, { x: 200, y: 300 }, { x: 110, y: 300 }, { x: 100, y: 200 }, { x: 90, y: 300 }, { x: 0, y: 300 }]), {
			apexes: [{ id: 'p', kind: 'dart_pivot', label: '', point: { x: 100, y: 200 } }],
			darts: [{ id: 'dart', apexId: 'p', leg1End: { x: 110, y: 300 }, leg2End: { x: 90, y: 300 }, movingLeg: 'leg2' }]
		});
		const d = pieceOf('d', outlineFromPolyline([{ x: 0, y: 300 }, { x: 180, y: 300 }, { x: 180, y: 400 }, { x: 0, y: 400 }]));
		const pair: SeamPair = {
			id: 'waist',
			a: { pieceId: 'c', edge: pathFromPolyline([{ x: 0, y: 300 }, { x: 90, y: 300 }, { x: 100, y: 200 }, { x: 110, y: 300 }, { x: 200, y: 300 }]) },
			b: { pieceId: 'd', edge: pathFromPolyline([{ x: 0, y: 300 }, { x: 180, y: 300 }]) },
			allowedEaseMm: 0,
			toleranceMm: TRUING_TOLERANCE_MM
		};
		const r = trueSeam([c, d], pair);
		if (!r.ok) throw new Error(r.error.message);
		expect(r.before.aMm).toBeCloseTo(180, 9);
		expect(r.before.withinTolerance).toBe(true);
	});

	it('refuses notches off the seam and an edge that is not on its piece', () => {
		const { a, b, pair } = curvedPair();
		const off = trueSeam([a, b], pair, { notches: [{ atMm: 5000 }] });
		expect(off.ok).toBe(false);
		if (!off.ok) expect(off.error.message).toMatch(/not on the seam/);
		const wrong = trueSeam([a, b], { ...pair, a: { pieceId: 'a', edge: pathFromPolyline([{ x: 0, y: 50 }, { x: 50, y: 50 }]) } });
		expect(wrong.ok).toBe(false);
		if (!wrong.ok) expect(wrong.error.code).toBe('seam_not_on_piece');
	});
});
