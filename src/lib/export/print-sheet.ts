import type { Piece } from '$lib/pattern/piece-schema';
import { drawingBoundingBox, drawingTranslate, polyline, rectPath, type DrawItem } from './drawing';
import { drawingInkRects } from './drawing-ink';
import { shelfPack } from './pack';
import { tiledLayout } from './sheet-layout';
import { PAPERS, PIECE_GAP_MM, PRINT_CAUTION_LINES, TILE_OVERLAP_MM, type PaperKey } from './paper';
import { pieceAsPrinted, pieceDrawing, pieceLabelLines, pieceMirrored, type PieceLabelMeta } from './piece-drawing';
import { printableWidthMm, sheetTiling, type Rect, type Tiling } from './tiles';

/**
 * The print layout of a style: every piece (and the other half of each pair, when asked) at true
 * scale on one large sheet, packed without overlap, then cut into pages of the chosen paper. Pure.
 */
export interface PrintOptions {
	readonly paper: PaperKey;
	/** Cut line with the seam allowance and stitching line dashed; otherwise the net line, cut. */
	readonly allowanceShown: boolean;
	/** A piece cut as a pair: drawn twice (both halves, one mirrored) or once. */
	readonly pairs: 'both' | 'once';
}

export interface PrintPieceInput {
	readonly piece: Piece;
	readonly meta: PieceLabelMeta;
}

export interface PlacedPiece {
	readonly name: string;
	readonly pieceId: string;
	readonly mirrored: boolean;
	/** Where the piece's drawing lies on the sheet (mm). */
	readonly rect: Rect;
	/** Offset from the piece's own coordinates to the sheet's. */
	readonly offset: { readonly x: number; readonly y: number };
}

export interface PrintSheet {
	readonly title: string;
	readonly widthMm: number;
	readonly heightMm: number;
	readonly items: readonly DrawItem[];
	readonly placed: readonly PlacedPiece[];
	readonly tiling: Tiling;
	/** Large paper: the test squares and caution sit on the sheet itself (small paper: on a cover page). */
	readonly infoOnSheet: boolean;
}

/** One side of each test square (mm): 50 mm and 2 in. */
export const TEST_SQUARES_MM = [50, 50.8] as const;

/** The two test squares, labelled, and the caution, as a block about 125 × 80 mm from (0, 0). */
export function infoBlock(title: string): DrawItem[] {
	const items: DrawItem[] = [];
	items.push({ kind: 'text', at: { x: 0, y: 6 }, text: title, sizeMm: 5, bold: true });
	PRINT_CAUTION_LINES.forEach((text, i) => items.push({ kind: 'text', at: { x: 0, y: 12 + i * 4.5 }, text, sizeMm: 3.2 }));
	let x = 0;
	for (const side of TEST_SQUARES_MM) {
		items.push(rectPath(x, 22, side, side, 'mark'));
		const label = side === 50 ? ['50 mm', 'test square'] : ['2 in', 'test square'];
		items.push({ kind: 'text', at: { x: x + 3, y: 22 + side / 2 - 1 }, text: label[0], sizeMm: 5, bold: true });
		items.push({ kind: 'text', at: { x: x + 3, y: 22 + side / 2 + 5 }, text: label[1], sizeMm: 3.5 });
		x += side + 15;
	}
	items.push({ kind: 'text', at: { x: 0, y: 80 }, text: 'Each square must measure its size on both sides.', sizeMm: 3.2 });
	return items;
}

export function printSheet(pieces: readonly PrintPieceInput[], options: PrintOptions, title: string): PrintSheet {
	const large = PAPERS[options.paper].large;
	const drawings: { name: string; pieceId: string; mirrored: boolean; items: DrawItem[] }[] = [];
	for (const { piece, meta } of pieces) {
		const printed = pieceAsPrinted(piece, options.allowanceShown);
		const asPair = piece.cut === 'pair' && options.pairs === 'both';
		const lines = pieceLabelLines(printed, meta, { drawnAsPair: asPair, allowanceShown: options.allowanceShown });
		drawings.push({ name: piece.name, pieceId: piece.id, mirrored: false, items: pieceDrawing(printed, lines) });
		if (asPair) {
			const other = pieceMirrored(printed);
			drawings.push({ name: piece.name, pieceId: piece.id, mirrored: true, items: pieceDrawing(other, [...lines.slice(0, 4), 'mirrored half of the pair', ...lines.slice(4)]) });
		}
	}
	if (large) drawings.unshift({ name: '', pieceId: '', mirrored: false, items: infoBlock(title) });
	const boxes = drawings.map((d) => drawingBoundingBox(d.items));
	const sizes = boxes.map((b) => ({ widthMm: b.maxX - b.minX, heightMm: b.maxY - b.minY }));
	// where each drawing has ink, from its box's top-left corner: pages none of it reaches are not printed
	const ink = drawings.map((d, i) => drawingInkRects(d.items).map((r) => ({ ...r, x: r.x - boxes[i].minX, y: r.y - boxes[i].minY })));
	const inkAt = (at: readonly { x: number; y: number }[]) => ink.flatMap((rs, i) => rs.map((r) => ({ ...r, x: r.x + at[i].x, y: r.y + at[i].y })));
	let packed: { at: readonly { x: number; y: number }[]; widthMm: number; heightMm: number };
	if (large) packed = shelfPack(sizes, Math.max(printableWidthMm(options.paper), ...sizes.map((s) => s.widthMm)), PIECE_GAP_MM, true);
	else {
		// both halves of a pair side by side, as one unit
		const units: number[][] = [];
		drawings.forEach((d, i) => {
			if (d.mirrored && units.length && drawings[units[units.length - 1][0]].pieceId === d.pieceId) units[units.length - 1].push(i);
			else units.push([i]);
		});
		packed = tiledLayout(sizes, units, options.paper, ink);
	}
	const items: DrawItem[] = [];
	const placed: PlacedPiece[] = [];
	drawings.forEach((d, i) => {
		const b = boxes[i];
		const offset = { x: packed.at[i].x - b.minX, y: packed.at[i].y - b.minY };
		items.push(...drawingTranslate(d.items, offset.x, offset.y));
		const rect = { x: packed.at[i].x, y: packed.at[i].y, w: sizes[i].widthMm, h: sizes[i].heightMm };
		if (d.pieceId) placed.push({ name: d.name, pieceId: d.pieceId, mirrored: d.mirrored, rect, offset });
	});
	const filled: Rect[] = inkAt(packed.at);
	const tiling = sheetTiling(options.paper, packed.widthMm, packed.heightMm, filled);
	for (const m of tiling.marks) items.push(...alignmentMark(m.x, m.y));
	return { title, widthMm: packed.widthMm, heightMm: packed.heightMm, items, placed, tiling, infoOnSheet: large };
}

/** Alignment mark radius (mm): a circle with a cross through it, printed on both neighbouring pages. */
export const ALIGNMENT_MARK_RADIUS_MM = 3;

export function alignmentMark(x: number, y: number): DrawItem[] {
	const r = ALIGNMENT_MARK_RADIUS_MM;
	const circle: { x: number; y: number }[] = [];
	for (let i = 0; i < 24; i++) circle.push({ x: x + r * Math.cos((i * Math.PI) / 12), y: y + r * Math.sin((i * Math.PI) / 12) });
	return [
		polyline(circle, 'fine', true),
		polyline([{ x: x - r * 1.6, y }, { x: x + r * 1.6, y }], 'fine'),
		polyline([{ x, y: y - r * 1.6 }, { x, y: y + r * 1.6 }], 'fine')
	];
}
