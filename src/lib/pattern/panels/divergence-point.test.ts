import { describe, expect, it } from 'vitest';
import { lineSegment, outlineFromPolyline, pathFromPolyline, type Vec } from '../kernel';
import { ledgerBalance } from '../ledger';
import { recipeStepApply } from '../recipe/registry';
import { carry } from './carry';
import { divergencePoint } from './divergence-point';
import { separate } from './separate';
import type { SeamPair } from './panel-types';
import { pieceOf } from './fixtures/simple-pieces';

/** A 200 × 300 mm piece with a waist dart to a bust point 150 mm up (numbers of our own). */
function separatedThroughTheBustPoint() {
	const apex: Vec = { x: 100, y: 150 };
	const l1: Vec = { x: 110, y: 300 };
	const l2: Vec = { x: 90, y: 300 };
	const piece = pieceOf('front', outlineFromPolyline([{ x: 0, y: 0 }, { x: 200, y: 0 }, { x: 200, y: 300 }, l1, apex, l2, { x: 0, y: 300 }]), {
		apexes: [{ id: 'bp', kind: 'bust_point', label: 'BP', point: apex }],
		darts: [{ id: 'waist-dart', apexId: 'bp', leg1End: l1, leg2End: l2, movingLeg: 'leg2' }]
	});
	const s = separate(piece, { path: pathFromPolyline([{ x: 100, y: 0 }, apex]), pieceIds: ['cf', 'side'] });
	if (!s.ok) throw new Error(s.error.message);
	const cf = s.pieces.find((p) => p.outline.segments.some((g) => g.p0.x === 0))!;
	const side = s.pieces.find((p) => p !== cf)!;
	// the seam between the two panels: down the cut to the bust point, then down each dart leg
	const pair: SeamPair = {
		id: 'seam',
		a: { pieceId: cf.id, edge: pathFromPolyline([{ x: 100, y: 0 }, apex, l2]) },
		b: { pieceId: side.id, edge: pathFromPolyline([{ x: 100, y: 0 }, apex, l1]) },
		allowedEaseMm: 0,
		toleranceMm: 0.05
	};
	return { s, cf, side, pair, thetaRad: 2 * Math.atan(10 / 150) };
}

const band = { segments: [lineSegment({ x: -20, y: 220 }, { x: 220, y: 220 })] };

describe('marking a divergence point', () => {
	it('after separating through a bust point, carry refuses for want of a divergence point', () => {
		const { cf, side, pair } = separatedThroughTheBustPoint();
		expect(cf.apexes.find((a) => a.id === 'bp')?.kind).toBe('bust_point');
		const r = carry([cf, side], [pair], { styleLine: band, fuse: 'below' });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.error.code).toBe('no_divergence_point');
	});

	it('marking the bust point as a divergence point lets carry close the wedge, and the ledger follows over separate, mark and carry', () => {
		const { s, cf, side, pair, thetaRad } = separatedThroughTheBustPoint();
		const m = divergencePoint(cf, { apexId: 'bp' });
		if (!m.ok) throw new Error(m.error.message);
		expect(m.piece.apexes.find((a) => a.id === 'bp')).toMatchObject({ kind: 'divergence', label: 'BP' });
		expect(m.ledgerEntries).toEqual([]);
		const r = carry([m.piece, side], [pair], { styleLine: band, fuse: 'below' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.seams[0].outcome).toBe('closed');
		expect(r.seams[0].angleRad).toBeCloseTo(thetaRad, 12);
		// the dart separate moved into the seam is now in the style seam: one apex, one balance
		const all = [...s.ledgerEntries, ...m.ledgerEntries, ...r.ledgerEntries];
		expect(all.every((e) => e.apexId === 'bp')).toBe(true);
		expect(ledgerBalance(all).every((b) => b.balanced)).toBe(true);
	});

	it('is a recipe step the server replays the same way', () => {
		const { cf } = separatedThroughTheBustPoint();
		const r = recipeStepApply(cf, { op: 'divergence_point', params: { apexId: 'bp' } });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.apexes.find((a) => a.id === 'bp')?.kind).toBe('divergence');
		const bad = recipeStepApply(cf, { op: 'divergence_point', params: {} });
		expect(bad.ok).toBe(false);
	});

	it('puts a new divergence point on the stitching line (snapped), and refuses one off it or a second of the same id', () => {
		const { side } = separatedThroughTheBustPoint();
		const r = divergencePoint(side, { at: { x: 200.4, y: 100 }, id: 'd2' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.apexes.find((a) => a.id === 'd2')).toMatchObject({ kind: 'divergence', point: { x: 200, y: 100 } });
		const off = divergencePoint(side, { at: { x: 150, y: 100 }, id: 'd3' });
		expect(off.ok).toBe(false);
		if (!off.ok) expect(off.error.message).toMatch(/stitching line/);
		const again = divergencePoint(r.piece, { at: { x: 200, y: 120 }, id: 'd2' });
		expect(again.ok).toBe(false);
	});
});
