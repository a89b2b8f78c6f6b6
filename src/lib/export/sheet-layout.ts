import { shelfPack, type PackItem, type Packed } from './pack';
import { PAPERS, PIECE_GAP_MM, PRINT_MARGIN_MM, TILE_OVERLAP_MM, type PaperKey } from './paper';
import { pageAwarePack, skylinePack, type PackOrder } from './skyline';
import { pageGridSteps, pagesTouched, printableWidthMm, type Rect } from './tiles';

/**
 * Where the drawings go on a sheet that small paper tiles: the layout that prints the fewest pages among
 * shelf and skyline packing on strips of one to a few page widths. Both halves of a pair are packed as one
 * unit, side by side (packed apart, the demo style would take 26 A4 pages instead of 27). Nothing is
 * turned: grainlines keep their direction on the paper. Pages are counted by where the drawings have ink
 * (`ink`: each drawing's rectangles from its box's top-left corner). Pure.
 */
export interface SheetLayout extends Packed {
	/** Pages printed (tiles some drawing falls on). */
	readonly pages: number;
	readonly packer: (typeof PACKERS)[number];
	readonly stripWidthMm: number;
}

const PACKERS = ['shelf', 'skyline-height', 'skyline-width', 'skyline-area', 'pages'] as const;

/** How many more page widths than the least are tried. */
const EXTRA_COLUMNS = 4;

/** Pages printed: those some ink rectangle (drawing i's, from its box corner) reaches, placed at `at`. */
function pagesPrinted(paper: PaperKey, packed: Packed, ink: readonly (readonly Rect[])[]): number {
	const grid = pageGridSteps(paper, packed.widthMm, packed.heightMm);
	const touched = new Set<number>();
	ink.forEach((rects, i) => {
		for (const r of rects) pagesTouched(r, packed.at[i].x, packed.at[i].y, grid, touched);
	});
	return touched.size;
}

export function tiledLayout(sizes: readonly PackItem[], units: readonly (readonly number[])[], paper: PaperKey, ink: readonly (readonly Rect[])[]): SheetLayout {
	const gap = PIECE_GAP_MM;
	const unitSizes = units.map((u) => ({
		widthMm: u.reduce((t, i) => t + sizes[i].widthMm, 0) + gap * (u.length - 1),
		heightMm: Math.max(...u.map((i) => sizes[i].heightMm))
	}));
	const step = printableWidthMm(paper) - TILE_OVERLAP_MM;
	const pageHeightMm = PAPERS[paper].heightMm - 2 * PRINT_MARGIN_MM;
	const grid = { stepXMm: step, stepYMm: pageHeightMm - TILE_OVERLAP_MM, pageWidthMm: printableWidthMm(paper), pageHeightMm };
	const widest = Math.max(0, ...unitSizes.map((s) => s.widthMm));
	const least = Math.max(1, Math.ceil((widest - TILE_OVERLAP_MM) / step));
	let best: SheetLayout | null = null;
	for (let cols = least; cols <= least + EXTRA_COLUMNS; cols++) {
		const strip = Math.max(cols * step + TILE_OVERLAP_MM, widest);
		for (const packer of PACKERS) {
			const packed =
				packer === 'shelf'
					? shelfPack(unitSizes, strip, gap)
					: packer === 'pages'
						? pageAwarePack(unitSizes, strip, gap, grid)
						: skylinePack(unitSizes, strip, gap, packer.slice('skyline-'.length) as PackOrder);
			const at: { x: number; y: number }[] = sizes.map(() => ({ x: 0, y: 0 }));
			units.forEach((u, k) => {
				let x = packed.at[k].x;
				for (const i of u) {
					at[i] = { x, y: packed.at[k].y };
					x += sizes[i].widthMm + gap;
				}
			});
			const pages = pagesPrinted(paper, { at, widthMm: packed.widthMm, heightMm: packed.heightMm }, ink);
			const area = packed.widthMm * packed.heightMm;
			if (!best || pages < best.pages || (pages === best.pages && area < best.widthMm * best.heightMm - 1e-6)) {
				best = { at, widthMm: packed.widthMm, heightMm: packed.heightMm, pages, packer, stripWidthMm: strip };
			}
		}
	}
	return best!;
}
