import { describe, expect, it } from 'vitest';
import { jsonHoldsNul } from './api';

describe('bodies holding the NUL character (PostgreSQL stores it in no text)', () => {
	it('finds U+0000 in any string or key, however deep', () => {
		expect(jsonHoldsNul({ name: 'a\u0000b' })).toBe(true);
		expect(jsonHoldsNul({ 'k\u0000': 1 })).toBe(true);
		expect(jsonHoldsNul([1, [2, { notes: ['x', '\u0000'] }]])).toBe(true);
		let deep: unknown = '\u0000';
		for (let i = 0; i < 100_000; i++) deep = [deep];
		expect(jsonHoldsNul(deep)).toBe(true);
	});

	it('passes text without it, including the six characters \\u0000 written out', () => {
		expect(jsonHoldsNul({ name: 'Juniper bodice', notes: '\\u0000 is how JSON writes NUL', n: 0, ok: null })).toBe(false);
		expect(jsonHoldsNul(JSON.parse('{"a":"\\\\u0000"}'))).toBe(false);
		expect(jsonHoldsNul(undefined)).toBe(false);
	});
});
