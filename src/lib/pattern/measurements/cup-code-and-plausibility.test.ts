import { describe, expect, it } from 'vitest';
import { cupCode } from './cup-code';
import { measurementProblems } from './plausibility';

describe('EN 13402 cup code', () => {
	it('gives the worked examples (EN 13402-3 via secondary help pages, row 2, C)', () => {
		expect(cupCode(1070, 870).code).toBe('85D');
		expect(cupCode(1080, 890).code).toBe('90D');
		expect(cupCode(1000, 820).code).toBe('80C');
	});
	it('uses 2 cm bands: (16,18] = C, (18,20] = D (row 2, C); other letters same rule (M)', () => {
		expect(cupCode(1000, 840).cup).toBe('B'); // 16 cm exactly → B band (14,16] (M)
		expect(cupCode(1001, 840).cup).toBe('C');
		expect(cupCode(1000, 820).status).toBe('C');
		expect(cupCode(1000, 810).cup).toBe('D');
		expect(cupCode(1000, 800).cup).toBe('D');
		expect(cupCode(1000, 799).cup).toBe('E');
		expect(cupCode(1000, 799).status).toBe('M');
		expect(cupCode(1000, 950).code).toBeNull();
	});
});

describe('plausibility checks', () => {
	it('flags an under-bust larger than the bust as an error', () => {
		const p = measurementProblems({ bust: 900, underbust: 950 });
		expect(p.some((i) => i.severity === 'error' && i.ids.includes('underbust') && /larger than bust/.test(i.message))).toBe(true);
	});
	it('flags a waist much larger than the hip', () => {
		const p = measurementProblems({ waist: 1100, hip: 950 });
		expect(p.some((i) => i.ids.includes('waist') && i.ids.includes('hip'))).toBe(true);
	});
	it('states the usual adult range when a value is outside it but still a human size (a warning)', () => {
		const p = measurementProblems({ bust: 1900 });
		expect(p[0].severity).toBe('warning');
		expect(p[0].message).toMatch(/outside the usual adult range 60\.0 cm – 180\.0 cm/);
	});
	it('is quiet on a chart size', () => {
		expect(measurementProblems({ bust: 984.25, underbust: 825.5, waist: 781.05, neck_base: 384.175, upper_chest: 965.2 })).toEqual([]);
	});
});
