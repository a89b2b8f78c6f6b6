/**
 * EN 13402-3 bra size code: band = under-bust girth rounded to the nearest 5 cm; cup letter from
 * (bust − under-bust) in 2 cm bands. Source: EN 13402-3 via secondary help pages
 * (reference-values row 2): C for the C band (16,18] cm and the D band (18,20] cm and the worked
 * examples; the other letters follow the same 2 cm rule and are M (unconfirmed).
 */
export const cupLetters = ['AA', 'A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'J', 'K'] as const;
export type CupLetter = (typeof cupLetters)[number];

/** The AA band is (10,12] cm; each next letter 2 cm more. */
const FIRST_BAND_LOWER_MM = 100;
const BAND_WIDTH_MM = 20;

export interface CupCode {
	/** Under-bust rounded to the nearest 5 cm, in cm. */
	readonly bandCm: number;
	readonly cup: CupLetter | null;
	/** e.g. "85D"; null when the difference is outside the lettered bands. */
	readonly code: string | null;
	readonly differenceMm: number;
	/** 'C' for the C and D bands (confirmed), 'M' for the others. */
	readonly status: 'C' | 'M';
}

export function cupCode(bustMm: number, underbustMm: number): CupCode {
	const differenceMm = bustMm - underbustMm;
	const bandCm = Math.floor(underbustMm / 50 + 0.5 + 1e-9) * 5;
	const index = Math.ceil((differenceMm - FIRST_BAND_LOWER_MM) / BAND_WIDTH_MM - 1e-9) - 1;
	const cup = index >= 0 && index < cupLetters.length ? cupLetters[index] : null;
	return {
		bandCm,
		cup,
		code: cup ? `${bandCm}${cup}` : null,
		differenceMm,
		status: cup === 'C' || cup === 'D' ? 'C' : 'M'
	};
}
