import { describe, expect, it } from 'vitest';
import { outlineArea, outlineFromPolyline, pathFromPolyline } from '../kernel';
import { ledgerBalance } from '../ledger';
import { wedgeGeometry } from '../piece';
import { join } from './join';
import { twoPanelWedge } from './fixtures/two-panel-wedge';

describe('join with a wedge at a divergence point (trade-primer §6, "Merging panels")', () => {
	it('closes the wedge by turning one panel about D; the angle reopens as a dart at D and is posted to the ledger', () => {
		const { left, right, pair, D, thetaRad } = twoPanelWedge(12, 150);
		const r = join([left, right], pair, { dartId: 'moved' });
		if (!r.ok) throw new Error(r.error.message);
		const piece = r.pieces[0];
		expect(r.report.values.closedAngleRad).toBeCloseTo(thetaRad, 12);
		expect(outlineArea(piece.outline)).toBeCloseTo(outlineArea(left.outline) + outlineArea(right.outline), 6);
		const dart = piece.darts.find((d) => d.id === 'moved')!;
		expect(dart).toBeDefined();
		const g = wedgeGeometry(D, dart.leg1End, dart.leg2End);
		expect(g.angleRad).toBeCloseTo(thetaRad, 12);
		expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
		expect(r.ledgerEntries[0].angleRad).toBeCloseTo(-thetaRad, 12);
		expect(r.ledgerEntries[1].angleRad).toBeCloseTo(thetaRad, 12);
		expect(r.ledgerEntries[1].label).toMatch(/dart moved/);
	});

	it('names the seam or dart the user picks to carry the angle', () => {
		const { left, right, pair } = twoPanelWedge();
		const r = join([left, right], pair, { carriedBy: 'neckline seam' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.ledgerEntries[1].label).toBe('carried by neckline seam');
	});

	it('keeps the wedge as a dart when asked (joined where the edges coincide only)', () => {
		const { left, right, pair, D, thetaRad } = twoPanelWedge(12, 150);
		const r = join([left, right], pair, { wedge: 'keep_as_dart' });
		if (!r.ok) throw new Error(r.error.message);
		const dart = r.pieces[0].darts[0];
		expect(wedgeGeometry(D, dart.leg1End, dart.leg2End).angleRad).toBeCloseTo(thetaRad, 12);
		expect(r.report.values.closedAngleRad).toBe(0);
	});

	it('refuses when the open edges do not meet after closing (seam not trued)', () => {
		const { left, right, pair, D } = twoPanelWedge(12, 150);
		const wr = { x: 100 + 250 * Math.tan((6 * Math.PI) / 180), y: 400 };
		const short = { x: D.x + (wr.x - D.x) * 0.95, y: D.y + (wr.y - D.y) * 0.95 };
		const r2 = {
			...right,
			outline: outlineFromPolyline([{ x: 100, y: 0 }, { x: 200, y: 0 }, { x: 200, y: 400 }, { x: short.x, y: 400 }, short, D])
		};
		const p2 = { ...pair, b: { pieceId: 'right', edge: pathFromPolyline([{ x: 100, y: 0 }, D, short]) } };
		const r = join([left, r2], p2);
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.error.code).toBe('wedge_not_closing');
			expect(r.error.message).toMatch(/true the seam/);
		}
	});
});
