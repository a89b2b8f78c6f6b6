// The print export read back with pdfjs-dist: page sizes, test squares, pieces at true size, tiles that
// overlap and meet, every piece on some page, the font embedded and subset.
import { beforeAll, describe, expect, it } from 'vitest';
import fontkit from '@pdf-lib/fontkit';
import { PDFDocument, PDFDict, PDFName, PDFRawStream, PDFRef, decodePDFRawStream } from 'pdf-lib';
import { outlineArea, pathBoundingBox } from '$lib/pattern/kernel';
import { outlinePleatsAcross } from '$lib/pattern/export/pleat-marks';
import { demoPrintPieces } from './test-support/demo-pieces';
import { boxOf, pdfRead, polygonArea, type ReadPage, type ReadPath } from './test-support/pdf-read';
import { PT_PER_MM, TILE_OVERLAP_MM, type PaperKey } from './paper';
import { printPdf } from './pdf-writer';
import { pdfFonts } from './pdf-fonts';
import { printSheet, type PrintOptions } from './print-sheet';
import { STROKE_STYLE } from './drawing';

const mm = (pt: number) => pt / PT_PER_MM;
const pieces = demoPrintPieces();

async function exported(options: PrintOptions) {
	const sheet = printSheet(pieces, options, 'LR-214 Juniper corset bodice');
	const bytes = await printPdf(sheet, pdfFonts());
	return { sheet, bytes, pages: await pdfRead(bytes) };
}

/** The cut line's area of each piece as printed with its allowance (mm²). */
function cutAreaMm2(i: number): number {
	const p = pieces[i].piece;
	return outlineArea(p.seamAllowance?.cutLine ?? outlinePleatsAcross(p));
}

const isCutLine = (p: ReadPath) => !p.filled && !p.dashed && Math.abs(mm(p.lineWidthPt) - STROKE_STYLE.cut.widthMm) < 1e-6;
const areaMm2 = (p: ReadPath) => polygonArea(p.subpaths[0]) / (PT_PER_MM * PT_PER_MM);

/** Closed, stroked square paths on a page (side in mm). */
function squares(page: ReadPage): number[] {
	return page.paths
		.filter((p) => p.closed && !p.filled && p.subpaths[0].length <= 5)
		.map((p) => [mm(p.box.maxX - p.box.minX), mm(p.box.maxY - p.box.minY)])
		.filter(([w, h]) => Math.abs(w - h) < 0.01)
		.map(([w]) => w);
}

