import { describe, expect, it } from 'vitest';
import Flatten from '@flatten-js/core';
import { lineSegment, outlineArea, outlineFlatten, outlineProblems, pathLength, vecAngleBetween, type Vec } from '../kernel';
import { ledgerBalance } from '../ledger';
import { wedgeGeometry } from '../piece';
import { carry } from './carry';
import { underStructurePanels } from './fixtures/under-structure-panels';
import { twoPanelWedge } from './fixtures/two-panel-wedge';

const horizontal = (y: number) => ({ segments: [lineSegment({ x: -50, y }, { x: 450, y })] });

/** x where the horizontal line at y crosses segment a–b (independent of the kernel). */
const xAt = (a: Vec, b: Vec, y: number) => a.x + ((y - a.y) / (b.y - a.y)) * (b.x - a.x);

describe('carry: panel seams into one underbust seam', () => {
	// Under-structure of 4 or 6 front panels: reference-values row 16 (CP), drafted by the drafting helper's
	// underStructureDraft from ASTM D5585-11e1 misses size 10, curvy (row 1, C).
	it.each([4, 6] as const)('%i-panel front under-structure carried into one underbust seam', (n) => {
		const f = underStructurePanels(n);
		const lowestD = Math.max(...f.draft.seams.map((s) => s.divergencePoint.y));
		const y = lowestD + 30; // below every divergence point: the band below can take all the shaping
		// cut as drawn: the reference lengths below are those of the straight line (walking: carry-walk.test.ts)
		const r = carry(f.panels, f.seamPairs, { styleLine: horizontal(y), fuse: 'below', walkLegs: false });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toEqual([]);
		expect(r.seams.every((s) => s.outcome === 'closed')).toBe(true);

		// the apex ledgers balance, and what went into the style seam is every wedge angle of the draft
		expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
		const carried = r.ledgerEntries.filter((e) => e.refId === 'style-seam').reduce((s, e) => s + e.angleRad, 0);
		const draftTotal = f.draft.seams.reduce((s, x) => s + x.wedgeAngleRad, 0);
		expect(carried).toBeCloseTo(draftTotal, 10);

		// total area kept (rigid turns only)
		const before = f.panels.reduce((s, p) => s + outlineArea(p.outline), 0);
		const after = r.pieces.reduce((s, p) => s + outlineArea(p.outline), 0);
		expect(Math.abs(after - before)).toBeLessThan(1e-6);
		expect(outlineProblems(r.pieces[0].outline)).toEqual([]);

		// style seam lengths: the other side keeps the line as drawn across the panels; the joined band's edge
		// is shorter by the width of every wedge at the line. Both computed here from the draft's own seam
		// lines and a @flatten-js/core intersection, not from carry.
		const gaps = f.draft.seams.map((s) => Math.abs(xAt(s.left.lower[0], s.left.lower[1], y) - xAt(s.right.lower[0], s.right.lower[1], y)));
		const lineF = new Flatten.Line(new Flatten.Point(0, y), new Flatten.Vector(0, 1));
		const xs = f.panels.flatMap((p) =>
			new Flatten.Polygon(outlineFlatten(p.outline, 0.001).map((v) => [v.x, v.y] as [number, number])).intersect(lineF).map((q) => q.x)
		);
		const across = Math.max(...xs) - Math.min(...xs);
		const shapingMoved = gaps.reduce((s, g) => s + g, 0);
		expect(r.otherSideSeamLengthMm).toBeCloseTo(across, 3);
		expect(r.otherSideSeamLengthMm - r.styleSeamLengthMm).toBeCloseTo(shapingMoved, 9);
		expect(r.styleSeamLengthMm).toBeCloseTo(across - shapingMoved, 3);

		// the band's style seam turns by the whole shaping: last edge against first
		const dir = (i: number) => {
			const e = r.styleSeamEdges[i];
			const s = e.segments[0];
			const t = e.segments[e.segments.length - 1];
			const end = t.kind === 'line' ? t.p1 : t.p3;
			return { x: end.x - s.p0.x, y: end.y - s.p0.y };
		};
		expect(Math.abs(vecAngleBetween(dir(0), dir(r.styleSeamEdges.length - 1)))).toBeCloseTo(draftTotal, 9);
		expect(pathLength(r.reachLine)).toBeGreaterThan(0);
	});
});

