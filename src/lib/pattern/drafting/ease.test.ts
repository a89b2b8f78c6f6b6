import { describe, expect, it } from 'vitest';
import { draftCautions, EASE_DEFAULT } from './ease';

describe('ease defaults and cautions', () => {
	it('takes the upper end of the fitted-bodice ease spans (costume construction text, row 23, S)', () => {
		// bust 1½–2 in → 2 in = 50.8 mm; waist ¾–1 in → 1 in = 25.4 mm (row 23, S)
		expect(EASE_DEFAULT.bustMm).toBeCloseTo(2 * 25.4, 12);
		expect(EASE_DEFAULT.waistMm).toBeCloseTo(1 * 25.4, 12);
	});
	it('says nothing when ease is positive', () => {
		expect(draftCautions(EASE_DEFAULT)).toEqual([]);
	});
	it('flags negative ease, asks for a toile and defers to the maker (primer, Cautions)', () => {
		const c = draftCautions({ bustMm: 0, waistMm: -40, underbustMm: -20 }, { waistMm: 700 });
		const codes = c.map((x) => x.code);
		expect(codes).toContain('negative_ease');
		expect(codes).toContain('toile_first');
		expect(codes).toContain('maker_practice');
		expect(codes).not.toContain('large_reduction');
		expect(c[0].message).toMatch(/waist -4\.0 cm, under-bust -2\.0 cm/);
	});
	it('warns when the reduction is beyond a first corset’s customary 5–8 cm / ~10 % (primer, Cautions)', () => {
		const c = draftCautions({ bustMm: 0, waistMm: -100 }, { waistMm: 700 });
		const big = c.find((x) => x.code === 'large_reduction')!;
		expect(big.message).toMatch(/5–8 cm/);
		expect(big.message).toMatch(/7\.0 cm/);
	});
});
