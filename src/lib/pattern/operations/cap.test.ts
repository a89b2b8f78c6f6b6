import { describe, expect, it } from 'vitest';
import { pieceFromInput } from '../piece';
import type { Piece } from '../piece-schema';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { segmentEnd, segmentLineIntersections, vecDistance, vecSub, type Vec } from '../kernel';
import { cap } from './cap';

/** Dart opening upward from the origin; the seam leaves each leg end at `seamAngleRad` to the leg (π/2 = square). */
function dartPiece(L: number, thetaRad: number, seamTurn: number, seamLen = 80): Piece {
	const h = thetaRad / 2;
	const P = { x: 0, y: 0 };
	const L1 = { x: -L * Math.sin(h), y: -L * Math.cos(h) };
	const L2 = { x: L * Math.sin(h), y: -L * Math.cos(h) };
	// direction along leg1 away from the apex is u1 = (−sin h, −cos h); the seam leaves L1 turned by seamTurn from it
	const dir1 = { x: -Math.sin(h + seamTurn), y: -Math.cos(h + seamTurn) };
	const dir2 = { x: Math.sin(h + seamTurn), y: -Math.cos(h + seamTurn) };
	const A = { x: L1.x + seamLen * dir1.x, y: L1.y + seamLen * dir1.y };
	const B = { x: L2.x + seamLen * dir2.x, y: L2.y + seamLen * dir2.y };
	const pts: Vec[] = [A, L1, P, L2, B, { x: 200, y: 200 }, { x: -200, y: 200 }];
	return pieceFromInput({
		schemaVersion: 1,
		id: 'cap-test',
		name: 'Cap test (test)',
		outline: { segments: pts.map((p, i) => ({ kind: 'line' as const, p0: p, p1: pts[(i + 1) % pts.length] })) },
		apexes: [{ id: 'apex', kind: 'dart_pivot', label: '', point: P }],
		darts: [{ id: 'dart', apexId: 'apex', leg1End: L1, leg2End: L2 }],
		cut: 'single'
	});
}

describe('cap (dart truing, primer §5)', () => {
	it('seam square to the leg: the cap extends the seam straight to the bisector', () => {
		const L = 150;
		const theta = 0.3;
		const piece = dartPiece(L, theta, Math.PI / 2);
		const r = cap(piece, { dartId: 'dart', pressToward: 'leg1' });
		if (!r.ok) throw new Error(r.error.message);
		const c = r.piece.darts[0].cap!;
		expect(c.peak.x).toBeCloseTo(0, 9);
		expect(c.peak.y).toBeCloseTo(-L / Math.cos(theta / 2), 9);
		expect(c.edges.segments[0].p0).toEqual(piece.darts[0].leg1End);
		expect(vecDistance(segmentEnd(c.edges.segments[1]), piece.darts[0].leg2End)).toBeLessThan(1e-9);
		expect(r.piece.darts[0].pressToward).toBe('leg1');
		expect(r.piece.outline).toEqual(piece.outline);
	});
	it('general seam: peak on the bisector, first edge is the seam mirrored across the pressing leg', () => {
		const piece = dartPiece(150, 0.3, 1.2);
		for (const side of ['leg1', 'leg2'] as const) {
			const r = cap(piece, { dartId: 'dart', pressToward: side });
			if (!r.ok) throw new Error(r.error.message);
			const c = r.piece.darts[0].cap!;
			expect(c.peak.x).toBeCloseTo(0, 9);
			// the cap edge from the pressing-side leg end, mirrored back across that leg, runs along the seam
			const d = piece.darts[0];
			const E = side === 'leg1' ? d.leg1End : d.leg2End;
			const seamOther = side === 'leg1' ? piece.outline.segments[0].p0 : segmentEnd(piece.outline.segments[3]);
			const seamDir = vecSub(seamOther, E);
			// mirror the peak across the leg line (apex → E) and check it lies on the seam line
			const u = { x: E.x / Math.hypot(E.x, E.y), y: E.y / Math.hypot(E.x, E.y) };
			const dot = c.peak.x * u.x + c.peak.y * u.y;
			const back = { x: 2 * dot * u.x - c.peak.x, y: 2 * dot * u.y - c.peak.y };
			const hits = segmentLineIntersections({ kind: 'line', p0: E, p1: { x: E.x + seamDir.x * 10, y: E.y + seamDir.y * 10 } }, back, { x: -seamDir.y, y: seamDir.x });
			expect(hits.length).toBe(1);
			expect(vecDistance(hits[0].point, back)).toBeLessThan(1e-9);
		}
	});
	it('trues the shoulder dart of the demo block', () => {
		const r = cap(frontBodiceBlock(), { dartId: 'shoulder-dart', pressToward: 'leg1' });
		expect(r.ok).toBe(true);
	});
	it('refuses an unknown dart', () => {
		const r = cap(dartPiece(150, 0.3, Math.PI / 2), { dartId: 'x', pressToward: 'leg1' });
		expect(!r.ok && r.error.code).toBe('unknown_dart');
	});
	it('refuses when the folded seam never meets the bisector', () => {
		// seam carries straight on along the leg line: folded across the leg it is itself and runs away
		const r = cap(dartPiece(150, 0.3, 0.0001 - 0.0001), { dartId: 'dart', pressToward: 'leg1' });
		expect(!r.ok && r.error.code).toBe('cap_not_found');
	});
	it('refuses unequal legs', () => {
		const p = dartPiece(150, 0.3, Math.PI / 2);
		const d = p.darts[0];
		const L2 = { x: d.leg2End.x * 1.1, y: d.leg2End.y * 1.1 };
		const same = (a: Vec) => a.x === d.leg2End.x && a.y === d.leg2End.y;
		const segs = p.outline.segments.map((s) => (s.kind === 'line' ? { ...s, p0: same(s.p0) ? L2 : s.p0, p1: same(s.p1) ? L2 : s.p1 } : s));
		const q = pieceFromInput({ ...p, outline: { segments: segs }, darts: [{ ...d, leg2End: L2 }] });
		const r = cap(q, { dartId: 'dart', pressToward: 'leg1' });
		expect(!r.ok && r.error.code).toBe('legs_unequal');
	});
});
