import { describe, expect, it } from 'vitest';
import { outlineArea, outlineFromPolyline, pathFromPolyline, type Vec } from '../kernel';
import { ledgerBalance } from '../ledger';
import { recipeStepApply } from '../recipe/registry';
import { wedgeGeometry } from '../piece';
import { join } from './join';
import { separate } from './separate';
import { pieceOf } from './fixtures/simple-pieces';

/**
 * A 200 × 300 mm piece with a waist dart cut out to an apex 150 mm up (numbers of our own): the dart
 * opens 20 mm at the waist, θ = 2·atan(10/150).
 */
function dartedPiece() {
	const apex: Vec = { x: 100, y: 150 };
	const leg1End: Vec = { x: 110, y: 300 };
	const leg2End: Vec = { x: 90, y: 300 };
	const piece = pieceOf('front', outlineFromPolyline([{ x: 0, y: 0 }, { x: 200, y: 0 }, { x: 200, y: 300 }, leg1End, apex, leg2End, { x: 0, y: 300 }]), {
		apexes: [{ id: 'bp', kind: 'bust_point', label: 'BP', point: apex }],
		darts: [{ id: 'waist-dart', apexId: 'bp', leg1End, leg2End, movingLeg: 'leg2' }],
		grainline: { from: { x: 40, y: 50 }, to: { x: 40, y: 250 }, arrowheads: 'both' }
	});
	return { piece, apex, leg1End, leg2End, thetaRad: 2 * Math.atan(10 / 150) };
}

const near = (p: Vec, q: Vec) => Math.hypot(p.x - q.x, p.y - q.y) < 1e-6;

describe('separate through a dart apex, then join back along the seam separate made', () => {
	it('gives back the original piece, dart included, and the ledger balances over both steps', () => {
		const { piece, apex, leg1End, leg2End, thetaRad } = dartedPiece();
		const s = separate(piece, { path: pathFromPolyline([{ x: 100, y: 0 }, apex]), pieceIds: ['left', 'right'] });
		if (!s.ok) throw new Error(s.error.message);
		// the cut absorbed the dart: neither part has it
		expect(s.pieces.every((p) => p.darts.length === 0)).toBe(true);
		const j = join(s.pieces, s.seamPairs[0], { pieceId: 'front' });
		if (!j.ok) throw new Error(j.error.message);
		const back = j.pieces[0];
		expect(outlineArea(back.outline)).toBeCloseTo(outlineArea(piece.outline), 6);
		expect(back.darts).toHaveLength(1);
		const d = back.darts[0];
		expect(d.apexId).toBe('bp');
		expect(near(d.leg1End, leg1End) && near(d.leg2End, leg2End)).toBe(true);
		expect(wedgeGeometry(apex, d.leg1End, d.leg2End).angleRad).toBeCloseTo(thetaRad, 12);
		// what separate moved into the seam comes back to the dart: each apex balances over both steps
		expect(ledgerBalance([...s.ledgerEntries, ...j.ledgerEntries]).every((b) => b.balanced)).toBe(true);
		expect(j.ledgerEntries.some((e) => e.kind === 'dart' && Math.abs(e.angleRad - thetaRad) < 1e-12)).toBe(true);
	});

	it('the dart given back can be pivoted like any other', () => {
		const { piece, apex } = dartedPiece();
		const s = separate(piece, { path: pathFromPolyline([{ x: 100, y: 0 }, apex]), pieceIds: ['left', 'right'] });
		if (!s.ok) throw new Error(s.error.message);
		const j = join(s.pieces, s.seamPairs[0]);
		if (!j.ok) throw new Error(j.error.message);
		const back = j.pieces[0];
		const r = recipeStepApply(back, { op: 'pivot', params: { dartId: back.darts[0].id, to: { x: 200, y: 100 } } });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.darts).toHaveLength(1);
	});

	it('a plain seam with no dart at its ends stays a plain join (no dart is made up)', () => {
		const rect = pieceOf('rect', outlineFromPolyline([{ x: 0, y: 0 }, { x: 200, y: 0 }, { x: 200, y: 300 }, { x: 0, y: 300 }]), {
			apexes: [{ id: 'p', kind: 'bust_point', label: 'BP', point: { x: 100, y: 300 } }]
		});
		const s = separate(rect, { path: pathFromPolyline([{ x: 100, y: 0 }, { x: 100, y: 300 }]) });
		if (!s.ok) throw new Error(s.error.message);
		const j = join(s.pieces, s.seamPairs[0]);
		if (!j.ok) throw new Error(j.error.message);
		expect(j.pieces[0].darts).toEqual([]);
		expect(j.ledgerEntries).toEqual([]);
	});
});
