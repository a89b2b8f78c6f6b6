import fontkit from '@pdf-lib/fontkit';
import {
	PDFDocument,
	appendBezierCurve,
	clip,
	closePath,
	concatTransformationMatrix,
	endPath,
	fill,
	lineTo,
	moveTo,
	popGraphicsState,
	pushGraphicsState,
	rectangle,
	rgb,
	setDashPattern,
	setFillingColor,
	setLineWidth,
	setStrokingColor,
	stroke,
	type PDFEmbeddedPage,
	type PDFOperator,
	type PDFPage
} from 'pdf-lib';
import { COLORS } from '../palette';
import { STROKE_STYLE, type DrawItem } from './drawing';
import { PRINT_CAUTION, PT_PER_MM } from './paper';
import type { PrintSheet } from './print-sheet';
import { infoBlock } from './print-sheet';
import { tileJoins } from './tiles';
import type { PdfFonts } from './pdf-fonts';
import { pdfTextFonts, textDraw, type PdfTextFonts } from './pdf-text';

/**
 * Writes a print sheet as PDF with pdf-lib: the whole sheet is drawn once at true scale (1 mm =
 * 72/25.4 pt) on a page that becomes a form, then each page of the paper shows its region of it,
 * clipped to the printable area. Source Sans 3 is embedded and subset (the fonts come in as bytes), each
 * script part of it only where the text needs it.
 */

