// The random bodies of the JSON fuzzing (body-fuzz-random.test.ts), made with fast-check. Bodies are built
// as JSON text, not values: prototype keys stay own keys (an object literal's __proto__ would set the
// prototype), and deep nesting or huge strings cost a string repeat, not a value tree to generate.
import fc from 'fast-check';

export interface FuzzBody {
	text: string;
	/** the content type it is sent with */
	type: string;
}

const JSON_TYPE = 'application/json';
const PROTO_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', '__defineGetter__'];

const deepArray = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);
/** `{"a":{"a":…null…}}` */
export const deepObject = (depth: number) => `${'{"a":'.repeat(depth)}null${'}'.repeat(depth)}`;
const text = (a: fc.Arbitrary<unknown>) => a.map((v) => JSON.stringify(v));

/**
 * JSON text of values a field should refuse: wrong types, text too long, NUL characters, deep nesting.
 * (null, [], {} and booleans stay out: some fields take them, e.g. a fit note's `assignedTo: null`
 * unassigns it; they come in the fully random bodies.)
 */
const wrongValue: fc.Arbitrary<string> = fc.oneof(
	{ arbitrary: text(fc.constantFrom<unknown>('', '   ', -1.5, 1e308, -0.25, [null], { '': null }, [[[]]])), weight: 10 },
	{ arbitrary: text(fc.jsonValue({ maxDepth: 2 }).filter((v) => typeof v === 'object' && v !== null && Object.keys(v).length > 0)), weight: 8 },
	{ arbitrary: text(fc.string({ maxLength: 12 }).map((s) => `${s}\u0000${s}`)), weight: 4 },
	{ arbitrary: fc.integer({ min: 10_000, max: 70_000 }).map((n) => `"${'x'.repeat(n)}"`), weight: 1 },
	{ arbitrary: fc.integer({ min: 50, max: 5000 }).map(deepArray), weight: 1 }
);

const objectText = (entries: readonly (readonly [string, string])[]) => `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${v}`).join(',')}}`;

/** Random bodies for a route whose own field names are `fields` (read from its answer to `{}`). */
export function fuzzBodies(fields: readonly string[], seed: number, count: number): FuzzBody[] {
	const key = fields.length > 0 ? fc.oneof({ arbitrary: fc.constantFrom(...fields), weight: 4 }, { arbitrary: fc.string({ maxLength: 8 }), weight: 1 }) : fc.string({ maxLength: 8 });
	const entries = fc.uniqueArray(fc.tuple(key, wrongValue), { minLength: 1, maxLength: Math.max(2, fields.length), selector: ([k]) => k });
	const withFields = entries.map(objectText);
	const protoBody = fc.tuple(fc.subarray(PROTO_KEYS, { minLength: 1 }), entries, text(fc.jsonValue({ maxDepth: 2 }))).map(([pk, known, v]) =>
		objectText([...pk.map((k) => [k, k === 'constructor' ? '{"prototype":{"role":"owner","isAdmin":true}}' : `{"role":"owner","polluted":${v}}`] as const), ...known])
	);
	const json = (a: fc.Arbitrary<string>, weight: number) => ({ arbitrary: a.map((t) => ({ text: t, type: JSON_TYPE })), weight });
	const arbitrary: fc.Arbitrary<FuzzBody> = fc.oneof(
		json(text(fc.jsonValue({ maxDepth: 4 })), 6),
		json(withFields, 8),
		json(protoBody, 3),
		json(fc.integer({ min: 1000, max: 20_000 }).map(deepObject), 1),
		json(fc.integer({ min: 1000, max: 50_000 }).map(deepArray), 1),
		// cut short, not JSON at all, or JSON sent as another type
		json(fc.tuple(withFields, fc.nat()).map(([t, n]) => t.slice(0, 1 + (n % Math.max(1, t.length - 1)))), 1),
		json(fc.string({ unit: 'binary', maxLength: 60 }), 1),
		{ arbitrary: fc.tuple(withFields, fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', '', 'application/jsonx')).map(([t, type]) => ({ text: t, type })), weight: 1 }
	);
	return fc.sample(arbitrary, { seed, numRuns: count });
}