describe('carry: a style line that misses a divergence point', () => {
	it('above D: reports the residual, 2·h·tan(θ/2) wide at the line (reference-values row 18, D), left as a dart', () => {
		const { left, right, pair, D, thetaRad } = twoPanelWedge(12, 150);
		const h = 40;
		const r = carry([left, right], [pair], { styleLine: horizontal(D.y - h), fuse: 'below' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toHaveLength(1);
		const res = r.residuals[0];
		expect(res.seamId).toBe('seam');
		expect(res.distanceMm).toBeCloseTo(h, 9);
		expect(res.angleDeg).toBeCloseTo(12, 9);
		expect(res.widthAtLineMm).toBeCloseTo(2 * h * Math.tan(thetaRad / 2), 9); // row 18 (D)
		expect(res.message).toMatch(/40\.0 mm/);
		// the shaping is not dropped: a dart of θ at D in the joined piece, and the ledger says so
		const dart = r.pieces[0].darts.find((d) => d.id === res.markingId);
		expect(dart).toBeDefined();
		const g = wedgeGeometry(r.pieces[0].apexes.find((a) => a.id === dart!.apexId)!.point, dart!.leg1End, dart!.leg2End);
		expect(g.angleRad).toBeCloseTo(thetaRad, 9);
		expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
		expect(r.ledgerEntries.some((e) => e.kind === 'dart' && Math.abs(e.angleRad - thetaRad) < 1e-12)).toBe(true);
		// the reach line runs through D
		const pts = r.reachLine.segments.map((s) => s.p0);
		expect(pts.some((p) => Math.hypot(p.x - D.x, p.y - D.y) < 1e-9)).toBe(true);
	});

	it('leaves the residual as a pair of pleats when asked', () => {
		const { left, right, pair, D } = twoPanelWedge(12, 150);
		const r = carry([left, right], [pair], { styleLine: horizontal(D.y - 40), fuse: 'below', residualAs: 'pleats' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.pieces[0].pleats).toHaveLength(1);
		expect(r.pieces[0].darts).toHaveLength(0);
		expect(r.ledgerEntries.some((e) => e.kind === 'pleat')).toBe(true);
	});

	it('with the wedge opening toward the line, the stub between D and the line is exactly 2·h·tan(θ/2) wide (row 18, D)', () => {
		const { left, right, pair, D, thetaRad } = twoPanelWedge(10, 150);
		const h = 25;
		const r = carry([left, right], [pair], { styleLine: horizontal(D.y + h), fuse: 'above' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toHaveLength(1);
		expect(r.residuals[0].widthAtLineMm).toBeCloseTo(2 * h * Math.tan(thetaRad / 2), 9);
		expect(r.residuals[0].openingChordMm).toBeCloseTo(2 * h * Math.tan(thetaRad / 2), 9);
	});

	it('through D: carries everything, no residual', () => {
		const { left, right, pair, D } = twoPanelWedge(12, 150);
		const r = carry([left, right], [pair], { styleLine: horizontal(D.y), fuse: 'below' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toEqual([]);
		expect(r.shapingMovedMm).toBeCloseTo(0, 9);
	});

	it('refuses a style line that does not cross every panel, and a wrong number of seams', () => {
		const { left, right, pair } = twoPanelWedge();
		const short = carry([left, right], [pair], { styleLine: { segments: [lineSegment({ x: -10, y: 100 }, { x: 50, y: 100 })] }, fuse: 'below' });
		expect(short.ok).toBe(false);
		if (!short.ok) expect(short.error.code).toBe('style_line_misses_panel');
		const none = carry([left, right], [], { styleLine: horizontal(100), fuse: 'below' });
		expect(none.ok).toBe(false);
		if (!none.ok) expect(none.error.message).toMatch(/one seam pair/);
	});

	it('6 panels with the line above both divergence points: residual at each, reach line through both', () => {
		const f = underStructurePanels(6);
		const y = Math.min(...f.draft.seams.map((s) => s.divergencePoint.y)) - 15;
		const r = carry(f.panels, f.seamPairs, { styleLine: horizontal(y), fuse: 'below' });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.residuals).toHaveLength(2);
		for (const [i, s] of f.draft.seams.entries()) {
			expect(r.residuals[i].angleRad).toBeCloseTo(s.wedgeAngleRad, 9);
			const pts = r.reachLine.segments.map((q) => q.p0);
			expect(pts.some((p) => Math.hypot(p.x - s.divergencePoint.x, p.y - s.divergencePoint.y) < 1e-9)).toBe(true);
		}
		expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
	});
});
