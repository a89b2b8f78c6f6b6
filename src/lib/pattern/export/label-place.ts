import type { Outline, Vec } from '../kernel';
import { outlineFlatten, pathBoundingBox, pathFlatten } from '../kernel';
import type { Piece } from '../piece-schema';
import { outlinePleatsAcross, pleatMarks } from './pleat-marks';

/**
 * Where the text block of an exported piece goes: inside the piece, clear of every mark (grainline,
 * fold line, dart legs, pleat marks, notches, apexes, internal lines, drill holes) and of the stitching
 * line, as near the middle of the piece as it fits. Larger type first, then turned along the piece
 * (narrow panels), then smaller type; a piece too small for any of these gets its label beside it.
 */

/** Clear space kept between the label and any line or mark (mm). */
export const LABEL_CLEARANCE_MM = 3;
/** Type sizes tried, largest first (mm); line spacing is 1.4 × the size. */
export const LABEL_FONT_SIZES_MM = [5, 4, 3] as const;
/** Width of a character of Source Sans 3, generously, as a share of the type size (for layout only). */
export const LABEL_CHAR_WIDTH_EM = 0.56;
const CELL_MM = 2;

export interface LabelPlacement {
	/** Top-left corner of the text block (before turning). */
	readonly at: Vec;
	readonly fontSizeMm: number;
	readonly lineHeightMm: number;
	/** Turned a quarter turn anticlockwise about `at` (reads upward along the piece). */
	readonly turned: boolean;
	/** Inside the piece (false: beside it, the piece was too small). */
	readonly inside: boolean;
	/** The block's extent on the page (after turning). */
	readonly box: { readonly minX: number; readonly minY: number; readonly maxX: number; readonly maxY: number };
}

/** The block size of some lines of text (mm) at a type size. */
export function labelBlockSize(lines: readonly string[], fontSizeMm: number): { widthMm: number; heightMm: number; lineHeightMm: number } {
	const lineHeightMm = fontSizeMm * 1.4;
	const longest = Math.max(0, ...lines.map((l) => l.length));
	return { widthMm: longest * LABEL_CHAR_WIDTH_EM * fontSizeMm, heightMm: (lines.length - 1) * lineHeightMm + fontSizeMm * 1.1, lineHeightMm };
}

type Polyline = readonly Vec[];

/** Every line and mark the label must keep clear of, as polylines (points are one-point polylines). */
export function pieceMarkPolylines(piece: Piece): Polyline[] {
	const out: Polyline[] = [];
	const apex = (id: string) => piece.apexes.find((a) => a.id === id)?.point;
	if (piece.grainline) out.push([piece.grainline.from, piece.grainline.to]);
	if (piece.foldLine) out.push([piece.foldLine.from, piece.foldLine.to]);
	for (const d of piece.darts) {
		const tip = d.pullBack?.sewnPoint ?? apex(d.apexId);
		if (tip) out.push([d.leg1End, tip, d.leg2End]);
	}
	for (const p of piece.pleats) {
		const m = pleatMarks(p);
		out.push([...m.fold], [...m.placement], [m.arrow.from, m.arrow.to]);
	}
	for (const n of piece.notches) out.push([n.at]);
	for (const a of piece.apexes) out.push([a.point]);
	for (const h of piece.drillHoles) out.push([h.at]);
	for (const l of piece.internalLines) out.push(pathFlatten(l.path, 0.5));
	return out;
}

function segmentDistance(p: Vec, a: Vec, b: Vec): number {
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	const len2 = dx * dx + dy * dy;
	const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
	return Math.hypot(p.x - a.x - t * dx, p.y - a.y - t * dy);
}

/**
 * Free cells of a grid over the piece: inside it (scanlines across the flattened stitching line) and
 * clear of its lines and marks (each segment blocks the cells within reach of it).
 */
