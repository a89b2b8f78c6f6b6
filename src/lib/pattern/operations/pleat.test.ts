import { describe, expect, it } from 'vitest';
import { simpleDartBlock } from '../fixtures/simple-dart-block';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { segmentPointAt, vecDistance, vecLerp } from '../kernel';
import { shapingChecks } from '../ledger';
import { pieceMetrics } from '../metrics';
import { equalIntakeAngles, pleat } from './pleat';

const block = simpleDartBlock(250, 70);
const segs = block.outline.segments;
// top seam either side of the dart mouth (segment 0 runs from leg 2 to the right corner, 4 from the left corner to leg 1)
const three = [segmentPointAt(segs[0], 0.15), segmentPointAt(segs[0], 0.45), segmentPointAt(segs[4], 0.8)];

describe('pleat', () => {
	it('equal intake: the chord intakes at the seam are equal and the angles sum to the dart', () => {
		const r = pleat(block, { dartId: 'dart', at: three, mode: 'equal_intake', foldToward: 'leg1' });
		if (!r.ok) throw new Error(r.error.message);
		const m = pieceMetrics(r.piece);
		expect(m.pleats).toHaveLength(3);
		for (const p of m.pleats) expect(p.intakeMm).toBeCloseTo(m.pleats[0].intakeMm, 9);
		expect(m.pleats.reduce((s, p) => s + p.angleRad, 0)).toBeCloseTo(pieceMetrics(block).darts[0].angleRad, 12);
		expect(r.piece.darts).toHaveLength(0);
		expect(shapingChecks(block, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
		expect(r.ledgerEntries.map((e) => e.kind)).toEqual(['dart', 'pleat', 'pleat', 'pleat']);
	});
	it('equal angle: every pleat has θ/k', () => {
		const r = pleat(block, { dartId: 'dart', at: three, mode: 'equal_angle', kind: 'tuck', stitchLengthMm: 60, foldToward: 'leg2' });
		if (!r.ok) throw new Error(r.error.message);
		const theta = pieceMetrics(block).darts[0].angleRad;
		for (const p of pieceMetrics(r.piece).pleats) expect(p.angleRad).toBeCloseTo(theta / 3, 12);
		expect(r.piece.pleats.every((p) => p.kind === 'tuck' && p.stitchLengthMm === 60)).toBe(true);
		expect(r.ledgerEntries.filter((e) => e.kind === 'tuck')).toHaveLength(3);
	});
	it('stores the fold direction: fold line laid onto the placement line, arrow between them', () => {
		const r = pleat(block, { dartId: 'dart', at: three.slice(0, 1), mode: 'equal_angle', foldToward: 'leg2' });
		if (!r.ok) throw new Error(r.error.message);
		const p = r.piece.pleats[0];
		expect(p.foldToward).toBe('leg2');
		expect(p.placementLine.from).toEqual(p.leg2End);
		expect(p.foldLine.from).toEqual(p.leg1End);
		expect(p.foldArrow).toEqual({ from: p.leg1End, to: p.leg2End });
	});
	it('default fold direction on the demo block follows the centre-front fold line (vertical pleats press toward centre)', () => {
		const b = frontBodiceBlock();
		const d = b.darts.find((x) => x.id === 'waist-dart')!;
		const at = [vecLerp(d.leg1End, { x: 225, y: 440 }, 0.3), vecLerp(d.leg2End, { x: 0, y: 460 }, 0.2)];
		const r = pleat(b, { dartId: 'waist-dart', at, mode: 'equal_intake' });
		if (!r.ok) throw new Error(r.error.message);
		for (const p of r.piece.pleats) {
			// placement line is the edge nearer centre front (x = 0)
			expect(p.placementLine.from.x).toBeLessThan(p.foldLine.from.x);
		}
		expect(shapingChecks(b, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
	});
	it('parallel pleats: substitute pivots on a circle round the apex (reference-values row 13, P: ≤ 25.4 mm)', () => {
		const at = [segmentPointAt(segs[0], 0.05), segmentPointAt(segs[0], 0.2)];
		const r = pleat(block, { dartId: 'dart', at, mode: 'equal_intake', parallel: { pivotRadiusMm: 20 }, foldToward: 'leg1' });
		if (!r.ok) throw new Error(r.error.message);
		for (const p of r.piece.pleats) {
			expect(vecDistance(p.pivot1!, { x: 0, y: 0 })).toBeCloseTo(20, 9);
			expect(vecDistance(p.pivot2!, { x: 0, y: 0 })).toBeCloseTo(20, 9);
		}
		expect(shapingChecks(block, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
	});
	it('equalIntakeAngles solves 2rᵢ·sin(φᵢ/2) = w with Σφᵢ = θ', () => {
		const radii = [200, 250, 310];
		const phis = equalIntakeAngles(radii, 0.3);
		expect(phis.reduce((s, a) => s + a, 0)).toBeCloseTo(0.3, 14);
		const w = radii.map((r, i) => 2 * r * Math.sin(phis[i] / 2));
		expect(w[1]).toBeCloseTo(w[0], 9);
		expect(w[2]).toBeCloseTo(w[0], 9);
	});
	it('refuses a substitute pivot radius over 25.4 mm', () => {
		const r = pleat(block, { dartId: 'dart', at: three, mode: 'equal_angle', parallel: { pivotRadiusMm: 30 } });
		expect(!r.ok && r.error.code).toBe('pivot_radius_too_large');
	});
	it('refuses parallel pleat lines that miss the pivot circle', () => {
		const wide = [segmentPointAt(segs[0], 0.9), segmentPointAt(segs[4], 0.1)];
		const r = pleat(block, { dartId: 'dart', at: wide, mode: 'equal_angle', parallel: { pivotRadiusMm: 10 } });
		expect(!r.ok && r.error.code).toBe('pleat_line_misses_pivot_circle');
	});
	it('refuses a pleat point on the dart, an unknown dart and bad params', () => {
		const onDart = pleat(block, { dartId: 'dart', at: [vecLerp(block.darts[0].leg1End, { x: 0, y: 0 }, 0.5)], mode: 'equal_angle' });
		expect(!onDart.ok && onDart.error.code).toBe('target_inside_dart');
		const unknown = pleat(block, { dartId: 'x', at: three, mode: 'equal_angle' });
		expect(!unknown.ok && unknown.error.code).toBe('unknown_dart');
		const bad = pleat(block, { dartId: 'dart', at: [], mode: 'equal_angle' });
		expect(!bad.ok && bad.error.code).toBe('invalid_params');
	});
});
