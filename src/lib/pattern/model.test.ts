import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from './fixtures/front-bodice-block';
import { pieceSchema } from './piece-schema';
import { pieceStructureProblems } from './piece';
import { pieceMetrics } from './metrics';
import { shapingChecks } from './ledger';

describe('piece model', () => {
	it('fixture parses and has no structural problems', () => {
		const p = frontBodiceBlock();
		expect(pieceSchema.safeParse(p).success).toBe(true);
		expect(pieceStructureProblems(p)).toEqual([]);
	});
	it('parsed pieces are plain arrays, not frozen ones (V8 reads frozen arrays on a slow path in every kernel loop)', () => {
		const piece = pieceSchema.parse(frontBodiceBlock());
		expect(Object.isFrozen(piece.outline.segments)).toBe(false);
		for (const list of [piece.apexes, piece.darts, piece.pleats, piece.notches, piece.internalLines, piece.drillHoles, piece.labels]) {
			expect(Array.isArray(list) && !Object.isFrozen(list)).toBe(true);
		}
	});

	it('schema refuses non-finite numbers and wrong schemaVersion', () => {
		const p = frontBodiceBlock();
		const bad = { ...p, apexes: [{ ...p.apexes[0], point: { x: Infinity, y: 0 } }] };
		expect(pieceSchema.safeParse(bad).success).toBe(false);
		const nan = { ...p, apexes: [{ ...p.apexes[0], point: { x: NaN, y: 0 } }] };
		expect(pieceSchema.safeParse(nan).success).toBe(false);
		expect(pieceSchema.safeParse({ ...p, schemaVersion: 2 }).success).toBe(false);
	});
	it('metrics of the fixture', () => {
		const m = pieceMetrics(frontBodiceBlock());
		expect(m.darts).toHaveLength(2);
		expect(m.darts[0].intakeMm).toBeCloseTo(70, 9);
		expect(m.darts[1].intakeMm).toBeCloseTo(30, 9);
		expect(m.apexTotals[0].totalAngleRad).toBeCloseTo(m.darts[0].angleRad + m.darts[1].angleRad, 12);
		expect(m.areaMm2).toBeGreaterThan(50000);
		// CF neck, shoulder, armhole, side, waist, CF: six seams between corners
		expect(m.seams.length).toBe(6);
	});
	it('identical pieces pass every shaping check', () => {
		const p = frontBodiceBlock();
		const checks = shapingChecks(p, p, []);
		expect(checks.every((c) => c.passed)).toBe(true);
	});
});
