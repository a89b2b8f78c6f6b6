import { colorAlpha, COLORS } from '$lib/palette';

/** The canvas colours, taken from the one palette (src/lib/palette.ts): strokes in its light tones. */
export const PALETTE = {
	paper: COLORS.paper.DEFAULT,
	pieceFill: COLORS.paper.light,
	ink: COLORS.ink.DEFAULT,
	chalk: COLORS.chalk.DEFAULT,
	gridMajor: COLORS.chalk.dark,
	/** The faint shadow of a piece of paper on the table (ink, mostly transparent). */
	shadow: colorAlpha(COLORS.ink.DEFAULT, 0.16),
	indigo: COLORS.indigo.DEFAULT,
	madder: COLORS.madder.light,
	sage: COLORS.sage.light,
	ochre: COLORS.ochre.light
} as const;
