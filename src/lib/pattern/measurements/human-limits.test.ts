import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lengthFieldRead } from './length-field';
import { measurementIds } from './measurement-ids';
import { measurementHardProblems, measurementProblems, plausibilityTable } from './plausibility';

/**
 * Values outside what a human body can measure are errors (they can be neither confirmed nor drafted from);
 * values merely unusual are warnings. Hard limits and their sources, as the table states them:
 * waist 38.1 cm (Guinness World Records, smallest waist on a living person, C) to 302 cm (largest waist,
 * Guinness record as reported by Wikipedia, S); height 54.6 cm to 272 cm (Guinness records as reported,
 * S); the other rows are our own outer bounds, marked M (from memory).
 */
describe('what a human body can measure', () => {
	it('refuses a waist of 5,000 cm as an error that names the waist, the limits and their source', () => {
		const p = measurementProblems({ bust: 900, waist: 50_000 });
		const waist = p.find((i) => i.ids[0] === 'waist')!;
		expect(waist.severity).toBe('error');
		expect(waist.message).toMatch(/^Waist girth is 5000\.0 cm: larger than any human body measures \(limits 38\.1 cm – 302\.0 cm; .*Guinness/);
		expect(measurementHardProblems({ bust: 900, waist: 50_000 }).map((i) => i.ids[0])).toEqual(['waist']);
	});

	it('every row has usual bounds inside its hard limits, and a source with its status', () => {
		for (const id of measurementIds) {
			const row = plausibilityTable[id];
			expect(row.hardMm[0]).toBeLessThan(row.usualMm[0]);
			expect(row.usualMm[1]).toBeLessThan(row.hardMm[1]);
			expect(row.source.length).toBeGreaterThan(10);
			expect(['C', 'S', 'P', 'CP', 'M', 'D']).toContain(row.status);
		}
	});

	it('a value inside the hard limits but outside the usual range stays a warning the person may confirm', () => {
		fc.assert(
			fc.property(fc.constantFrom(...measurementIds), fc.double({ min: 0, max: 1, noNaN: true }), (id, f) => {
				const row = plausibilityTable[id];
				const value = row.usualMm[1] + f * (row.hardMm[1] - row.usualMm[1]);
				const mine = measurementProblems({ [id]: value }).filter((i) => i.ids.length === 1 && i.ids[0] === id);
				return mine.every((i) => i.severity === 'warning') && measurementHardProblems({ [id]: value }).length === 0;
			})
		);
	});

	it('negative, zero and non-numbers each get their own message', () => {
		const neg = measurementProblems({ waist: -700 })[0];
		const zero = measurementProblems({ waist: 0 })[0];
		const nan = measurementProblems({ waist: Number.NaN })[0];
		expect(neg.message).toMatch(/cannot be negative/);
		expect(zero.message).toMatch(/is zero/);
		expect(nan.message).toMatch(/is not a number/);
		expect(new Set([neg.message, zero.message, nan.message]).size).toBe(3);
		expect([neg, zero, nan].every((i) => i.severity === 'error')).toBe(true);
	});

	it('typed fields tell negative, zero and not-a-number apart, in every unit', () => {
		for (const unit of ['mm', 'cm', 'in'] as const) {
			expect(lengthFieldRead('Waist girth', '-70', unit)).toMatchObject({ ok: false, kind: 'negative' });
			expect(lengthFieldRead('Waist girth', '−70', unit)).toMatchObject({ ok: false, kind: 'negative' });
			expect(lengthFieldRead('Waist girth', '0', unit)).toMatchObject({ ok: false, kind: 'zero' });
			expect(lengthFieldRead('Waist girth', 'seventy', unit)).toMatchObject({ ok: false, kind: 'not_a_number' });
			expect(lengthFieldRead('Waist girth', '70', unit).ok).toBe(true);
		}
		const r = lengthFieldRead('Waist girth', 'seventy', 'cm');
		if (!r.ok) expect(r.message).toBe('Waist girth: “seventy” is not a number. Write e.g. 86.5 (cm).');
	});
});
