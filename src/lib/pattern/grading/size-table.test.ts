import { describe, expect, it } from 'vitest';
import { ASTM_D5585_SOURCE, astmD5585MeasurementSet, astmD5585Sizes, measurementsMm } from '../measurements';
import { demoStyleRecipe } from './demo-recipe';
import { sizePieceMetrics, sizeResult } from './size-result';
import { measurementRows, pieceRows, sizesOrdered, type TableBase, type TableSize } from './size-table';

const recipe = demoStyleRecipe();
const chartSizes = astmD5585Sizes.slice(4, 9);
const sizes: TableSize[] = chartSizes.map((size) => {
	const mm = measurementsMm(astmD5585MeasurementSet('curvy', size));
	return { key: size, name: `size ${size}`, measurementsMm: mm, pieces: sizeResult(recipe, mm).pieces };
});
// the demo style is made on curvy size 10 (its base): its own pieces, metrics measured on them
const base: TableBase = {
	name: 'size 10',
	measurementsMm: measurementsMm(astmD5585MeasurementSet('curvy', '10')),
	pieces: recipe.pieces.map((p) => ({ pieceId: p.id, metrics: sizePieceMetrics(p.versions.at(-1)!.geometry) }))
};

describe(`table of a size run (${ASTM_D5585_SOURCE.standard} curvy sizes ${chartSizes.join(', ')}, reference-values row 1, C)`, () => {
	it('orders sizes from smallest to largest by bust girth whatever order they were picked in', () => {
		const shuffled = [sizes[3], sizes[0], sizes[4], sizes[2], sizes[1]];
		expect(sizesOrdered(shuffled).map((s) => s.key)).toEqual(chartSizes);
		// a size without measurements keeps its place after the measured ones
		const bare: TableSize = { key: 'old', name: 'old' };
		expect(sizesOrdered([bare, sizes[1], sizes[0]]).map((s) => s.key)).toEqual([chartSizes[0], chartSizes[1], 'old']);
	});

	it('gives every cell its difference from the base size, and none on the base size itself', () => {
		const rows = [...measurementRows(base, sizes), ...recipe.pieces.flatMap((p) => pieceRows(base, sizes, p.id))];
		expect(rows.length).toBeGreaterThan(20);
		for (const r of rows) {
			for (const c of r.cells) {
				if (c.value === null || r.base === null) expect(c.diff).toBeNull();
				else expect(Math.abs(c.diff! - (c.value - r.base)), r.label).toBeLessThan(1e-9);
				// size 10 replayed on the base's own set makes the base's pieces again
				if (c.key === '10' && c.diff !== null) expect(Math.abs(c.diff), `${r.label}`).toBeLessThan(1e-6);
			}
		}
	});

	it('lists the bust girth of each size as the chart gives it, and the differences between them', () => {
		const bust = measurementRows(base, sizes).find((r) => r.label === 'Bust girth')!;
		expect(bust.cells.map((c) => c.value)).toEqual(sizes.map((s) => s.measurementsMm!.bust));
		expect(bust.base).toBe(base.measurementsMm.bust);
	});

	it('shows each piece larger on a larger size: area and seams in all grow with the chart', () => {
		for (const p of recipe.pieces) {
			const rows = pieceRows(base, sizes, p.id);
			for (const label of ['Area', 'Seams in all']) {
				const values = rows.find((r) => r.label === label)!.cells.map((c) => c.value!);
				for (let i = 1; i < values.length; i++) expect(values[i], `${p.name} ${label}`).toBeGreaterThan(values[i - 1]);
			}
		}
	});

	it('has a row per seam and per apex of the piece, with each size’s value as the server measured it', () => {
		const rows = pieceRows(base, sizes, 'front-block');
		const m = base.pieces.find((p) => p.pieceId === 'front-block')!.metrics!;
		for (const s of m.seams) expect(rows.some((r) => r.label === `Seam: ${s.name}` && r.kind === 'length')).toBe(true);
		for (const a of m.apexes) expect(rows.some((r) => r.label === `Shaping at ${a.label}` && r.kind === 'angle')).toBe(true);
		const area = rows.find((r) => r.label === 'Area')!;
		expect(area.cells.map((c) => c.value)).toEqual(sizes.map((s) => s.pieces!.find((p) => p.pieceId === 'front-block')!.metrics!.areaMm2));
	});
});