/** Lines and labels in the palette's ink. */
const INK = (() => {
	const n = parseInt(COLORS.ink.DEFAULT.slice(1), 16);
	return rgb(((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255);
})();
const k = PT_PER_MM;

type Fonts = PdfTextFonts;

/** A placement of sheet coordinates (mm, y down) on a page: (x, y) → (ox + s·x, oy − s·y) in points. */
interface Placement {
	readonly ox: number;
	readonly oy: number;
	/** Points per sheet millimetre. */
	readonly s: number;
	/** Line widths multiplied by this (a reduced map keeps legible lines). */
	readonly widthScale?: number;
	readonly textScale?: number;
}

function pathOperators(items: readonly DrawItem[], at: Placement, color = INK): PDFOperator[] {
	const ops: PDFOperator[] = [pushGraphicsState(), concatTransformationMatrix(at.s, 0, 0, -at.s, at.ox, at.oy), setStrokingColor(color), setFillingColor(color)];
	for (const it of items) {
		if (it.kind === 'dot') {
			const r = it.radiusMm;
			const c = 0.5523 * r;
			const { x, y } = it.at;
			ops.push(
				moveTo(x + r, y),
				appendBezierCurve(x + r, y + c, x + c, y + r, x, y + r),
				appendBezierCurve(x - c, y + r, x - r, y + c, x - r, y),
				appendBezierCurve(x - r, y - c, x - c, y - r, x, y - r),
				appendBezierCurve(x + c, y - r, x + r, y - c, x + r, y),
				closePath(),
				fill()
			);
			continue;
		}
		if (it.kind !== 'path' || it.segments.length === 0) continue;
		const style = STROKE_STYLE[it.stroke];
		ops.push(setLineWidth(style.widthMm * (at.widthScale ?? 1)), setDashPattern([...style.dashMm], 0));
		ops.push(moveTo(it.segments[0].p0.x, it.segments[0].p0.y));
		for (const sgm of it.segments) {
			if (sgm.kind === 'line') ops.push(lineTo(sgm.p1.x, sgm.p1.y));
			else ops.push(appendBezierCurve(sgm.p1.x, sgm.p1.y, sgm.p2.x, sgm.p2.y, sgm.p3.x, sgm.p3.y));
		}
		if (it.closed) ops.push(closePath());
		ops.push(it.fill ? fill() : stroke());
	}
	ops.push(popGraphicsState());
	return ops;
}

/** Operators pushed in slices: one spread of a large sheet's operators would overflow the call stack. */
function pushAll(page: PDFPage, ops: readonly PDFOperator[]) {
	for (let i = 0; i < ops.length; i += 8192) page.pushOperators(...ops.slice(i, i + 8192));
}

function drawItems(page: PDFPage, items: readonly DrawItem[], fonts: Fonts, at: Placement, color = INK) {
	pushAll(page, pathOperators(items, at, color));
	for (const it of items) {
		if (it.kind !== 'text') continue;
		const size = it.sizeMm * k * (at.textScale ?? at.s / k);
		textDraw(page, fonts, it.text, { x: at.ox + at.s * it.at.x, y: at.oy - at.s * it.at.y, size, bold: it.bold, color, turned: it.turned });
	}
}

function text(page: PDFPage, fonts: Fonts, s: string, xMm: number, yMmFromTop: number, sizePt: number, bold = false) {
	const h = page.getHeight();
	textDraw(page, fonts, s, { x: xMm * k, y: h - yMmFromTop * k, size: sizePt, bold, color: INK });
}

/** The first page of a tiled print: caution, test squares, page map and how to join the pages. */
function coverPage(doc: PDFDocument, sheet: PrintSheet, form: PDFEmbeddedPage, fonts: Fonts) {
	const t = sheet.tiling;
	const page = doc.addPage([t.pageWidthMm * k, t.pageHeightMm * k]);
	const m = t.marginMm;
	drawItems(page, infoBlock(sheet.title), fonts, { ox: m * k, oy: page.getHeight() - m * k, s: k });
	const printed = t.tiles.filter((x) => !x.blank).length;
	const lines = [
		`Page map: ${printed} pages to print after this one (${t.rows} rows A… × ${t.cols} columns).`,
		`Trim each page along its solid left and top edge, lay it over its neighbour up to the dashed line,`,
		`match the circled crosses, tape. Pages overlap by ${t.overlapMm} mm. Empty places in the map are not printed.`
	];
	lines.forEach((l, i) => text(page, fonts, l, m, m + 92 + i * 4.6, 9));
	// the map: each page's region (the part it adds), with its code and the pieces' outlines
	const boxW = t.pageWidthMm - 2 * m;
	const boxH = t.pageHeightMm - 2 * m - 110;
	const stepX = t.tiles[0].widthMm - t.overlapMm;
	const stepY = t.tiles[0].heightMm - t.overlapMm;
	const gridW = t.cols * stepX + t.overlapMm;
	const gridH = t.rows * stepY + t.overlapMm;
	const s = Math.min(boxW / gridW, boxH / gridH);
	const at: Placement = { ox: m * k, oy: page.getHeight() - (m + 108) * k, s: s * k, widthScale: 0.5 / s, textScale: 1 };
	// the sheet itself, reduced: the same drawing every page shows
	page.drawPage(form, { x: at.ox, y: at.oy - form.height * s, xScale: s, yScale: s, opacity: 0.6 });
	for (const tile of t.tiles) {
		const rect = { kind: 'path' as const, segments: [], closed: true, stroke: tile.blank ? ('overlap' as const) : ('mark' as const) };
		const x0 = tile.col * stepX;
		const y0 = tile.row * stepY;
		const corners = [
			{ x: x0, y: y0 },
			{ x: x0 + stepX, y: y0 },
			{ x: x0 + stepX, y: y0 + stepY },
			{ x: x0, y: y0 + stepY }
		];
		const segments = corners.map((p, i) => ({ kind: 'line' as const, p0: p, p1: corners[(i + 1) % 4] }));
		pushAll(page, pathOperators([{ ...rect, segments }], at));
		if (!tile.blank) {
			textDraw(page, fonts, tile.code, { x: at.ox + at.s * (x0 + stepX / 2) - 8, y: at.oy - at.s * (y0 + stepY / 2) - 5, size: 14, bold: true, color: INK });
		}
	}
}

/** One page of the paper showing a tile of the sheet, with its code, joins, trim edges and overlap lines. */
function tilePage(doc: PDFDocument, sheet: PrintSheet, form: PDFEmbeddedPage, index: number, fonts: Fonts) {
	const t = sheet.tiling;
	const tile = t.tiles[index];
	const page = doc.addPage([t.pageWidthMm * k, t.pageHeightMm * k]);
	const m = t.marginMm;
	const H = page.getHeight();
	const clipRect = [m * k, H - (m + tile.heightMm) * k, tile.widthMm * k, tile.heightMm * k] as const;
	// the region (x, y) of the sheet is drawn at the printable area's top-left corner
	const tx = (m - tile.x) * k;
	const ty = H - m * k - form.height + tile.y * k;
	page.pushOperators(pushGraphicsState(), rectangle(...clipRect), clip(), endPath());
	page.drawPage(form, { x: tx, y: ty });
	page.pushOperators(popGraphicsState());
	// edges: solid where this page is trimmed (left, top, when it has a neighbour there), dashed where the next one lies
	const edges: DrawItem[] = [];
	const w = tile.widthMm;
	const h = tile.heightMm;
	const line = (a: [number, number], b: [number, number], stroke: 'trim' | 'overlap'): DrawItem => ({
		kind: 'path',
		segments: [{ kind: 'line', p0: { x: a[0], y: a[1] }, p1: { x: b[0], y: b[1] } }],
		closed: false,
		stroke
	});
	if (tile.col > 0) edges.push(line([0, 0], [0, h], 'trim'));
	if (tile.row > 0) edges.push(line([0, 0], [w, 0], 'trim'));
	if (tile.col + 1 < t.cols) edges.push(line([w - t.overlapMm, 0], [w - t.overlapMm, h], 'overlap'));
	if (tile.row + 1 < t.rows) edges.push(line([0, h - t.overlapMm], [w, h - t.overlapMm], 'overlap'));
	pushAll(page, pathOperators(edges, { ox: m * k, oy: H - m * k, s: k }));
	text(page, fonts, tile.code, m, m - 2.5, 14, true);
	const joins = tileJoins(t, tile);
	text(page, fonts, `${sheet.title} · page ${tile.code}${joins ? ` · joins ${joins}` : ''} · print at 100 %`, m + 14, m - 2.5, 7);
	if (t.rollLengthMm !== null) text(page, fonts, `Roll length used: ${Math.ceil(t.rollLengthMm)} mm`, m, t.pageHeightMm - m + 6, 9);
}

export async function printPdf(sheet: PrintSheet, fontBytes: PdfFonts): Promise<Uint8Array> {
	const doc = await PDFDocument.create();
	doc.registerFontkit(fontkit);
	const texts = [sheet.title, ...sheet.items.flatMap((it) => (it.kind === 'text' ? [it.text] : []))];
	const fonts = await pdfTextFonts(doc, fontBytes, texts);
	doc.setTitle(sheet.title);
	doc.setCreator('Dartelier');
	doc.setProducer('Dartelier (pdf-lib)');
	doc.setSubject(PRINT_CAUTION);
	// the whole sheet, once, at true scale
	const big = doc.addPage([Math.max(1, sheet.widthMm) * k, Math.max(1, sheet.heightMm) * k]);
	drawItems(big, sheet.items, fonts, { ox: 0, oy: big.getHeight(), s: k });
	const form = await doc.embedPage(big);
	doc.removePage(0);
	if (!sheet.infoOnSheet) coverPage(doc, sheet, form, fonts);
	sheet.tiling.tiles.forEach((tile, i) => {
		if (!tile.blank) tilePage(doc, sheet, form, i, fonts);
	});
	return doc.save({ useObjectStreams: false });
}
