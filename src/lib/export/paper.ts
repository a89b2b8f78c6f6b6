/** Paper the print export can lay out on, portrait, in millimetres. */
export const PAPERS = {
	a4: { label: 'A4 (home printer)', widthMm: 210, heightMm: 297, large: false },
	letter: { label: 'US Letter (home printer)', widthMm: 215.9, heightMm: 279.4, large: false },
	a3: { label: 'A3', widthMm: 297, heightMm: 420, large: false },
	a0: { label: 'A0 (copy shop, plotter)', widthMm: 841, heightMm: 1189, large: true },
	roll914: { label: '914 mm roll (plotter)', widthMm: 914, heightMm: 5000, large: true }
} as const;

export type PaperKey = keyof typeof PAPERS;
export const PAPER_KEYS = Object.keys(PAPERS) as PaperKey[];

/** PostScript points per millimetre (1 pt = 1/72 in, 1 in = 25.4 mm). */
export const PT_PER_MM = 72 / 25.4;

/** Blank border a home printer needs round the printed area (mm). */
export const PRINT_MARGIN_MM = 12;
/** Strip printed on both neighbouring pages, to lay one over the other (mm). */
export const TILE_OVERLAP_MM = 12;
/** Gap between pieces on the sheet (mm). */
export const PIECE_GAP_MM = 15;
/** The longest sheet cut from a roll (mm): a longer layout goes onto several sheets. */
export const ROLL_MAX_LENGTH_MM = 5000;

/** The usual caution, on the first page of a print and beside the download button. */
export const PRINT_CAUTION_LINES = [
	'Print at 100 % (actual size, no "fit to page" or "shrink").',
	'Measure both test squares before cutting, and make a toile first.'
] as const;
export const PRINT_CAUTION = PRINT_CAUTION_LINES.join(' ');
