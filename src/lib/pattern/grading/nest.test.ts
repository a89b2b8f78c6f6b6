import { describe, expect, it } from 'vitest';
import { anchorBody, anchorBodyLike, anchorResolve, type Anchor } from '../anchors/anchor';
import { pieceLandmarks } from '../anchors/landmarks';
import { vecDistance, vecSub } from '../kernel';
import { ASTM_D5585_SOURCE, astmD5585MeasurementSet, astmD5585Sizes, measurementsMm } from '../measurements';
import { demoStyleRecipe } from './demo-recipe';
import { nestAlign, nestAnchorDefault, nestIncrements, nestLabels, nestLandmarkNames, type NestSize } from './nest';
import { nestAnchorChoices, nestAnchorOf, nestAnchorWords, nestChoiceDefault } from './nest-anchors';
import { sizeResult } from './size-result';

const recipe = demoStyleRecipe();
// five neighbouring sizes of the curvy chart, in the chart's order
const chartSizes = astmD5585Sizes.slice(3, 8);
const made = chartSizes.map((size) => {
	const mm = measurementsMm(astmD5585MeasurementSet('curvy', size));
	return { size, mm, result: sizeResult(recipe, mm) };
});
const baseOf = (pieceId: string) => recipe.pieces.find((p) => p.id === pieceId)!.versions.at(-1)!.geometry;
const sizesOf = (pieceId: string): NestSize[] => made.map((m) => ({ key: m.size, name: `size ${m.size}`, piece: m.result.heads.get(pieceId)! }));

