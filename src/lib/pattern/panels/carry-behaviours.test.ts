import { describe, expect, it } from 'vitest';
import { lineSegment, pathReverse } from '../kernel';
import { ledgerBalance } from '../ledger';
import { carry } from './carry';
import { nonFiniteAt } from './finite-check';
import type { SeamPair } from './panel-types';
import { underStructurePanels } from './fixtures/under-structure-panels';
import { twoPanelWedge } from './fixtures/two-panel-wedge';

// The boned under-structure drafted from ASTM D5585-11e1 misses size 10 curvy (reference-values rows 1 C,
// 16 CP). Its seam pairs run from the waist upward, the direction drafting produces.
const horizontal = (y: number) => ({ segments: [lineSegment({ x: -50, y }, { x: 450, y })] });
const reversed = (pairs: readonly SeamPair[]): SeamPair[] => pairs.map((p) => ({ ...p, a: { ...p.a, edge: pathReverse(p.a.edge) }, b: { ...p.b, edge: pathReverse(p.b.edge) } }));

describe('carry does not depend on the direction of its seam data', () => {
	it.each([4, 6] as const)('%i panels, shaping kept open above the line: the same result with edges from the waist up and from the top down', (n) => {
		const f = underStructurePanels(n);
		const y = Math.max(...f.draft.seams.map((s) => s.divergencePoint.y)) + 30;
		const up = carry(f.panels, f.seamPairs, { styleLine: horizontal(y), fuse: 'above' });
		const down = carry(f.panels, reversed(f.seamPairs), { styleLine: horizontal(y), fuse: 'above' });
		if (!up.ok) throw new Error(up.error.message);
		if (!down.ok) throw new Error(down.error.message);
		expect(up.residuals.map((r) => r.angleRad)).toEqual(down.residuals.map((r) => r.angleRad));
		expect(up.residuals).toHaveLength(f.draft.seams.length);
		for (const [i, s] of f.draft.seams.entries()) expect(up.residuals[i].angleRad).toBeCloseTo(s.wedgeAngleRad, 9);
		expect(up.styleSeamLengthMm).toBeCloseTo(down.styleSeamLengthMm, 9);
		expect(ledgerBalance(up.ledgerEntries).every((b) => b.balanced)).toBe(true);
	});

	it('a line above every divergence point with the upper parts joined: plain joins either way', () => {
		const f = underStructurePanels(6);
		const y = Math.min(...f.draft.seams.map((s) => s.divergencePoint.y)) - 20;
		for (const pairs of [f.seamPairs, reversed(f.seamPairs)]) {
			const r = carry(f.panels, pairs, { styleLine: horizontal(y), fuse: 'above' });
			if (!r.ok) throw new Error(r.error.message);
			expect(r.seams.every((s) => s.outcome === 'plain')).toBe(true);
		}
	});
});

describe('carry with a style line at or a hair from the divergence point', () => {
	const f = underStructurePanels(4);
	const D = f.draft.seams[0].divergencePoint;
	const theta = f.draft.seams[0].wedgeAngleRad;

	it.each([0.01, 0.3, 0.49])('a line %f mm below the apex, band below: all the shaping carried, no refusal', (dy) => {
		const r = carry(f.panels, f.seamPairs, { styleLine: horizontal(D.y + dy), fuse: 'below', walkLegs: false });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toEqual([]);
		expect(r.seams[0].outcome).toBe('closed');
		expect(r.seams[0].distanceMm).toBeLessThan(0.5);
		expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
	});

	it('a line exactly through the apex with the shaping kept above: the wedge stays whole in the seam below, no NaN, no residual dart', () => {
		for (const pairs of [f.seamPairs, reversed(f.seamPairs)]) {
			const r = carry(f.panels, pairs, { styleLine: horizontal(D.y), fuse: 'above' });
			if (!r.ok) throw new Error(r.error.message);
			expect(r.residuals).toEqual([]);
			expect(r.pieces[0].darts).toEqual([]);
			expect(r.seams[0]).toMatchObject({ outcome: 'plain', distanceMm: 0 });
			expect(r.seams[0].angleRad).toBeCloseTo(theta, 12);
			expect(nonFiniteAt(r)).toBeNull();
			expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
		}
	});

	it('a line just past the reach distance below the apex with the shaping kept above: a residual dart of the wedge angle, never 180°', () => {
		const r = carry(f.panels, f.seamPairs, { styleLine: horizontal(D.y + 0.6), fuse: 'above', walkLegs: false });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toHaveLength(1);
		expect(r.residuals[0].angleRad).toBeCloseTo(theta, 12);
		expect(r.residuals[0].distanceMm).toBeCloseTo(0.6, 6);
		expect(r.residuals[0].message).toMatch(/0\.6 mm/);
	});

	it('a line through D on the stated two-panel wedge, either side joined: every figure finite', () => {
		const { left, right, pair } = twoPanelWedge(12, 150);
		for (const fuse of ['above', 'below'] as const) {
			const r = carry([left, right], [pair], { styleLine: horizontal(150), fuse });
			expect(nonFiniteAt(r)).toBeNull();
			expect(r.ok).toBe(true);
		}
	});
});
