import fc from 'fast-check';
import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { angleDifferenceText, angleText, areaDifferenceText, areaText, lengthFieldRounded, lengthSignedParse, inchesEighthsText, inchFractionParse, lengthDifferenceText, lengthFieldText, lengthParse, lengthReadoutText, lengthText, mmFromInches } from './units';

describe('units', () => {
	it('converts inches to mm exactly (1 in = 25.4 mm by definition)', () => {
		expect(mmFromInches(1)).toBe(25.4);
		expect(mmFromInches(34.125)).toBeCloseTo(866.775, 9);
	});
	it('shows inches to the nearest eighth as a mixed number', () => {
		expect(inchesEighthsText(1.5)).toBe('1 1/2');
		expect(inchesEighthsText(34.1)).toBe('34 1/8');
		expect(inchesEighthsText(3.9999)).toBe('4');
		expect(lengthText(866.775, 'in')).toBe('34 1/8 in');
		expect(lengthText(867, 'cm')).toBe('86.7 cm');
		expect(lengthText(866.775, 'mm')).toBe('867 mm');
	});
	it('parses inch texts with ascii and vulgar fractions', () => {
		expect(inchFractionParse('34 1/8')?.valueOf()).toBe(34.125);
		expect(inchFractionParse('34⅛')?.valueOf()).toBe(34.125);
		expect(inchFractionParse('34 ⅛')?.valueOf()).toBe(34.125);
		expect(inchFractionParse('34-1/8')?.valueOf()).toBe(34.125);
		expect(inchFractionParse('½')?.valueOf()).toBe(0.5);
		expect(inchFractionParse('31.125')?.valueOf()).toBe(31.125);
		expect(inchFractionParse('abc')).toBeNull();
		expect(inchFractionParse('1/0')).toBeNull();
	});
	it('parses typed lengths with units', () => {
		expect(lengthParse('86.7 cm')).toEqual({ mm: 867, unit: 'cm' });
		expect(lengthParse('86,7cm')?.mm).toBeCloseTo(867, 9);
		expect(lengthParse('867 mm')).toEqual({ mm: 867, unit: 'mm' });
		expect(lengthParse('34 1/8 in')?.mm).toBeCloseTo(866.775, 9);
		expect(lengthParse('34⅛"')?.mm).toBeCloseTo(866.775, 9);
		expect(lengthParse('34 1/8', 'in')?.mm).toBeCloseTo(866.775, 9);
		expect(lengthParse('86.7', 'cm')?.mm).toBeCloseTo(867, 9);
		expect(lengthParse('tall')).toBeNull();
		expect(lengthParse('')).toBeNull();
	});
});

