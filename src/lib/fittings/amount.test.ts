import { describe, expect, it } from 'vitest';
import { UNIT_KEY } from '$lib/editor/view';
import { amountParse, amountText, amountUnit, fitNoteHeadline, unitChoose, unitChosen } from './amount';

describe('fit-note amounts in the unit of the person or the measurement set', () => {
	it('shows inches as a fraction to the nearest sixteenth, with the direction of the category', () => {
		// 1/4 in = 6.35 mm exactly (1 in = 25.4 mm)
		expect(amountText(6.35, 'too_tight', 'in')).toBe('let out 1/4 in');
		expect(amountText(-6.35, 'too_tight', 'in')).toBe('take in 1/4 in');
		// 5 mm = 0.19685 in: nearest sixteenth is 3/16 (0.1875), not the eighth 1/4 or 1/8
		expect(amountText(5, 'length', 'in')).toBe('lengthen 3/16 in');
		expect(amountText(-38.1, 'length', 'in')).toBe('shorten 1 1/2 in');
	});

	it('shows millimetres and centimetres as the readouts do', () => {
		expect(amountText(6, 'too_tight', 'mm')).toBe('let out 6.0 mm');
		expect(amountText(-3.5, 'too_loose', 'cm')).toBe('take in 0.35 cm');
		expect(amountText(4, 'seam_placement', 'mm')).toBe('move out / down 4.0 mm');
	});

	it('heads a note with its category and, where it has one, its amount', () => {
		expect(fitNoteHeadline({ category: 'too_tight', amountMm: 6.35 }, 'in')).toBe('too tight, let out 1/4 in');
		expect(fitNoteHeadline({ category: 'too_loose', amountMm: null }, 'in')).toBe('too loose');
	});

	it('reads a typed amount in the unit in force unless the text names its own', () => {
		expect(amountParse('3/16', 'in')).toBeCloseTo(4.7625, 10);
		expect(amountParse('1 1/4', 'in')).toBeCloseTo(31.75, 10);
		expect(amountParse('0.6', 'cm')).toBe(6);
		expect(amountParse('6', 'mm')).toBe(6);
		expect(amountParse('6 mm', 'in')).toBe(6);
		expect(amountParse('1/4 in', 'mm')).toBeCloseTo(6.35, 10);
		expect(amountParse('a bit', 'mm')).toBeNull();
	});

	it("uses the person's chosen unit first, then the note's measurement set's, then millimetres", () => {
		expect(amountUnit('cm', 'in')).toBe('cm');
		expect(amountUnit(null, 'in')).toBe('in');
		expect(amountUnit(null, undefined)).toBe('mm');
	});

	it("remembers the choice under the editor's own setting, so both show the same unit", () => {
		const kept = new Map<string, string>();
		const store = { getItem: (k: string) => kept.get(k) ?? null, setItem: (k: string, v: string) => void kept.set(k, v) };
		expect(unitChosen(store)).toBeNull();
		unitChoose('in', store);
		expect(kept.get(UNIT_KEY)).toBe('in');
		expect(unitChosen(store)).toBe('in');
		kept.set(UNIT_KEY, 'furlong');
		expect(unitChosen(store)).toBeNull();
	});
});
