import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { indicesByKey } from './self-intersect-chains';

/**
 * The chain search orders its chains with its own index sort (no comparator callback). Checked against
 * the language's own stable sort (Array.prototype.sort, stable since ECMAScript 2019) on random keys,
 * with many ties, at lengths on both sides of the sort's run length.
 */
describe('indicesByKey', () => {
	it('orders indices as a stable sort by key does, ties kept in index order', () => {
		fc.assert(
			fc.property(fc.array(fc.integer({ min: -20, max: 20 }), { maxLength: 300 }), (ints) => {
				const key = Float64Array.from(ints, (v) => v / 4);
				const expected = ints.map((_, i) => i).sort((a, b) => key[a] - key[b]);
				expect(Array.from(indicesByKey(key))).toEqual(expected);
			}),
			{ seed: 20261203, numRuns: 300 }
		);
	});
});
