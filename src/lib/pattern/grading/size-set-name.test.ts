import { describe, expect, it } from 'vitest';
import { sizeSetName } from './size-set-name';

describe('a size set named from its sizes', () => {
	it('writes the chart once and lists its sizes, a client by its own name', () => {
		const names = ['6', '8', '12', '14', '16'].map((s) => `ASTM D5585 misses, curvy waist, size ${s}`);
		expect(sizeSetName([...names, 'Client LR-C014 (invented)'])).toBe('ASTM D5585 misses, curvy waist, sizes 6, 8, 12, 14, 16; Client LR-C014 (invented)');
	});
	it('keeps one size in the singular and two charts apart', () => {
		expect(sizeSetName(['ASTM D5585 misses, curvy waist, size 10', 'ASTM D5585 misses, straight waist, size 10', 'ASTM D5585 misses, straight waist, size 12'])).toBe(
			'ASTM D5585 misses, curvy waist, size 10; ASTM D5585 misses, straight waist, sizes 10, 12'
		);
	});
	it('stays within the length a name may have, with an ellipsis where cut', () => {
		const many = Array.from({ length: 30 }, (_, i) => `Client C-${100 + i}`);
		const name = sizeSetName(many);
		expect(name.length).toBeLessThanOrEqual(120);
		expect(name.endsWith('…')).toBe(true);
	});
});
