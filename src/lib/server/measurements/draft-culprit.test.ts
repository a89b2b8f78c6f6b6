import { describe, expect, it } from 'vitest';
import { draftAttempt, draftCulprits, draftCulpritText } from './draft-culprit';

/** A draft that fails names the measurement that made it fail, not the outline segments it broke. */
describe('a failing draft names its measurement', () => {
	const attempt = draftAttempt({ bustMm: 50, waistMm: 30 }, { bustDart: 'shoulder', frontCut: 'on_fold', backCut: 'pair', underStructure: 'none' });

	it('a waist far larger than the bust breaks the front: the waist is named, with its value', () => {
		const mm = { bust: 900, waist: 3000, hip: 960 };
		expect(attempt(mm)).toMatch(/not sound/);
		const culprits = draftCulprits(mm, attempt);
		expect(culprits).toEqual(['waist']);
		expect(draftCulpritText(mm, culprits)).toBe('The draft fails because of the waist girth (300.0 cm): without it, the block drafts. Check that value in the set.');
	});

	it('names nothing when the draft succeeds', () => {
		expect(draftCulprits({ bust: 900, waist: 700 }, attempt)).toEqual([]);
	});

	it('each length that breaks the draft on its own is found the same way', () => {
		for (const [id, value] of [['neck_base', 1000], ['across_front', 1200], ['across_back', 100]] as const) {
			expect(draftCulprits({ bust: 900, [id]: value }, attempt)).toEqual([id]);
		}
	});
});
