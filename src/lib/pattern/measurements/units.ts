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

/** Exact inch value (a Fraction) to millimetres: the double nearest the exact value (1 in = 127/5 mm). */
export function mmFromInchFraction(inches: Fraction): number {
	return inches.mul(127, 5).valueOf();
}

/** A decimal text ("86.75") times a power of ten, exactly: the digits are shifted, not multiplied. */
function decimalShift(text: string, places: number): number {
	const [int, frac = ''] = text.split('.');
	const digits = int + frac;
	const point = int.length + places;
	const padded = point > digits.length ? digits.padEnd(point, '0') : digits;
	return Number(`${padded.slice(0, point)}.${padded.slice(point) || '0'}`);
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
	return { mm: unit === 'cm' ? decimalShift(t, 1) : Number(t), unit };
}

/**
 * A text in `unit` (no unit written) that reads back as exactly `mm`, or null when the unit cannot say it
 * in a few digits (920 mm is not a whole number of 64ths of an inch). Inches are written in eighths where
 * they can be, down to 64ths, else as a short decimal.
 */
export function lengthTextExact(mm: number, unit: LengthUnit): string | null {
	const back = (text: string) => lengthParse(text, unit)?.mm === mm;
	if (unit === 'in') {
		const inches = new Fraction(mm).mul(5, 127);
		for (const step of ['1/8', '1/16', '1/32', '1/64']) {
			const t = inches.roundTo(step).toFraction(true);
			if (back(t)) return t;
		}
	}
	const value = unit === 'cm' ? mm / MM_PER_CM : unit === 'in' ? mm / MM_PER_INCH : mm;
	for (let digits = 0; digits <= 6; digits++) {
		const t = value.toFixed(digits);
		if (back(t)) return t;
	}
	return null;
}

/**
 * A length as a form field's text in `unit`, exact: in the unit where it reads back as the same value,
 * else with the unit that does written after it ("92 cm" in an inch form), so showing a value in another
 * unit never changes it.
 */
export function lengthFieldText(mm: number, unit: LengthUnit): string {
	const own = lengthTextExact(mm, unit);
	if (own !== null) return own;
	for (const u of ['cm', 'mm'] as const) {
		const t = lengthTextExact(mm, u);
		if (t !== null) return `${t} ${u}`;
	}
	return `${mm} mm`;
}

const MINUS = '−';

/** Inches to the nearest sixteenth as a mixed number ("6 5/16"); below that, two decimals ("0.01"). */
function inchesSixteenthsText(inches: number): string {
	const f = new Fraction(inches).roundTo('1/16');
	return f.valueOf() === 0 && inches !== 0 ? inches.toFixed(2) : f.toFraction(true);
}

/** A measured length for readouts, finer than `lengthText`: "210.2 mm", "21.02 cm", "8 5/16 in". */
export function lengthReadoutText(mm: number, unit: LengthUnit): string {
	if (!Number.isFinite(mm)) return '—';
	const sign = mm < 0 ? MINUS : '';
	const a = Math.abs(mm);
	if (unit === 'mm') return `${sign}${a.toFixed(1)} mm`;
	if (unit === 'cm') return `${sign}${(a / MM_PER_CM).toFixed(2)} cm`;
	return `${sign}${inchesSixteenthsText(a / MM_PER_INCH)} in`;
}

/** A signed length difference: "+6.0 mm", "−0.35 cm", "+1/4 in" ("±0.0 mm" for none). */
export function lengthDifferenceText(mm: number, unit: LengthUnit): string {
	const t = lengthReadoutText(Math.abs(mm), unit);
	return `${mm > 0 ? '+' : mm < 0 ? MINUS : '±'}${t}`;
}

/** An area in the square of the unit: "84151 mm²", "841.5 cm²", "130.44 in²". */
export function areaText(mm2: number, unit: LengthUnit): string {
	if (!Number.isFinite(mm2)) return '—';
	const sign = mm2 < 0 ? MINUS : '';
	const a = Math.abs(mm2);
	if (unit === 'mm') return `${sign}${a.toFixed(0)} mm²`;
	if (unit === 'cm') return `${sign}${(a / (MM_PER_CM * MM_PER_CM)).toFixed(1)} cm²`;
	return `${sign}${(a / (MM_PER_INCH * MM_PER_INCH)).toFixed(2)} in²`;
}

/** A signed area difference: "+612 mm²", "−6.1 cm²". */
export function areaDifferenceText(mm2: number, unit: LengthUnit): string {
	return `${mm2 > 0 ? '+' : mm2 < 0 ? MINUS : '±'}${areaText(Math.abs(mm2), unit)}`;
}

/**
 * A length as the text of a number field in `unit`, rounded as a field shows it (0.1 mm, 1 mm in cm,
 * eighths of an inch), no unit written: 30 mm in inches → "1 1/8". For lengths that must read back
 * exactly, `lengthFieldText`.
 */
export function lengthFieldRounded(mm: number, unit: LengthUnit): string {
	if (unit === 'mm') return String(Math.round(mm * 10) / 10);
	if (unit === 'cm') return String(Math.round(mm) / MM_PER_CM);
	return inchesEighthsText(mm / MM_PER_INCH);
}

/** A typed length that may be negative ("−3", "4 7/8", "12,5", "2 cm") in mm; null when it is not a length. */
export function lengthSignedParse(text: string, unit: LengthUnit): number | null {
	const t = text.trim();
	const negative = /^[-−–]/.test(t);
	const parsed = lengthParse(negative ? t.replace(/^[-−–]\s*/, '') : t, unit);
	if (!parsed) return null;
	return negative ? -parsed.mm : parsed.mm;
}

/** An angle for readouts, in degrees: "12.34°", "−3.10°". */
export function angleText(rad: number, digits = 2): string {
	const deg = (rad * 180) / Math.PI;
	const s = Math.abs(deg).toFixed(digits);
	return `${deg < 0 && Number(s) !== 0 ? MINUS : ''}${s}°`;
}

/** A signed angle difference in degrees: "+1.25°", "−0.50°". */
export function angleDifferenceText(rad: number, digits = 2): string {
	return `${rad < 0 ? MINUS : '+'}${Math.abs((rad * 180) / Math.PI).toFixed(digits)}°`;
}