describe('what was typed is stored exactly, whatever unit it is shown in', () => {
	it('92 cm shown in an inch form and back is still 920 mm, not 36 1/4 in (920.75 mm) nor 92.1 cm', () => {
		const typed = lengthParse('92', 'cm')!.mm;
		expect(typed).toBe(920);
		const inInches = lengthFieldText(typed, 'in');
		expect(inInches).toBe('92 cm'); // 920 mm is not a whole number of 64ths of an inch: it keeps its unit
		expect(lengthParse(inInches, 'in')!.mm).toBe(920);
		expect(lengthFieldText(lengthParse(inInches, 'in')!.mm, 'cm')).toBe('92');
	});

	it('cm decimals are read exactly (86.75 cm is 867.5 mm, not 867.4999…)', () => {
		expect(lengthParse('4.35', 'cm')!.mm).toBe(43.5);
		expect(lengthParse('86.75', 'cm')!.mm).toBe(867.5);
		expect(lengthParse('0.07', 'cm')!.mm).toBe(0.7);
	});

	it('inch fractions are read as the double nearest the exact value (1 in = 25.4 mm exactly)', () => {
		expect(lengthParse('36 1/4', 'in')!.mm).toBe(920.75);
		expect(lengthParse('34 1/8', 'in')!.mm).toBe(866.775);
	});

	it('property: a value typed in any unit and shown in any other reads back as the same millimetres', () => {
		const typed = fc.oneof(
			fc.record({ unit: fc.constant('cm' as const), text: fc.integer({ min: 300, max: 20000 }).map((n) => (n / 100).toString()) }),
			fc.record({ unit: fc.constant('mm' as const), text: fc.integer({ min: 300, max: 20000 }).map((n) => (n / 10).toString()) }),
			fc.record({ unit: fc.constant('in' as const), text: fc.integer({ min: 80, max: 640 }).map((n) => new Fraction(n, 8).toFraction(true)) })
		);
		fc.assert(
			fc.property(typed, fc.array(fc.constantFrom('mm', 'cm', 'in'), { minLength: 1, maxLength: 5 }), ({ unit, text }, switches) => {
				const mm = lengthParse(text, unit)!.mm;
				let shown = text;
				let current: 'mm' | 'cm' | 'in' = unit;
				for (const next of switches) {
					shown = lengthFieldText(lengthParse(shown, current)!.mm, next as 'mm' | 'cm' | 'in');
					current = next as 'mm' | 'cm' | 'in';
				}
				return lengthParse(shown, current)!.mm === mm;
			})
		);
	});

	it('shows measured lengths and their differences in each unit, signed', () => {
		expect(lengthReadoutText(210.24, 'mm')).toBe('210.2 mm');
		expect(lengthReadoutText(210.24, 'cm')).toBe('21.02 cm');
		// 1 in = 25.4 mm (definition): 211.1 mm = 8.311 in → 8 5/16
		expect(lengthReadoutText(211.1, 'in')).toBe('8 5/16 in');
		expect(lengthDifferenceText(6, 'mm')).toBe('+6.0 mm');
		expect(lengthDifferenceText(-3.5, 'cm')).toBe('−0.35 cm');
		expect(lengthDifferenceText(6.35, 'in')).toBe('+1/4 in');
		// under a sixteenth of an inch the difference is still shown, in hundredths
		expect(lengthDifferenceText(-0.3, 'in')).toBe('−0.01 in');
		expect(lengthDifferenceText(0, 'mm')).toBe('±0.0 mm');
	});
	it('shows areas in the square of the unit', () => {
		expect(areaText(84151.4, 'mm')).toBe('84151 mm²');
		expect(areaText(84151.4, 'cm')).toBe('841.5 cm²');
		// 645.16 mm² = 1 in² exactly
		expect(areaText(645.16 * 2.5, 'in')).toBe('2.50 in²');
		expect(areaDifferenceText(-612, 'cm')).toBe('−6.1 cm²');
		expect(areaDifferenceText(612, 'mm')).toBe('+612 mm²');
	});
});

describe('lengths typed in number fields and angles on screen', () => {
	it('reads a typed length that may be negative, in the field unit or with its own', () => {
		expect(lengthSignedParse('4 7/8', 'in')).toBeCloseTo(123.825, 6);
		expect(lengthSignedParse('12,5', 'cm')).toBe(125);
		expect(lengthSignedParse('−15', 'mm')).toBe(-15);
		expect(lengthSignedParse('2 cm', 'mm')).toBe(20);
		expect(lengthSignedParse('abc', 'mm')).toBeNull();
	});
	it('shows a field value rounded to what the unit shows, and reads it back to that rounding', () => {
		expect(lengthFieldRounded(30, 'in')).toBe('1 1/8');
		expect(lengthSignedParse(lengthFieldRounded(30, 'in'), 'in')).toBeCloseTo(28.575, 6);
		expect(lengthFieldRounded(12.34, 'mm')).toBe('12.3');
		expect(lengthFieldRounded(12.34, 'cm')).toBe('1.2');
	});
	it('shows angles in degrees with a true minus sign', () => {
		expect(angleText(Math.PI / 12)).toBe('15.00°');
		expect(angleText(-Math.PI / 180, 1)).toBe('−1.0°');
		expect(angleDifferenceText(Math.PI / 180)).toBe('+1.00°');
		expect(angleDifferenceText(-Math.PI / 360)).toBe('−0.50°');
	});
});
