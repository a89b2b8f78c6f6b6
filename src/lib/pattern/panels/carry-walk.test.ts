import { describe, expect, it } from 'vitest';
import { lineSegment, outlineArea, outlineProblems, type Outline, type Vec } from '../kernel';
import { ledgerBalance } from '../ledger';
import { carry } from './carry';
import { styleLineWalkedEqual } from './carry-walk';
import { underStructurePanels } from './fixtures/under-structure-panels';
import { twoPanelWedge } from './fixtures/two-panel-wedge';

/**
 * Carry walks the legs of every wedge it closes to one length first (common practice: a dart's or a
 * seam wedge's legs are trued equal before closing, or the closed seam keeps a step the size of their
 * difference). Checked on the under-structures drafted from ASTM D5585-11e1 misses size 10 (reference
 * values rows 1 and 16), against distances worked out here from the draft's own straight seam lines.
 */

const horizontal = (y: number) => ({ segments: [lineSegment({ x: -50, y }, { x: 450, y })] });
const hypot = (p: Vec, q: Vec) => Math.hypot(p.x - q.x, p.y - q.y);
/** Where the horizontal line at y crosses the straight line a–b (independent of the kernel). */
const crossAtY = (a: Vec, b: Vec, y: number): Vec => ({ x: a.x + ((y - a.y) / (b.y - a.y)) * (b.x - a.x), y });
const shortestEdge = (o: Outline) =>
	Math.min(...o.segments.map((s) => hypot(s.p0, s.kind === 'line' ? s.p1 : s.p3)));

describe('carry walks wedge legs equal before closing them', () => {
	it.each([4, 6] as const)('%i panels, straight underbust line: equal legs at every seam, no step in the band', (n) => {
		const f = underStructurePanels(n);
		const y = Math.max(...f.draft.seams.map((s) => s.divergencePoint.y)) + 30;
		const walked = carry(f.panels, f.seamPairs, { styleLine: horizontal(y), fuse: 'below' });
		const asDrawn = carry(f.panels, f.seamPairs, { styleLine: horizontal(y), fuse: 'below', walkLegs: false });
		if (!walked.ok || !asDrawn.ok) throw new Error('carry refused');

		const differences = f.draft.seams.map((s, i) => {
			const D = s.divergencePoint;
			const da = hypot(D, crossAtY(s.left.lower[0], D, y));
			const db = hypot(D, crossAtY(s.right.lower[0], D, y));
			const w = walked.legWalks[i];
			expect(w.seamId).toBe(s.id);
			expect(w.drawnMm[0]).toBeCloseTo(da, 6);
			expect(w.drawnMm[1]).toBeCloseTo(db, 6);
			// both legs cut at the mean distance from D
			expect(hypot(D, w.a)).toBeCloseTo((da + db) / 2, 6);
			expect(hypot(D, w.b)).toBeCloseTo((da + db) / 2, 6);
			return Math.abs(da - db);
		});
		// the draft's wedges are not symmetric about the vertical, so a level line cuts unequal legs
		expect(Math.max(...differences)).toBeGreaterThan(1);
		// as drawn, the closed wedge with the largest difference leaves a step of that size; walked, none
		expect(shortestEdge(asDrawn.pieces[0].outline)).toBeLessThanOrEqual(Math.max(...differences) + 1e-6);
		expect(shortestEdge(walked.pieces[0].outline)).toBeGreaterThan(10);
		expect(walked.report.notes.some((t) => /walked to/.test(t))).toBe(true);

		// still a partition of the panels by rigid turns, with the shaping accounted for
		const before = f.panels.reduce((s, p) => s + outlineArea(p.outline), 0);
		const after = walked.pieces.reduce((s, p) => s + outlineArea(p.outline), 0);
		expect(Math.abs(after - before)).toBeLessThan(1e-6);
		expect(outlineProblems(walked.pieces[0].outline)).toEqual([]);
		expect(ledgerBalance(walked.ledgerEntries).every((b) => b.balanced)).toBe(true);
		expect(walked.residuals).toEqual([]);
	});

	it('leaves a line that already cuts equal legs exactly as drawn', () => {
		// a wedge symmetric about the vertical through D: a level line cuts both legs at one distance
		const { left, right, pair } = twoPanelWedge(12, 150);
		const line = horizontal(250);
		const r = styleLineWalkedEqual([left, right], [pair], line);
		expect(r.line).toBe(line);
		expect(r.walks).toHaveLength(1);
		expect(r.walks[0].drawnMm[0]).toBeCloseTo(r.walks[0].drawnMm[1], 9);
	});
});
