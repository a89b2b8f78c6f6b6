import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rectsOverlap, shelfPack, type PackItem, type Packed } from './pack';
import { pageAwarePack, skylinePack } from './skyline';
import { PIECE_GAP_MM, PRINT_MARGIN_MM, TILE_OVERLAP_MM } from './paper';
import { rowLetter, sheetTiling, tileJoins } from './tiles';
import { demoPrintPieces } from './test-support/demo-pieces';
import { printSheet } from './print-sheet';

describe('shelf packing', () => {
	it('never lays two pieces over each other and keeps within the strip when every piece fits it', () => {
		fc.assert(
			fc.property(fc.array(fc.record({ widthMm: fc.double({ min: 1, max: 400, noNaN: true }), heightMm: fc.double({ min: 1, max: 900, noNaN: true }) }), { maxLength: 40 }), (items) => {
				const packed = shelfPack(items, 500, 10);
				const rects = items.map((it, i) => ({ x: packed.at[i].x, y: packed.at[i].y, w: it.widthMm, h: it.heightMm }));
				for (let i = 0; i < rects.length; i++) {
					expect(rects[i].x + rects[i].w).toBeLessThanOrEqual(500 + 1e-9);
					for (let j = i + 1; j < rects.length; j++) expect(rectsOverlap(rects[i], rects[j])).toBe(false);
				}
			})
		);
	});
});

const itemsArb = fc.array(fc.record({ widthMm: fc.double({ min: 1, max: 400, noNaN: true }), heightMm: fc.double({ min: 1, max: 900, noNaN: true }) }), { maxLength: 30 });
function expectApartWithin(items: readonly PackItem[], packed: Packed, strip: number, gap: number) {
	const rects = items.map((it, i) => ({ x: packed.at[i].x, y: packed.at[i].y, w: it.widthMm + gap - 1e-9, h: it.heightMm + gap - 1e-9 }));
	for (let i = 0; i < rects.length; i++) {
		expect(rects[i].x).toBeGreaterThanOrEqual(0);
		expect(rects[i].y).toBeGreaterThanOrEqual(0);
		if (items[i].widthMm <= strip) expect(rects[i].x + items[i].widthMm).toBeLessThanOrEqual(strip + 1e-9);
		for (let j = i + 1; j < rects.length; j++) expect(rectsOverlap(rects[i], rects[j])).toBe(false);
	}
	expect(packed.widthMm).toBeGreaterThanOrEqual(Math.max(0, ...items.map((it, i) => packed.at[i].x + it.widthMm)) - 1e-9);
	expect(packed.heightMm).toBeGreaterThanOrEqual(Math.max(0, ...items.map((it, i) => packed.at[i].y + it.heightMm)) - 1e-9);
}

describe('skyline packing', () => {
	it('keeps the gap between every two pieces and stays within the strip (tallest, widest or largest first)', () => {
		for (const by of ['height', 'width', 'area'] as const) {
			fc.assert(fc.property(itemsArb, (items) => expectApartWithin(items, skylinePack(items, 500, 10, by), 500, 10)), { numRuns: 60 });
		}
	});

	it('counting pages, keeps the gap between every two pieces and stays within the strip', () => {
		const grid = { stepXMm: 178, stepYMm: 265, pageWidthMm: 190, pageHeightMm: 277 };
		fc.assert(fc.property(itemsArb, (items) => expectApartWithin(items, pageAwarePack(items, 544, 10, grid), 544, 10)), { numRuns: 60 });
	});
});