describe('nest of a size run', () => {
	it('aligns every size of every piece at its default anchor: the anchors coincide within 1e-9 mm', () => {
		for (const p of recipe.pieces) {
			const base = baseOf(p.id);
			const anchor = nestAnchorDefault(base)!;
			const nest = nestAlign(base, sizesOf(p.id), anchor);
			if (!nest.ok) throw new Error(nest.message);
			expect(nest.failures, p.name).toEqual([]);
			expect(nest.shapes.length).toBe(chartSizes.length);
			for (const s of nest.shapes) {
				expect(vecDistance(s.points.get((anchor as { name: string }).name)!, nest.anchorPoint), `${p.name} ${s.name}`).toBeLessThan(1e-9);
				// the outline moved with its points: the first vertex is the size's own, moved by the offset
				const own = sizesOf(p.id).find((x) => x.key === s.key)!.piece.outline.segments[0].p0;
				expect(vecDistance(vecSub(s.outline.segments[0].p0, s.offset), own)).toBeLessThan(1e-9);
			}
		}
	});

	it('aligns at centre front waist on the front block and at centre back waist on the back block by default', () => {
		expect(nestAnchorDefault(baseOf('front-block'))).toEqual({ kind: 'landmark', name: 'centre front waist' });
		expect(nestAnchorDefault(baseOf('back-block'))).toEqual({ kind: 'landmark', name: 'centre back waist' });
	});

	it('aligns at a place along a seam as well: half way along the front waist, the same point on every size', () => {
		const anchor: Anchor = { kind: 'edge', edge: 'waist', from: 'start', fraction: 0.5 };
		const nest = nestAlign(baseOf('front-block'), sizesOf('front-block'), anchor);
		if (!nest.ok) throw new Error(nest.message);
		for (const s of nest.shapes) {
			const own = anchorResolve(anchorBody(sizesOf('front-block').find((x) => x.key === s.key)!.piece), anchor);
			if (!own.ok) throw new Error(own.message);
			expect(vecDistance({ x: own.point.x + s.offset.x, y: own.point.y + s.offset.y }, nest.anchorPoint)).toBeLessThan(1e-9);
		}
	});

	it('offers every landmark and a place along every seam to align at; each choice, aligned, puts its point of every size on one point', () => {
		const base = baseOf('front-block');
		const choices = nestAnchorChoices(base);
		expect(nestChoiceDefault(base)).toBe('landmark:centre front waist');
		expect(choices.filter((c) => c.group === 'landmark').map((c) => c.label)).toContain('centre front waist');
		const edges = choices.filter((c) => c.group === 'edge');
		expect(edges.map((c) => c.label)).toContain('along the side seam');
		for (const c of [...edges, choices[0]]) {
			const anchor = nestAnchorOf(c.value, 0.4)!;
			const nest = nestAlign(base, sizesOf('front-block'), anchor);
			if (!nest.ok) throw new Error(nest.message);
			expect(nest.failures, c.label).toEqual([]);
			for (const s of nest.shapes) {
				const size = sizesOf('front-block').find((x) => x.key === s.key)!.piece;
				const own = anchorResolve(anchorBodyLike(size, anchorBody(base)), anchor);
				if (!own.ok) throw new Error(own.message);
				expect(vecDistance({ x: own.point.x + s.offset.x, y: own.point.y + s.offset.y }, nest.anchorPoint), `${c.label} ${s.name}`).toBeLessThan(1e-9);
			}
		}
		expect(nestAnchorOf('edge:side seam', 0.4)).toEqual({ kind: 'edge', edge: 'side seam', from: 'start', fraction: 0.4 });
		expect(nestAnchorWords(base, nestAnchorOf('edge:side seam', 0.4)!)).toMatch(/^the side seam, 40 % from the /);
	});

	it('measures increments equal to the landmark distances computed on each size by itself (relative to its own anchor)', () => {
		for (const pieceId of ['front-block', 'back-block']) {
			const base = baseOf(pieceId);
			const anchorName = (nestAnchorDefault(base) as { name: string }).name;
			const nest = nestAlign(base, sizesOf(pieceId), { kind: 'landmark', name: anchorName });
			if (!nest.ok) throw new Error(nest.message);
			const names = nestLandmarkNames(base);
			const incs = nestIncrements(nest.shapes, names);
			expect(incs.length).toBe(chartSizes.length - 1);
			for (const [i, inc] of incs.entries()) {
				// the same points read straight off the two sizes' own outlines, each relative to its own anchor
				const own = [made[i], made[i + 1]].map((m) => new Map(pieceLandmarks(m.result.heads.get(pieceId)!).map((l) => [l.name, l.point])));
				const rel = (k: 0 | 1, n: string) => vecSub(own[k].get(n)!, own[k].get(anchorName)!);
				expect(inc.points.length).toBe(names.length);
				for (const p of inc.points) {
					const d = vecSub(rel(1, p.name), rel(0, p.name));
					expect(Math.abs(p.dxMm - d.x), `${pieceId} ${p.name}`).toBeLessThan(1e-9);
					expect(Math.abs(p.dyMm - d.y), `${pieceId} ${p.name}`).toBeLessThan(1e-9);
					expect(Math.abs(p.distanceMm - Math.hypot(d.x, d.y))).toBeLessThan(1e-9);
					if (p.name === anchorName) expect(p.distanceMm).toBeLessThan(1e-9);
				}
			}
		}
	});

	it(`grades the underarm out by a quarter of the chart's bust difference, front and back (${ASTM_D5585_SOURCE.standard}, ${ASTM_D5585_SOURCE.table}, reference-values row 1, C; the quarter split, D from the draft's widths)`, () => {
		// the draft puts the side seam at the bust line at ¼ (bust + ease) ± 10 mm from the centre line
		// (drafting README, step 1); the ease is the same on every size, so the grade there is ¼ Δbust
		for (const pieceId of ['front-block', 'back-block']) {
			const base = baseOf(pieceId);
			const nest = nestAlign(base, sizesOf(pieceId), nestAnchorDefault(base)!);
			if (!nest.ok) throw new Error(nest.message);
			for (const [i, inc] of nestIncrements(nest.shapes, ['underarm', 'side waist']).entries()) {
				const quarterBust = (made[i + 1].mm.bust! - made[i].mm.bust!) / 4;
				const underarm = inc.points.find((p) => p.name === 'underarm')!;
				expect(Math.abs(underarm.dxMm - quarterBust), `${pieceId} ${inc.fromName} → ${inc.toName}`).toBeLessThan(1e-6);
				// a larger size of the chart is wider at the side waist too: the grade goes one way
				expect(inc.points.find((p) => p.name === 'side waist')!.dxMm).toBeGreaterThan(0);
			}
		}
	});

	it('leaves out and names a size where the anchor cannot be found, and refuses an anchor the base lacks', () => {
		const base = baseOf('front-block');
		const other: NestSize = { key: 'band', name: 'band', piece: made[0].result.heads.get('midriff-band')! };
		const nest = nestAlign(base, [...sizesOf('front-block').slice(0, 2), other], { kind: 'landmark', name: 'bust-point' });
		if (!nest.ok) throw new Error(nest.message);
		expect(nest.shapes.map((s) => s.key)).toEqual(chartSizes.slice(0, 2));
		expect(nest.failures.map((f) => f.key)).toEqual(['band']);
		expect(nest.failures[0].message).toMatch(/has no bust-point/);
		const none = nestAlign(base, sizesOf('front-block'), { kind: 'landmark', name: 'no such point' });
		expect(none.ok).toBe(false);
	});

	it('names every size beside the same outline point, no two labels closer than a line', () => {
		const base = baseOf('front-block');
		const nest = nestAlign(base, sizesOf('front-block'), nestAnchorDefault(base)!);
		if (!nest.ok) throw new Error(nest.message);
		const line = 9;
		const labels = nestLabels(nest.shapes, line);
		expect(labels.map((l) => l.key)).toEqual(chartSizes);
		const ys = labels.map((l) => l.text.y).sort((a, b) => a - b);
		for (let i = 1; i < ys.length; i++) expect(ys[i] - ys[i - 1]).toBeGreaterThanOrEqual(line - 1e-9);
		// each label's point lies on its own size's outline (a vertex of it)
		for (const [i, l] of labels.entries()) expect(Math.min(...nest.shapes[i].outline.segments.map((s) => vecDistance(s.p0, l.at)))).toBeLessThan(1e-9);
	});
});
