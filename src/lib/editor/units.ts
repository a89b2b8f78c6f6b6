import Fraction from 'fraction.js';
import { inchFractionParse, type LengthUnit } from '$lib/pattern/measurements/units';

/** How the editor shows and reads numbers: lengths in the user's unit, angles in degrees. */
export type { LengthUnit };

export const MM_PER_INCH = 25.4;

/** Signed inches as a mixed number in eighths: −1.3 in → "−1 1/4". */
function inchesText(inches: number): string {
	const sign = inches < 0 ? '−' : '';
	const f = new Fraction(Math.abs(inches)).roundTo('1/8');
	return sign + f.toFraction(true);
}

/** A length for readouts: "123.4 mm", "12.34 cm", "4 7/8 in". */
export function fmtLength(mm: number, unit: LengthUnit): string {
	if (!Number.isFinite(mm)) return '—';
	switch (unit) {
		case 'mm':
			return `${fmtNum(mm, 1)} mm`;
		case 'cm':
			return `${fmtNum(mm / 10, 2)} cm`;
		case 'in':
			return `${inchesText(mm / MM_PER_INCH)} in`;
	}
}

/** A signed length difference: "+0.4 mm". */
export function fmtLengthSigned(mm: number, unit: LengthUnit): string {
	const t = fmtLength(Math.abs(mm), unit);
	return `${mm < 0 ? '−' : '+'}${t}`;
}

export function fmtArea(mm2: number, unit: LengthUnit): string {
	if (unit === 'in') return `${fmtNum(mm2 / (MM_PER_INCH * MM_PER_INCH), 2)} in²`;
	if (unit === 'cm') return `${fmtNum(mm2 / 100, 1)} cm²`;
	return `${fmtNum(mm2, 0)} mm²`;
}

export function fmtDeg(rad: number, digits = 2): string {
	return `${fmtNum((rad * 180) / Math.PI, digits)}°`;
}

export function fmtDegSigned(rad: number, digits = 2): string {
	const d = (rad * 180) / Math.PI;
	return `${d < 0 ? '−' : '+'}${Math.abs(d).toFixed(digits)}°`;
}

export function fmtNum(n: number, digits: number): string {
	const s = n.toFixed(digits);
	return s.startsWith('-') ? `−${s.slice(1)}` : s;
}

/** A length as the value shown in a number field of the given unit. */
export function lengthToField(mm: number, unit: LengthUnit): string {
	if (unit === 'mm') return String(Math.round(mm * 10) / 10);
	if (unit === 'cm') return String(Math.round(mm) / 10);
	return inchesText(mm / MM_PER_INCH).replace('−', '-');
}

/** Reads a typed length in the unit ("12.5", "4 7/8", "−3"); null when it is not a number. */
export function lengthFromField(text: string, unit: LengthUnit): number | null {
	const t = text.trim().replace('−', '-');
	if (t === '') return null;
	const neg = t.startsWith('-');
	const body = neg ? t.slice(1) : t;
	let v: number | null;
	if (unit === 'in') {
		const f = inchFractionParse(body);
		v = f ? f.valueOf() * MM_PER_INCH : null;
	} else {
		const n = Number(body.replace(',', '.'));
		v = Number.isFinite(n) ? (unit === 'cm' ? n * 10 : n) : null;
	}
	return v === null ? null : neg ? -v : v;
}

export function unitLabel(unit: LengthUnit): string {
	return unit;
}