describe('tiling', () => {
	it('names rows A…Z, AA…', () => {
		expect([0, 1, 25, 26, 27].map(rowLetter)).toEqual(['A', 'B', 'Z', 'AA', 'AB']);
	});

	it('covers the whole sheet with pages whose neighbours overlap by the strip', () => {
		const t = sheetTiling('a4', 1000, 1300, [{ x: 0, y: 0, w: 1000, h: 1300 }]);
		const pw = 210 - 2 * PRINT_MARGIN_MM;
		const ph = 297 - 2 * PRINT_MARGIN_MM;
		expect(t.tiles[0]).toMatchObject({ x: 0, y: 0, widthMm: pw, heightMm: ph, code: 'A1' });
		const last = t.tiles.at(-1)!;
		expect(last.x + last.widthMm).toBeGreaterThanOrEqual(1000);
		expect(last.y + last.heightMm).toBeGreaterThanOrEqual(1300);
		for (const a of t.tiles) {
			const right = t.tiles.find((b) => b.row === a.row && b.col === a.col + 1);
			if (right) expect(a.x + a.widthMm - right.x).toBeCloseTo(TILE_OVERLAP_MM, 9);
			const below = t.tiles.find((b) => b.col === a.col && b.row === a.row + 1);
			if (below) expect(a.y + a.heightMm - below.y).toBeCloseTo(TILE_OVERLAP_MM, 9);
		}
		expect(tileJoins(t, t.tiles[t.cols + 1])).toBe('above A2 · left B1 · right B3 · below C2');
		// every alignment mark sits in an overlap strip, so it prints on both pages
		for (const m of t.marks) expect(t.tiles.filter((x) => m.x > x.x && m.x < x.x + x.widthMm && m.y > x.y && m.y < x.y + x.heightMm).length).toBeGreaterThanOrEqual(2);
	});

	it('leaves out pages no piece falls on', () => {
		const t = sheetTiling('a4', 600, 600, [{ x: 0, y: 0, w: 100, h: 100 }]);
		expect(t.tiles.filter((x) => !x.blank).map((x) => x.code)).toEqual(['A1']);
	});
});

describe('print layout', () => {
	it('draws each pair twice (the second half mirrored) when asked, once otherwise, without overlaps', () => {
		const pieces = demoPrintPieces();
		const pairs = pieces.filter((p) => p.piece.cut === 'pair').length;
		const both = printSheet(pieces, { paper: 'a4', allowanceShown: true, pairs: 'both' }, 't');
		const once = printSheet(pieces, { paper: 'a4', allowanceShown: true, pairs: 'once' }, 't');
		expect(both.placed).toHaveLength(pieces.length + pairs);
		expect(once.placed).toHaveLength(pieces.length);
		for (const s of [both, once]) {
			for (let i = 0; i < s.placed.length; i++) for (let j = i + 1; j < s.placed.length; j++) expect(rectsOverlap(s.placed[i].rect, s.placed[j].rect)).toBe(false);
		}
		// the other half of a pair lies beside its first half, at the same height
		for (const m of both.placed.filter((p) => p.mirrored)) {
			const first = both.placed.find((p) => p.pieceId === m.pieceId && !p.mirrored)!;
			expect(m.rect.y).toBe(first.rect.y);
			expect(m.rect.x).toBeGreaterThan(first.rect.x + first.rect.w);
		}
	});

	it('prints no more A4 pages than shelf packing the pieces on the narrowest strip would', () => {
		const pieces = demoPrintPieces();
		for (const pairs of ['both', 'once'] as const) {
			const s = printSheet(pieces, { paper: 'a4', allowanceShown: true, pairs }, 't');
			const sizes = s.placed.map((p) => ({ widthMm: p.rect.w, heightMm: p.rect.h }));
			const step = 210 - 2 * PRINT_MARGIN_MM - TILE_OVERLAP_MM;
			const strip = Math.max(1, Math.ceil((Math.max(...sizes.map((x) => x.widthMm)) - TILE_OVERLAP_MM) / step)) * step + TILE_OVERLAP_MM;
			const shelf = shelfPack(sizes, strip, PIECE_GAP_MM);
			const shelfPages = sheetTiling('a4', shelf.widthMm, shelf.heightMm, sizes.map((z, i) => ({ x: shelf.at[i].x, y: shelf.at[i].y, w: z.widthMm, h: z.heightMm }))).tiles.filter((t) => !t.blank).length;
			expect(s.tiling.tiles.filter((t) => !t.blank).length).toBeLessThanOrEqual(shelfPages);
		}
	});
});