describe('tiled PDF for a home printer', () => {
	let a4: Awaited<ReturnType<typeof exported>>;
	beforeAll(async () => {
		a4 = await exported({ paper: 'a4', allowanceShown: true, pairs: 'both' });
	}, 60_000);

	it('has A4 pages of 595.28 × 841.89 pt (ISO 216: 210 × 297 mm)', () => {
		for (const p of a4.pages) {
			expect(p.widthPt).toBeCloseTo((210 * 72) / 25.4, 2);
			expect(p.heightPt).toBeCloseTo((297 * 72) / 25.4, 2);
		}
		expect(a4.pages.length).toBe(1 + a4.sheet.tiling.tiles.filter((t) => !t.blank).length);
	});

	it('prints a 50 mm and a 2 in test square on the first page, within 0.2 mm', () => {
		const sides = squares(a4.pages[0]);
		expect(sides.some((s) => Math.abs(s - 50) <= 0.2)).toBe(true);
		expect(sides.some((s) => Math.abs(s - 50.8) <= 0.2)).toBe(true);
		expect(a4.pages[0].text.join(' ')).toMatch(/50 mm.*test square/);
		expect(a4.pages[0].text.join(' ')).toMatch(/Print at 100 %/);
		expect(a4.pages[0].text.join(' ')).toMatch(/toile first/);
	});

	it('draws each piece\'s cut line at its true size (area within 0.1 %, extent within 0.2 mm)', () => {
		const page = a4.pages[1];
		const cut = page.paths.filter((p) => p.inForm && isCutLine(p));
		for (let i = 0; i < pieces.length; i++) {
			const want = cutAreaMm2(i);
			const b = pathBoundingBox(pieces[i].piece.seamAllowance?.cutLine ?? outlinePleatsAcross(pieces[i].piece));
			const match = cut.find((p) => Math.abs(areaMm2(p) - want) / want < 0.001);
			expect(match, pieces[i].piece.name).toBeDefined();
			expect(mm(match!.box.maxX - match!.box.minX)).toBeCloseTo(b.maxX - b.minX, 0.7);
			expect(Math.abs(mm(match!.box.maxY - match!.box.minY) - (b.maxY - b.minY))).toBeLessThan(0.2);
		}
	});

	it('shows every piece on at least one page, within the printed area', () => {
		for (let i = 0; i < pieces.length; i++) {
			const want = cutAreaMm2(i);
			const seen = a4.pages.slice(1).some((page) =>
				page.paths.some((p) => {
					if (!isCutLine(p) || !p.clip || Math.abs(areaMm2(p) - want) / want > 0.001) return false;
					return p.box.minX < p.clip.maxX && p.clip.minX < p.box.maxX && p.box.minY < p.clip.maxY && p.clip.minY < p.box.maxY;
				})
			);
			expect(seen, pieces[i].piece.name).toBe(true);
		}
		const text = a4.pages.map((p) => p.text.join(' ')).join(' ');
		for (const { piece } of pieces) expect(text).toContain(piece.name);
	});

	it('has tiles that overlap by the strip and whose alignment marks meet when a page is laid over its neighbour', () => {
		const t = a4.sheet.tiling;
		const pageOf = new Map(t.tiles.filter((x) => !x.blank).map((x, i) => [x.code, a4.pages[i + 1]]));
		let pairs = 0;
		for (const left of t.tiles) {
			const right = t.tiles.find((x) => x.row === left.row && x.col === left.col + 1);
			if (!right || left.blank || right.blank) continue;
			const L = pageOf.get(left.code)!;
			const R = pageOf.get(right.code)!;
			// where R's trimmed left edge goes on L: L's dashed line; R's trim line is its solid left edge
			const dashed = L.paths.find((p) => !p.inForm && p.dashed && Math.abs(p.box.maxX - p.box.minX) < 0.01 && p.box.maxY - p.box.minY > 100)!;
			const trim = R.paths.find((p) => !p.inForm && !p.dashed && Math.abs(p.box.maxX - p.box.minX) < 0.01 && p.box.maxY - p.box.minY > 100)!;
			expect(dashed).toBeDefined();
			expect(trim).toBeDefined();
			const dx = dashed.box.minX - trim.box.minX;
			// the overlap is the strip between the dashed line and L's clip edge
			const clipL = L.paths.find((p) => p.inForm)!.clip!;
			expect(mm(clipL.maxX - dashed.box.minX)).toBeCloseTo(TILE_OVERLAP_MM, 3);
			const marks = (page: ReadPage) =>
				page.paths
					.filter((p) => p.inForm && p.closed && p.subpaths[0].length === 25 && p.clip)
					.map((p) => ({ x: (p.box.minX + p.box.maxX) / 2, y: (p.box.minY + p.box.maxY) / 2, clip: p.clip! }))
					.filter((c) => c.x > c.clip.minX && c.x < c.clip.maxX && c.y > c.clip.minY && c.y < c.clip.maxY);
			const onR = marks(R).filter((c) => c.x < trim.box.minX + TILE_OVERLAP_MM * PT_PER_MM);
			const onL = marks(L).filter((c) => c.x > dashed.box.minX);
			expect(onR.length).toBeGreaterThan(0);
			expect(onR.length).toBe(onL.length);
			for (const m of onR) {
				const d = Math.min(...onL.map((o) => Math.hypot(o.x - (m.x + dx), o.y - m.y)));
				expect(mm(d)).toBeLessThan(0.01);
			}
			pairs++;
		}
		expect(pairs).toBeGreaterThan(0);
	});

	it('embeds Source Sans 3, subset to the glyphs used (no standard-14 font)', async () => {
		const doc = await PDFDocument.load(a4.bytes);
		const fonts: string[] = [];
		const glyphCounts: number[] = [];
		for (const [, obj] of doc.context.enumerateIndirectObjects()) {
			if (!(obj instanceof PDFDict)) continue;
			const type = obj.get(PDFName.of('Type'));
			if (type === PDFName.of('Font') && obj.get(PDFName.of('BaseFont'))) fonts.push(obj.get(PDFName.of('BaseFont'))!.toString());
			const file = obj.get(PDFName.of('FontFile2'));
			if (type === PDFName.of('FontDescriptor') && file instanceof PDFRef) {
				const stream = doc.context.lookup(file) as PDFRawStream;
				glyphCounts.push(fontkit.create(Buffer.from(decodePDFRawStream(stream).decode())).numGlyphs);
			}
		}
		expect(fonts.length).toBeGreaterThan(0);
		for (const f of fonts) expect(f).toMatch(/^\/SourceSans3-/);
		const whole = fontkit.create(Buffer.from(pdfFonts()[0].regular)).numGlyphs;
		expect(glyphCounts.length).toBeGreaterThanOrEqual(2);
		for (const n of glyphCounts) expect(n).toBeLessThan(whole / 2);
	});
});

describe('large paper', () => {
	it.each([
		['letter', 612, 792],
		['a3', 841.89, 1190.55],
		['a0', 2383.94, 3370.39]
	] as [PaperKey, number, number][])('%s pages measure %f × %f pt', async (paper, w, h) => {
		const { pages } = await exported({ paper, allowanceShown: false, pairs: 'once' });
		for (const p of pages) {
			expect(p.widthPt).toBeCloseTo(w, 1);
			expect(p.heightPt).toBeCloseTo(h, 1);
		}
	});

	it('puts everything on one 914 mm roll sheet with both test squares, and reports the roll length', async () => {
		const { pages, sheet } = await exported({ paper: 'roll914', allowanceShown: true, pairs: 'both' });
		expect(pages).toHaveLength(1);
		expect(pages[0].widthPt).toBeCloseTo((914 * 72) / 25.4, 2);
		const sides = squares(pages[0]);
		expect(sides.some((s) => Math.abs(s - 50) <= 0.2)).toBe(true);
		expect(sides.some((s) => Math.abs(s - 50.8) <= 0.2)).toBe(true);
		expect(sheet.tiling.rollLengthMm).toBeCloseTo(mm(pages[0].heightPt), 6);
		expect(pages[0].text.join(' ')).toContain(`Roll length used: ${Math.ceil(sheet.tiling.rollLengthMm!)} mm`);
		const cut = pages[0].paths.filter(isCutLine);
		// every piece and the other half of each pair
		const pairs = pieces.filter((p) => p.piece.cut === 'pair').length;
		expect(cut.length).toBe(pieces.length + pairs);
		expect(boxOf(cut.flatMap((p) => p.subpaths[0])).maxX).toBeLessThan(pages[0].widthPt);
	});
});
