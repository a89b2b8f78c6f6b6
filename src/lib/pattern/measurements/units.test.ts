import { describe, expect, it } from 'vitest';
import { inchesEighthsText, inchFractionParse, lengthParse, lengthText, mmFromInches } from './units';

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
