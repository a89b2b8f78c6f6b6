import type { Vec } from '$lib/pattern/kernel';
import { PAPERS, PRINT_MARGIN_MM, ROLL_MAX_LENGTH_MM, TILE_OVERLAP_MM, type PaperKey } from './paper';

/**
 * Cutting a laid-out sheet (mm, y down, origin top-left) into pages. Each page prints a region of the
 * sheet inside its margin; neighbouring regions share an overlap strip (right and bottom of a page), so
 * the next page, trimmed along its left or top edge, is laid over the strip and the alignment marks
 * printed on both meet. Pure.
 */
export interface Tile {
	readonly row: number;
	readonly col: number;
	/** Row letter and column number, e.g. "B3". */
	readonly code: string;
	/** The region of the sheet this page prints (mm). */
	readonly x: number;
	readonly y: number;
	readonly widthMm: number;
	readonly heightMm: number;
	/** No piece falls on it: not printed. */
	readonly blank: boolean;
}

export interface Tiling {
	readonly paper: PaperKey;
	readonly pageWidthMm: number;
	readonly pageHeightMm: number;
	readonly marginMm: number;
	readonly overlapMm: number;
	readonly rows: number;
	readonly cols: number;
	/** Every tile, row by row; blank ones included (the page map shows them). */
	readonly tiles: readonly Tile[];
	/** Where the alignment marks go (sheet coordinates), each in an overlap strip. */
	readonly marks: readonly Vec[];
	/** For the roll: the length of paper used (mm), sheets added up. */
	readonly rollLengthMm: number | null;
}

/** Row letters: A … Z, then AA, AB … */
export function rowLetter(row: number): string {
	let s = '';
	let n = row;
	do {
		s = String.fromCharCode(65 + (n % 26)) + s;
		n = Math.floor(n / 26) - 1;
	} while (n >= 0);
	return s;
}

export function tileCode(row: number, col: number): string {
	return `${rowLetter(row)}${col + 1}`;
}

export interface Rect {
	readonly x: number;
	readonly y: number;
	readonly w: number;
	readonly h: number;
}

/** Printable width of the paper, i.e. the widest sheet a large paper takes in one piece (mm). */
export function printableWidthMm(paper: PaperKey): number {
	return PAPERS[paper].widthMm - 2 * PRINT_MARGIN_MM;
}

/** The page grid of a tiling: pages start every sx, sy and print pw × ph. */
export interface PageGridSteps {
	readonly sx: number;
	readonly sy: number;
	readonly pw: number;
	readonly ph: number;
	readonly cols: number;
	readonly rows: number;
}

/**
 * Adds to `into` the pages (row · cols + col) that rectangle f, moved by (dx, dy), reaches: page (c, r)
 * prints the region (c·sx, r·sy, pw, ph), which meets f when c·sx < f.x + f.w and f.x < c·sx + pw.
 */
export function pagesTouched(f: Rect, dx: number, dy: number, g: PageGridSteps, into: Set<number>) {
	const x = f.x + dx;
	const y = f.y + dy;
	const c0 = Math.max(0, Math.floor((x - g.pw) / g.sx) + 1);
	const c1 = Math.min(g.cols - 1, Math.ceil((x + f.w) / g.sx) - 1);
	const r0 = Math.max(0, Math.floor((y - g.ph) / g.sy) + 1);
	const r1 = Math.min(g.rows - 1, Math.ceil((y + f.h) / g.sy) - 1);
	for (let r = r0; r <= r1; r++) for (let c = c0; c <= c1; c++) into.add(r * g.cols + c);
}

/** The page grid small paper cuts a sheet of this size into. */
export function pageGridSteps(paper: PaperKey, sheetWidthMm: number, sheetHeightMm: number): PageGridSteps {
	const pw = PAPERS[paper].widthMm - 2 * PRINT_MARGIN_MM;
	const ph = PAPERS[paper].heightMm - 2 * PRINT_MARGIN_MM;
	const sx = pw - TILE_OVERLAP_MM;
	const sy = ph - TILE_OVERLAP_MM;
	return { sx, sy, pw, ph, cols: Math.max(1, Math.ceil((sheetWidthMm - TILE_OVERLAP_MM) / sx)), rows: Math.max(1, Math.ceil((sheetHeightMm - TILE_OVERLAP_MM) / sy)) };
}

export function sheetTiling(paper: PaperKey, sheetWidthMm: number, sheetHeightMm: number, filled: readonly Rect[]): Tiling {
	const p = PAPERS[paper];
	const margin = PRINT_MARGIN_MM;
	const overlap = TILE_OVERLAP_MM;
	const pageWidthMm = p.widthMm;
	let pageHeightMm: number = p.heightMm;
	let rollLengthMm: number | null = null;
	if (paper === 'roll914') {
		pageHeightMm = Math.min(ROLL_MAX_LENGTH_MM, sheetHeightMm + 2 * margin);
	}
	const pw = pageWidthMm - 2 * margin;
	const ph = pageHeightMm - 2 * margin;
	const sx = pw - overlap;
	const sy = ph - overlap;
	const cols = Math.max(1, Math.ceil((sheetWidthMm - overlap) / sx));
	const rows = Math.max(1, Math.ceil((sheetHeightMm - overlap) / sy));
	const touched = new Set<number>();
	for (const f of filled) pagesTouched(f, 0, 0, { sx, sy, pw, ph, cols, rows }, touched);
	const tiles: Tile[] = [];
	for (let r = 0; r < rows; r++) {
		for (let c = 0; c < cols; c++) {
			tiles.push({ row: r, col: c, code: tileCode(r, c), x: c * sx, y: r * sy, widthMm: pw, heightMm: ph, blank: !touched.has(r * cols + c) });
		}
	}
	if (paper === 'roll914') {
		// the last sheet is cut where the layout ends
		rollLengthMm = (rows - 1) * pageHeightMm + Math.min(pageHeightMm, Math.max(0, sheetHeightMm - (rows - 1) * sy) + 2 * margin);
	}
	const marks: Vec[] = [];
	for (let c = 0; c + 1 < cols; c++) {
		const x = (c + 1) * sx + overlap / 2;
		for (let r = 0; r < rows; r++) for (const f of [0.3, 0.7]) marks.push({ x, y: r * sy + ph * f });
	}
	for (let r = 0; r + 1 < rows; r++) {
		const y = (r + 1) * sy + overlap / 2;
		for (let c = 0; c < cols; c++) for (const f of [0.3, 0.7]) marks.push({ x: c * sx + pw * f, y });
	}
	return { paper, pageWidthMm, pageHeightMm, marginMm: margin, overlapMm: overlap, rows, cols, tiles, marks, rollLengthMm };
}

/** The neighbours a page joins, for its margin: "above A3 · left B2 · right B4 · below C3". */
export function tileJoins(t: Tiling, tile: Tile): string {
	const at = (r: number, c: number) => t.tiles.find((x) => x.row === r && x.col === c && !x.blank);
	const parts: string[] = [];
	const add = (word: string, n: Tile | undefined) => n && parts.push(`${word} ${n.code}`);
	add('above', at(tile.row - 1, tile.col));
	add('left', at(tile.row, tile.col - 1));
	add('right', at(tile.row, tile.col + 1));
	add('below', at(tile.row + 1, tile.col));
	return parts.join(' · ');
}
