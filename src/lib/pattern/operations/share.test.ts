import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { randomBlockArbitrary } from '../fixtures/random-block';
import { segmentPointAt, vecLerp } from '../kernel';
import { ledgerBalance, shapingChecks } from '../ledger';
import { pieceMetrics } from '../metrics';
import { share, resolveShares } from './share';

const side = (f: number) => vecLerp({ x: 235, y: 230 }, { x: 225, y: 440 }, f);

describe('share', () => {
	it('splits the shoulder dart into side and centre-front darts; parts sum to the whole', () => {
		// centre front as a seam (cut as a pair): a dart may open there, never on a fold
		const block = { ...frontBodiceBlock(), foldLine: null, cut: 'pair' as const };
		const r = share(block, {
			dartId: 'shoulder-dart',
			parts: [
				{ to: side(0.3), fraction: 0.6, newDartId: 'side-dart' },
				{ to: { x: 0, y: 200 }, fraction: 0.4, newDartId: 'cf-dart' }
			]
		});
		if (!r.ok) throw new Error(r.error.message);
		const mb = pieceMetrics(block);
		const ma = pieceMetrics(r.piece);
		const side1 = ma.darts.find((d) => d.id === 'side-dart')!;
		const cf = ma.darts.find((d) => d.id === 'cf-dart')!;
		expect(side1.angleRad + cf.angleRad).toBeCloseTo(mb.darts[0].angleRad, 12);
		expect(side1.angleRad / mb.darts[0].angleRad).toBeCloseTo(0.6, 12);
		expect(ma.darts.some((d) => d.id === 'shoulder-dart')).toBe(false);
		expect(shapingChecks(block, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
		expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
	});

	it('can leave part of the dart in place', () => {
		const block = frontBodiceBlock();
		const r = share(block, { dartId: 'shoulder-dart', parts: [{ to: side(0.3), fraction: 0.5 }], keep: { fraction: 0.5 } });
		if (!r.ok) throw new Error(r.error.message);
		const ma = pieceMetrics(r.piece);
		const mb = pieceMetrics(block);
		expect(ma.darts.find((d) => d.id === 'shoulder-dart')!.angleRad).toBeCloseTo(mb.darts[0].angleRad / 2, 12);
		expect(shapingChecks(block, r.piece, r.ledgerEntries).every((c) => c.passed)).toBe(true);
	});

	it('refuses fractions that do not sum to the whole', () => {
		const r = share(frontBodiceBlock(), {
			dartId: 'shoulder-dart',
			parts: [
				{ to: side(0.3), fraction: 0.5 },
				{ to: side(0.6), fraction: 0.3 }
			]
		});
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.error.code).toBe('shares_do_not_sum');
			expect(r.error.message).toMatch(/missing/);
		}
	});
	it('refuses a zero or negative share', () => {
		const r = share(frontBodiceBlock(), { dartId: 'shoulder-dart', parts: [{ to: side(0.3), fraction: 1.2 }, { to: side(0.6), fraction: -0.2 }] });
		expect(!r.ok && r.error.code).toBe('share_not_positive');
	});
	it('refuses two parts at the same point', () => {
		const r = share(frontBodiceBlock(), { dartId: 'shoulder-dart', parts: [{ to: side(0.3), fraction: 0.5 }, { to: side(0.3), fraction: 0.5 }] });
		expect(!r.ok && r.error.code).toBe('targets_coincide');
	});
	it('refuses an unknown dart', () => {
		const r = share(frontBodiceBlock(), { dartId: 'x', parts: [{ to: side(0.3), fraction: 1 }] });
		expect(!r.ok && r.error.code).toBe('unknown_dart');
	});

	it('property: random fractions summing to one keep the apex angle and every check', () => {
		const arb = randomBlockArbitrary().chain((blk) =>
			fc.record({
				blk: fc.constant(blk),
				picks: fc.uniqueArray(fc.constantFrom(...blk.bodySegmentIndices), { minLength: 1, maxLength: 3 }),
				weights: fc.array(fc.double({ min: 0.1, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }),
				t: fc.double({ min: 0.1, max: 0.9, noNaN: true })
			})
		);
		fc.assert(
			fc.property(arb, ({ blk, picks, weights, t }) => {
				const w = picks.map((_, i) => weights[i]);
				const total = w.reduce((s, v) => s + v, 0);
				const parts = picks.map((seg, i) => ({ to: segmentPointAt(blk.piece.outline.segments[seg], t), fraction: w[i] / total }));
				const sum = parts.reduce((s, p) => s + p.fraction, 0);
				expect(resolveShares(blk.angleRad, parts).ok).toBe(Math.abs(sum - 1) * blk.angleRad <= (0.01 * Math.PI) / 180);
				const r = share(blk.piece, { dartId: 'd', parts });
				if (!r.ok) throw new Error(r.error.message);
				const ma = pieceMetrics(r.piece);
				expect(ma.darts.reduce((s, d) => s + d.angleRad, 0)).toBeCloseTo(blk.angleRad, 10);
				expect(shapingChecks(blk.piece, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
			}),
			{ numRuns: 80 }
		);
	});
});