function freeGrid(outline: Outline, marks: readonly Polyline[]) {
	const b = pathBoundingBox(outline);
	const cols = Math.max(1, Math.ceil((b.maxX - b.minX) / CELL_MM));
	const rows = Math.max(1, Math.ceil((b.maxY - b.minY) / CELL_MM));
	const stitch = outlineFlatten(outline, 0.2);
	const blocked = new Uint8Array(rows * cols).fill(1);
	let sumX = 0;
	let sumY = 0;
	let inside = 0;
	for (let r = 0; r < rows; r++) {
		const y = b.minY + (r + 0.5) * CELL_MM;
		const xs: number[] = [];
		for (let i = 0; i < stitch.length; i++) {
			const a = stitch[i];
			const c = stitch[(i + 1) % stitch.length];
			if (a.y <= y !== c.y <= y) xs.push(a.x + ((y - a.y) * (c.x - a.x)) / (c.y - a.y));
		}
		xs.sort((u, v) => u - v);
		for (let k = 0; k + 1 < xs.length; k += 2) {
			const c0 = Math.max(0, Math.ceil((xs[k] - b.minX) / CELL_MM - 0.5));
			const c1 = Math.min(cols - 1, Math.floor((xs[k + 1] - b.minX) / CELL_MM - 0.5));
			for (let c = c0; c <= c1; c++) {
				blocked[r * cols + c] = 0;
				sumX += b.minX + (c + 0.5) * CELL_MM;
				sumY += y;
				inside++;
			}
		}
	}
	const reach = LABEL_CLEARANCE_MM + CELL_MM * 0.71;
	const blockNear = (a: Vec, q: Vec) => {
		const c0 = Math.max(0, Math.floor((Math.min(a.x, q.x) - reach - b.minX) / CELL_MM));
		const c1 = Math.min(cols - 1, Math.ceil((Math.max(a.x, q.x) + reach - b.minX) / CELL_MM));
		const r0 = Math.max(0, Math.floor((Math.min(a.y, q.y) - reach - b.minY) / CELL_MM));
		const r1 = Math.min(rows - 1, Math.ceil((Math.max(a.y, q.y) + reach - b.minY) / CELL_MM));
		for (let r = r0; r <= r1; r++) {
			for (let c = c0; c <= c1; c++) {
				if (blocked[r * cols + c]) continue;
				const p = { x: b.minX + (c + 0.5) * CELL_MM, y: b.minY + (r + 0.5) * CELL_MM };
				if (segmentDistance(p, a, q) < reach) blocked[r * cols + c] = 1;
			}
		}
	};
	for (const line of [[...stitch, stitch[0]], ...marks]) {
		if (line.length === 1) blockNear(line[0], line[0]);
		for (let i = 0; i + 1 < line.length; i++) blockNear(line[i], line[i + 1]);
	}
	// summed-area table of blocked cells: sat[r * (cols + 1) + c] = blocked cells above and left of (r, c)
	const sat = new Float64Array((rows + 1) * (cols + 1));
	for (let r = 0; r < rows; r++) {
		let rowSum = 0;
		for (let c = 0; c < cols; c++) {
			rowSum += blocked[r * cols + c];
			sat[(r + 1) * (cols + 1) + c + 1] = sat[r * (cols + 1) + c + 1] + rowSum;
		}
	}
	const centre = inside ? { x: sumX / inside, y: sumY / inside } : { x: (b.minX + b.maxX) / 2, y: (b.minY + b.maxY) / 2 };
	const blockedIn = (r0: number, c0: number, h: number, w: number) =>
		sat[(r0 + h) * (cols + 1) + c0 + w] - sat[r0 * (cols + 1) + c0 + w] - sat[(r0 + h) * (cols + 1) + c0] + sat[r0 * (cols + 1) + c0];
	return { b, cols, rows, centre, blockedIn };
}

/** Where the lines of text go on the piece (see the module comment). */
export function labelPlacement(piece: Piece, lines: readonly string[]): LabelPlacement {
	const outline = outlinePleatsAcross(piece);
	const grid = freeGrid(outline, pieceMarkPolylines(piece));
	for (const fontSizeMm of LABEL_FONT_SIZES_MM) {
		const size = labelBlockSize(lines, fontSizeMm);
		for (const turned of [false, true]) {
			const wMm = turned ? size.heightMm : size.widthMm;
			const hMm = turned ? size.widthMm : size.heightMm;
			const w = Math.ceil(wMm / CELL_MM) + 1;
			const h = Math.ceil(hMm / CELL_MM) + 1;
			let best: { r: number; c: number; d: number } | null = null;
			for (let r = 0; r + h <= grid.rows; r++) {
				for (let c = 0; c + w <= grid.cols; c++) {
					if (grid.blockedIn(r, c, h, w) > 0) continue;
					const cx = grid.b.minX + (c + w / 2) * CELL_MM;
					const cy = grid.b.minY + (r + h / 2) * CELL_MM;
					const d = Math.hypot(cx - grid.centre.x, cy - grid.centre.y);
					if (!best || d < best.d) best = { r, c, d };
				}
			}
			if (!best) continue;
			// centre the block in the free rectangle found
			const minX = grid.b.minX + best.c * CELL_MM + (w * CELL_MM - wMm) / 2;
			const minY = grid.b.minY + best.r * CELL_MM + (h * CELL_MM - hMm) / 2;
			const box = { minX, minY, maxX: minX + wMm, maxY: minY + hMm };
			// turned: the text's top-left corner is the box's bottom-left
			const at = turned ? { x: minX, y: minY + hMm } : { x: minX, y: minY };
			return { at, fontSizeMm, lineHeightMm: size.lineHeightMm, turned, inside: true, box };
		}
	}
	const fontSizeMm = LABEL_FONT_SIZES_MM[0];
	const size = labelBlockSize(lines, fontSizeMm);
	const cut = piece.seamAllowance ? pathBoundingBox(piece.seamAllowance.cutLine) : grid.b;
	const at = { x: cut.minX, y: cut.maxY + 8 };
	return {
		at,
		fontSizeMm,
		lineHeightMm: size.lineHeightMm,
		turned: false,
		inside: false,
		box: { minX: at.x, minY: at.y, maxX: at.x + size.widthMm, maxY: at.y + size.heightMm }
	};
}
