import { COLORS } from '$lib/palette';

/**
 * The tone each size of a run is drawn in on the nest: the palette's text-safe tones (4.5:1 on paper,
 * so a size's name written in its tone reads), in an order that sets neighbouring sizes apart; past the
 * seventh size the tones come round again with a dash, then a dotted line.
 */
const TONES = [COLORS.indigo.DEFAULT, COLORS.madder.DEFAULT, COLORS.sage.DEFAULT, COLORS.ochre.DEFAULT, COLORS.ink.DEFAULT, COLORS.indigo.dark, COLORS.ink.soft] as const;

export interface SizeTone {
	readonly color: string;
	/** An SVG dash pattern in multiples of the line width, or null for a solid line. */
	readonly dash: readonly number[] | null;
}

export function sizeTone(index: number): SizeTone {
	const round = Math.floor(index / TONES.length) % 3;
	return { color: TONES[index % TONES.length], dash: round === 0 ? null : round === 1 ? [6, 3] : [1.5, 2.5] };
}
