import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { simpleDartBlock } from '../fixtures/simple-dart-block';
import { pieceFromInput } from '../piece';
import { pullBack } from './pull-back';

describe('pull_back', () => {
	it('pulls the shoulder dart point back 25 mm on the demo block; outline and ledger unchanged', () => {
		const block = frontBodiceBlock();
		const r = pullBack(block, { dartId: 'shoulder-dart', clearanceMm: 25 });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.outline).toEqual(block.outline);
		const d = r.piece.darts.find((x) => x.id === 'shoulder-dart')!;
		expect(d.pullBack!.clearanceMm).toBe(25);
		expect(d.pullBack!.sewnAngleRad).toBeGreaterThan(0);
	});
	it('refuses a clearance longer than the dart', () => {
		const r = pullBack(simpleDartBlock(100, 30), { dartId: 'dart', clearanceMm: 120 });
		expect(!r.ok && r.error.code).toBe('clearance_too_long');
	});
	it('refuses a clearance of zero or less', () => {
		const r = pullBack(simpleDartBlock(100, 30), { dartId: 'dart', clearanceMm: 0 });
		expect(!r.ok && r.error.code).toBe('clearance_not_positive');
	});
	it('refuses unequal legs', () => {
		const b = simpleDartBlock(100, 30);
		const d = b.darts[0];
		// lengthen leg 2 by moving its end (and the outline with it) 5 mm further out
		const L2 = { x: d.leg2End.x * 1.05, y: d.leg2End.y * 1.05 };
		const segs = b.outline.segments.map((s) => (s.kind === 'line' ? { ...s, p0: s.p0 === d.leg2End ? L2 : s.p0, p1: s.p1 === d.leg2End ? L2 : s.p1 } : s));
		const piece = pieceFromInput({ ...b, outline: { segments: segs }, darts: [{ ...d, leg2End: L2 }] });
		const r = pullBack(piece, { dartId: 'dart', clearanceMm: 20 });
		expect(!r.ok && r.error.code).toBe('legs_unequal');
	});
	it('refuses an unknown dart', () => {
		const r = pullBack(simpleDartBlock(100, 30), { dartId: 'nope', clearanceMm: 20 });
		expect(!r.ok && r.error.code).toBe('unknown_dart');
	});
});
