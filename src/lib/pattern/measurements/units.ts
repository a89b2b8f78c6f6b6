import Fraction from 'fraction.js';

/** Units a person may read and type. Inside the app everything is millimetres. */
export type LengthUnit = 'mm' | 'cm' | 'in';

export const MM_PER_INCH = 25.4;
export const MM_PER_CM = 10;

export function mmFromInches(inches: number): number {
	return inches * MM_PER_INCH;
}

export function inchesFromMm(mm: number): number {
	return mm / MM_PER_INCH;
}

/** Exact inch value (a Fraction) to millimetres. */
export function mmFromInchFraction(inches: Fraction): number {
	return inches.valueOf() * MM_PER_INCH;
}

/** Inches rounded to the nearest eighth, as a mixed number: 34.1 → "34 1/8". */
export function inchesEighthsText(inches: number): string {
	return new Fraction(inches).roundTo('1/8').toFraction(true);
}

/** A length in mm shown in a unit: "867 mm", "86.7 cm", "34 1/8 in". */
export function lengthText(mm: number, unit: LengthUnit): string {
	switch (unit) {
		case 'mm':
			return `${Math.round(mm)} mm`;
		case 'cm':
			return `${(Math.round(mm) / MM_PER_CM).toFixed(1)} cm`;
		case 'in':
			return `${inchesEighthsText(inchesFromMm(mm))} in`;
	}
}

const vulgarFractions: Record<string, string> = {
	'¼': '1/4',
	'½': '1/2',
	'¾': '3/4',
	'⅛': '1/8',
	'⅜': '3/8',
	'⅝': '5/8',
	'⅞': '7/8',
	'⅓': '1/3',
	'⅔': '2/3'
};

/** Exact value of an inch text such as "34 1/8", "34⅛", "34-1/8", "1/2", "31.125". */
export function inchFractionParse(text: string): Fraction | null {
	let t = text.trim().replace(/\s+/g, ' ');
	for (const [glyph, ascii] of Object.entries(vulgarFractions)) {
		t = t.replace(new RegExp(`(\\d)\\s?${glyph}`, 'g'), `$1 ${ascii}`).replace(glyph, ascii);
	}
	t = t.replace(/(\d)-(\d+\/\d+)/, '$1 $2');
	const m = /^(\d+(?:\.\d+)?)?(?: ?(\d+)\/(\d+))?$/.exec(t);
	if (!m || (m[1] === undefined && m[2] === undefined)) return null;
	if (m[3] !== undefined && Number(m[3]) === 0) return null;
	let f = new Fraction(m[1] ?? '0');
	if (m[2] !== undefined) f = f.add(new Fraction(Number(m[2]), Number(m[3])));
	return f;
}

export interface ParsedLength {
	readonly mm: number;
	readonly unit: LengthUnit;
}

/**
 * Parse a typed length: "86.7 cm", "867 mm", "34 1/8 in", "34⅛\"", "34 1/8" (no unit: the
 * preferred unit is assumed). Returns null when the text is not a length.
 */
export function lengthParse(text: string, defaultUnit: LengthUnit = 'mm'): ParsedLength | null {
	let t = text.trim().toLowerCase().replace(',', '.');
	let unit: LengthUnit = defaultUnit;
	const suffix = /\s*(mm|cm|in|inch|inches|"|″)$/.exec(t);
	if (suffix) {
		unit = suffix[1] === 'mm' ? 'mm' : suffix[1] === 'cm' ? 'cm' : 'in';
		t = t.slice(0, suffix.index).trim();
	}
	if (t === '') return null;
	if (unit === 'in') {
		const f = inchFractionParse(t);
		return f ? { mm: mmFromInchFraction(f), unit } : null;
	}
	if (!/^\d+(\.\d+)?$/.test(t)) return null;
	const n = Number(t);
	return { mm: unit === 'cm' ? n * MM_PER_CM : n, unit };
}
