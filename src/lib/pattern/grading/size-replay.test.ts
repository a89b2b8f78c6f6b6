import Flatten from '@flatten-js/core';
import { describe, expect, it } from 'vitest';
import { EASE_DEFAULT } from '../drafting';
import { pathLength, segmentPointAt, type Outline } from '../kernel';
import { pathFirst, pathLast } from '../panels/chain-tools';
import { ASTM_D5585_SOURCE, astmD5585MeasurementSet, astmD5585Sizes, measurementsMm, type AstmD5585Chart } from '../measurements';
import type { CarryResult } from '../panels/carry-types';
import { pieceGeometryDifference } from '../verify/piece-compare';
import { seamEdgeLength } from '../verify/seam-measure';
import { recipeStepApply } from '../recipe/registry';
import { demoStyleRecipe } from './demo-recipe';
import type { StyleRecipe } from './style-recipe';
import { sizeResult } from './size-result';

const recipe = demoStyleRecipe();
const mmOf = (chart: AstmD5585Chart, size: (typeof astmD5585Sizes)[number]) => measurementsMm(astmD5585MeasurementSet(chart, size));
const allSizes = (['curvy', 'straight'] as const).flatMap((chart) => astmD5585Sizes.map((size) => ({ chart, size })));

describe('size run of the demo style', () => {
	it('replayed on its own set (ASTM D5585-11e1 curvy size 10) makes every head again exactly', () => {
		const r = sizeResult(recipe, mmOf('curvy', '10'));
		expect(r.failures).toEqual([]);
		for (const p of recipe.pieces) {
			const head = p.versions[p.versions.length - 1];
			const made = r.heads.get(p.id);
			expect(made, p.name).toBeDefined();
			expect(pieceGeometryDifference(head.geometry, made!, 1e-6), p.name).toBeNull();
		}
	});

	it.each(astmD5585Sizes.map((size) => ({ size })))('curvy size $size: every piece made, every check passes', ({ size }) => {
		const r = sizeResult(recipe, mmOf('curvy', size));
		expect(r.failures).toEqual([]);
		expect(r.pieces.every((p) => p.made)).toBe(true);
		expect(r.checks.filter((c) => !c.passed).map((c) => c.message)).toEqual([]);
	});

	it('declares a hand reshape again on each size, as that size measures it, so the band let down by hand passes its checks on other sizes', () => {
		// the fitting's kind of change: a point of the band's lower edge let down 8 mm by hand, declared on the base size
		const band = recipe.pieces.find((p) => /midriff/i.test(p.name))!;
		const head = band.versions[band.versions.length - 1];
		const low = head.geometry.outline.segments.map((g) => g.p0).reduce((a, b) => (b.y > a.y ? b : a));
		const step = { op: 'reshape', params: { moves: [{ from: low, to: { x: low.x, y: low.y + 8 } }] } };
		const made = recipeStepApply(head.geometry, step);
		if (!made.ok) throw new Error(made.error.message);
		const reshaped: StyleRecipe = {
			...recipe,
			pieces: recipe.pieces.map((p) => (p !== band ? p : { ...p, versions: [...p.versions, { id: `${p.id}:v${head.number + 1}`, number: head.number + 1, recipe: [step], geometry: made.piece }] }))
		};
		for (const size of ['8', '14'] as const) {
			const r = sizeResult(reshaped, mmOf('curvy', size));
			expect(r.failures).toEqual([]);
			expect(r.checks.filter((c) => !c.passed).map((c) => `${size}: ${c.message}`)).toEqual([]);
		}
	});

	it('balances the ledger at every apex and divergence point of every size that is made, both charts', () => {
		let sizesMade = 0;
		for (const { chart, size } of allSizes) {
			const r = sizeResult(recipe, mmOf(chart, size));
			for (const f of r.failures) {
				// a step that cannot be made again says which piece, which step and why
				expect(f.pieceName.length).toBeGreaterThan(0);
				expect(f.step).toBeGreaterThan(0);
				expect(f.message).toMatch(/cannot|has no|not/);
			}
			if (r.failures.length > 0) continue;
			sizesMade++;
			const apexChecks = r.checks.filter((c) => c.code === 'apex_balanced_across_pieces' || c.code === 'apex_balanced');
			expect(apexChecks.length).toBeGreaterThan(0);
			expect(apexChecks.filter((c) => !c.passed).map((c) => `${chart} ${size}: ${c.message}`)).toEqual([]);
		}
		expect(sizesMade).toBeGreaterThanOrEqual(20);
	});

	it('makes the midriff band’s underbust seam as long as the panel seams it joins, per size, within the seam tolerance', () => {
		// tolerance: 1/16 in ≈ 1.6 mm, the professional truing tolerance (reference-values row 25, C/P)
		const tol = 25.4 / 16;
		for (const size of astmD5585Sizes) {
			const r = sizeResult(recipe, mmOf('curvy', size));
			const carry = r.replay.changes.get('demo-change')!.steps[0].result as Extract<CarryResult, { ok: true }>;
			const band = r.heads.get('midriff-band')!;
			const edges = carry.seamPairs.map((s) => s.a.edge);
			const from = pathFirst(edges[0]);
			const to = pathLast(edges[edges.length - 1]);
			// measured on the band's own stitching line (its v2 head, allowance added), the shorter way round
			const onBand = Math.min(seamEdgeLength(band, { from, to }) ?? Infinity, seamEdgeLength(band, { from: to, to: from }) ?? Infinity);
			const panels = carry.seamPairs.reduce((t, s) => t + pathLength(s.b.edge), 0);
			expect(Math.abs(onBand - panels), `size ${size}`).toBeLessThan(tol);
		}
	});
});

