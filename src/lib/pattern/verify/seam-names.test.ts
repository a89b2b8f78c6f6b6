import { describe, expect, it } from 'vitest';
import { demoPath } from '../fixtures/demo-path';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { pieceMetrics } from '../metrics';
import { pivot } from '../operations/pivot';
import type { Piece } from '../piece-schema';
import { COMPARE_THRESHOLDS, piecesCompare } from './metrics-compare';
import { seamNames } from './seam-names';

const namesOf = (p: Piece) => seamNames(p, pieceMetrics(p).seams);
const demo = demoPath().pieces;
const first = (key: string) => demo.find((p) => p.key === key)!.first.geometry;

describe('seams named by where they run', () => {
	it('names the seams of a front block: neckline, shoulder, armhole, side seam, waist, centre front on the fold', () => {
		expect(new Set(namesOf(frontBodiceBlock()))).toEqual(new Set(['neckline', 'shoulder', 'armhole', 'side seam', 'waist', 'centre front (on the fold)']));
		expect(new Set(namesOf(first('front-block')))).toEqual(new Set(['neckline', 'shoulder', 'armhole', 'side seam', 'waist', 'centre front (on the fold)']));
	});

	it('names the back block centre back, and a panel of the under-structure by its panel seams', () => {
		expect(namesOf(first('back-block'))).toContain('centre back');
		const cf = namesOf(first('panel-cf'));
		expect(cf).toContain('centre front');
		expect(cf).toContain('panel seam toward the side');
		expect(cf).not.toContain('side seam');
		const side = namesOf(first('panel-side'));
		expect(side).toContain('side seam');
		expect(side).toContain('armhole');
	});

	it('says where a seam lies rather than guess: the upper front ends in a lower edge, not a waist', () => {
		const names = namesOf(first('upper-front'));
		expect(names).toContain('lower edge');
		expect(names).not.toContain('waist');
		expect(names.every((n) => !/^seam \d/.test(n))).toBe(true);
	});

	it('gives every seam of every demo piece its own name', () => {
		for (const p of demo) {
			for (const g of [p.first.geometry, ...p.later.map((v) => v.geometry)]) {
				const names = namesOf(g);
				expect(new Set(names).size, `${p.key}: ${names.join(', ')}`).toBe(names.length);
			}
		}
	});
});

describe('comparing two versions as a pattern cutter would', () => {
	const block = frontBodiceBlock();
	const moved = (() => {
		const r = pivot(block, { dartId: 'shoulder-dart', to: { x: 235 - 10 / 3, y: 300 } });
		if (!r.ok) throw new Error(r.error.message);
		return r.piece;
	})();

	it('flags nothing after a pivot: the sewn seams, the area and the shaping are kept (dart legs are not seams)', () => {
		const rows = piecesCompare(block, moved);
		expect(rows.filter((r) => r.flagged)).toEqual([]);
		expect(rows.some((r) => /perimeter/i.test(r.label))).toBe(false);
		const seams = rows.filter((r) => r.group === 'seam');
		expect(seams.map((r) => r.label)).toEqual(expect.arrayContaining(['Side seam', 'Armhole', 'Shoulder', 'Waist', 'Neckline']));
		for (const r of seams) expect(Math.abs(r.difference!)).toBeLessThan(0.01);
	});

	it("flags nothing when the demo's upper front has its bust dart turned to the shoulder (v1 → v2), where the outline with its dart legs grows", () => {
		const upper = demo.find((p) => p.key === 'upper-front')!;
		const [v1, v2] = [upper.first.geometry, upper.later[0].geometry];
		// the outline with the dart legs changes (what once showed as a red alarm); the sewn seams do not
		expect(Math.abs(pieceMetrics(v2).perimeterMm - pieceMetrics(v1).perimeterMm)).toBeGreaterThan(10);
		const rows = piecesCompare(v1, v2);
		expect(rows.filter((r) => r.flagged).map((r) => r.label)).toEqual([]);
		expect(rows.filter((r) => r.group === 'seam').map((r) => r.label)).toEqual(
			expect.arrayContaining(['Centre front', 'Neckline', 'Shoulder', 'Armhole', 'Side seam', 'Lower edge'])
		);
	});

	it('flags a sewn seam changed by more than 3 mm (about 1/8 in, reference-values row 25, C/P) and not one changed by less', () => {
		const lower = (dy: number): Piece => ({
			...block,
			outline: {
				segments: block.outline.segments.map((s) => {
					const f = (p: { x: number; y: number }) => (p.y >= 430 ? { x: p.x, y: p.y + dy } : p);
					return s.kind === 'line' ? { ...s, p0: f(s.p0), p1: f(s.p1) } : { ...s, p0: f(s.p0), p1: f(s.p1), p2: f(s.p2), p3: f(s.p3) };
				})
			},
			darts: block.darts.map((d) => ({ ...d, leg1End: d.leg1End.y >= 430 ? { ...d.leg1End, y: d.leg1End.y + dy } : d.leg1End, leg2End: d.leg2End.y >= 430 ? { ...d.leg2End, y: d.leg2End.y + dy } : d.leg2End }))
		});
		const side = (p: Piece) => piecesCompare(block, p).find((r) => r.label === 'Side seam')!;
		expect(side(lower(2)).flagged).toBe(false);
		expect(side(lower(COMPARE_THRESHOLDS.seamLengthMm + 2)).flagged).toBe(true);
	});
});
