import { describe, expect, it } from 'vitest';
import { pieceFromInput } from '../piece';
import type { Piece } from '../piece-schema';
import { shapingChecks } from '../ledger';
import { pieceMetrics } from '../metrics';
import { spread } from './spread';
import { outlineNearestLocation } from '../kernel';

function polygonPiece(points: { x: number; y: number }[]): Piece {
	return pieceFromInput({
		schemaVersion: 1,
		id: 'panel',
		name: 'Skirt panel (test)',
		outline: { segments: points.map((p, i) => ({ kind: 'line' as const, p0: p, p1: points[(i + 1) % points.length] })) },
		notches: [{ id: 'n', at: { x: 250, y: 400 }, count: 1 }],
		cut: 'pair'
	});
}
const rect = polygonPiece([
	{ x: 0, y: 0 },
	{ x: 300, y: 0 },
	{ x: 300, y: 400 },
	{ x: 0, y: 400 }
]);

describe('spread', () => {
	it('hinged: two slashes from the hem hinged at the waist add the asked area (½r²·sinφ each, reference-values row 18, D)', () => {
		const r = spread(rect, {
			mode: 'hinged',
			slashes: [
				{ from: { x: 100, y: 400 }, to: { x: 100, y: 0 }, widthMm: 40 },
				{ from: { x: 200, y: 400 }, to: { x: 200, y: 0 }, widthMm: 40 }
			]
		});
		if (!r.ok) throw new Error(r.error.message);
		const phi = 2 * Math.asin(40 / 800);
		const expected = 2 * 0.5 * 400 * 400 * Math.sin(phi);
		expect(r.report.values.expectedAreaChangeMm2).toBeCloseTo(expected, 9);
		expect(r.report.values.actualAreaChangeMm2).toBeCloseTo(expected, 6);
		// the hinged edge keeps its length, the hem gains 2 × 40 mm
		expect(r.report.values.addedEdgeLengthMm).toBeCloseTo(80, 9);
		expect(pieceMetrics(r.piece).seamLengthMm - pieceMetrics(rect).seamLengthMm).toBeCloseTo(80, 9);
		expect(shapingChecks(rect, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
		expect(r.ledgerEntries.every((e) => e.kind === 'fullness')).toBe(true);
		// the notch moved with its part and is still on the stitching line
		expect(outlineNearestLocation(r.piece.outline, r.piece.notches[0].at).distance).toBeLessThan(1e-6);
	});
	it('hinged by angle, with a shared hinge (fan)', () => {
		const r = spread(rect, {
			mode: 'hinged',
			slashes: [
				{ from: { x: 100, y: 400 }, to: { x: 150, y: 0 }, angleRad: 0.1 },
				{ from: { x: 200, y: 400 }, to: { x: 150, y: 0 }, angleRad: 0.1 }
			]
		});
		if (!r.ok) throw new Error(r.error.message);
		expect(r.report.values.actualAreaChangeMm2).toBeCloseTo(r.report.values.expectedAreaChangeMm2, 6);
	});
	it('parallel: area added = slash length × width; both edges lengthen', () => {
		const r = spread(rect, { mode: 'parallel', slashes: [{ from: { x: 100, y: 400 }, to: { x: 100, y: 0 }, widthMm: 30 }] });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.report.values.expectedAreaChangeMm2).toBeCloseTo(12000, 9);
		expect(r.report.values.actualAreaChangeMm2).toBeCloseTo(12000, 6);
		expect(r.report.values.addedEdgeLengthMm).toBeCloseTo(60, 9);
		expect(shapingChecks(rect, r.piece, r.ledgerEntries).filter((c) => !c.passed)).toEqual([]);
	});
	it('refuses a slash end off the outline', () => {
		const r = spread(rect, { mode: 'parallel', slashes: [{ from: { x: 100, y: 380 }, to: { x: 100, y: 0 }, widthMm: 30 }] });
		expect(!r.ok && r.error.code).toBe('slash_off_outline');
	});
	it('refuses a slash that leaves the piece', () => {
		const ell = polygonPiece([
			{ x: 0, y: 0 },
			{ x: 100, y: 0 },
			{ x: 100, y: 200 },
			{ x: 300, y: 200 },
			{ x: 300, y: 400 },
			{ x: 0, y: 400 }
		]);
		const r = spread(ell, { mode: 'hinged', slashes: [{ from: { x: 200, y: 400 }, to: { x: 50, y: 0 }, widthMm: 20 }] });
		expect(!r.ok && r.error.code).toBe('slash_leaves_piece');
	});
	it('refuses crossing slashes', () => {
		const r = spread(rect, {
			mode: 'hinged',
			slashes: [
				{ from: { x: 100, y: 400 }, to: { x: 200, y: 0 }, widthMm: 20 },
				{ from: { x: 200, y: 400 }, to: { x: 100, y: 0 }, widthMm: 20 }
			]
		});
		expect(!r.ok && r.error.code).toBe('slash_lines_cross');
	});
	it('refuses a spread too wide or not positive', () => {
		const wide = spread(rect, { mode: 'hinged', slashes: [{ from: { x: 100, y: 400 }, to: { x: 100, y: 0 }, widthMm: 900 }] });
		expect(!wide.ok && wide.error.code).toBe('spread_too_wide');
		const zero = spread(rect, { mode: 'parallel', slashes: [{ from: { x: 100, y: 400 }, to: { x: 100, y: 0 }, widthMm: 0 }] });
		expect(!zero.ok && zero.error.code).toBe('spread_not_positive');
	});
});