// ---- ASTM D5585 block check, through the replay ------------------------------------------------
function polygonOf(o: Outline): Flatten.Polygon {
	const pts: [number, number][] = [];
	for (const s of o.segments) {
		const n = s.kind === 'line' ? 1 : 200;
		for (let i = 0; i < n; i++) {
			const p = segmentPointAt(s, i / n);
			pts.push([p.x, p.y]);
		}
	}
	return new Flatten.Polygon(pts);
}
/** Cloth along the horizontal line at y, measured by @flatten-js/core 1.6.15 (independent of the draft). */
function clothAlongY(o: Outline, y: number): number {
	const poly = polygonOf(o);
	const xs = poly.intersect(new Flatten.Line(new Flatten.Point(-1e4, y), new Flatten.Point(1e4, y))).map((p) => p.x).sort((a, b) => a - b);
	let total = 0;
	for (let i = 0; i + 1 < xs.length; i++) if (xs[i + 1] - xs[i] > 1e-9 && poly.contains(new Flatten.Point((xs[i] + xs[i + 1]) / 2, y))) total += xs[i + 1] - xs[i];
	return total;
}

describe(`blocks of a size run: ${ASTM_D5585_SOURCE.standard}, ${ASTM_D5585_SOURCE.table} (reference-values row 1, C)`, () => {
	it.each(allSizes)('$chart size $size: bust and waist girths at the replayed block = chart + stated ease (±1 mm)', ({ chart, size }) => {
		const m = mmOf(chart, size);
		const r = sizeResult(recipe, m);
		const front = r.replay.versions.get('front-block')!.get(1)!.piece;
		const back = r.replay.versions.get('back-block')!.get(1)!.piece;
		const bp = front.apexes.find((a) => a.kind === 'bust_point')!.point;
		const bust = 2 * (clothAlongY(front.outline, bp.y - 1e-6) + clothAlongY(back.outline, bp.y - 1e-6));
		expect(Math.abs(bust - (m.bust! + EASE_DEFAULT.bustMm))).toBeLessThan(1);
		const waistY = Math.max(...front.outline.segments.map((s) => s.p0.y)) - 1e-6;
		const waist = 2 * (clothAlongY(front.outline, waistY) + clothAlongY(back.outline, waistY));
		expect(Math.abs(waist - (m.waist! + EASE_DEFAULT.waistMm))).toBeLessThan(1);
		// the block is a bodice to the waist: it has no hip line, so no hip girth is checked
	});
});
