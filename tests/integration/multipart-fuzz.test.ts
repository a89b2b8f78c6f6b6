// The multipart routes (fitting photos, pattern imports and their previews) sent random bytes as files,
// multipart bodies cut short, wrong or missing boundaries, other content types, the wrong field, two
// files and odd file names (fast-check, fixed seed). Every answer must be a 4xx with a message (a
// preview may read a file it can: 200, storing nothing), never a 5xx, and nothing may be stored: every
// table has as many rows after as before, the object store the same keys.
import fc from 'fast-check';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionHeaders } from './fittings-support';
import { Findings, fuzzWorld, inBatches, requestAlone, routePath, storedState, type FuzzWorld } from './fuzz-support';
import { testDbClose } from './helpers';

const PER_ROUTE = Number(process.env.FUZZ_MULTIPART ?? 800);
const SEED = 20261205;
const enc = new TextEncoder();

let w: FuzzWorld;
let before: Awaited<ReturnType<typeof storedState>>;
let samples: Record<string, Uint8Array>;
const tried: Record<string, number> = {};

beforeAll(async () => {
	w = await fuzzWorld('Multipart fuzz');
	const png = await sharp({ create: { width: 96, height: 64, channels: 3, background: '#c8b89a' } }).png().toBuffer();
	const jpeg = await sharp(png).jpeg().toBuffer();
	// a file the import reads: the studio's own style as SVG
	const svg = await (await w.owner.get(`/api/studios/${w.ids.studioId}/styles/${w.ids.styleId}/export.svg`)).arrayBuffer();
	samples = { png: new Uint8Array(png), jpeg: new Uint8Array(jpeg), svg: new Uint8Array(svg) };
	await w.owner.api('GET', '/api/me');
	before = await storedState();
}, 120_000);

afterAll(async () => {
	await w?.app.close();
	await testDbClose();
});

interface Case {
	kind: 'random_file' | 'cut_short' | 'wrong_boundary' | 'no_boundary' | 'other_type' | 'wrong_field' | 'two_files' | 'odd_name' | 'empty';
	bytes: Uint8Array;
	sample: string;
	cut: number;
	name: string;
	boundary: string;
}

const caseArbitrary: fc.Arbitrary<Case> = fc.record({
	kind: fc.constantFrom('random_file', 'random_file', 'cut_short', 'cut_short', 'wrong_boundary', 'no_boundary', 'other_type', 'wrong_field', 'two_files', 'odd_name', 'empty'),
	bytes: fc.uint8Array({ maxLength: 48 * 1024 }),
	sample: fc.constantFrom('png', 'jpeg', 'svg'),
	cut: fc.nat(),
	name: fc.oneof(fc.constantFrom('photo.png', 'pattern.svg', 'pattern.dxf', 'toile.jpg', 'x.webp', 'noext'), fc.string({ maxLength: 40 })),
	boundary: fc.stringMatching(/^[A-Za-z0-9'()+_,.\-]{1,60}$/)
});

function part(boundary: string, field: string, name: string, bytes: Uint8Array, type = 'application/octet-stream'): Uint8Array[] {
	const head = `--${boundary}\r\nContent-Disposition: form-data; name="${field}"; filename="${name.replace(/["\r\n]/g, '_')}"\r\nContent-Type: ${type}\r\n\r\n`;
	return [enc.encode(head), bytes, enc.encode('\r\n')];
}

/** The body and content type of a case. */
function request(c: Case): { body: Uint8Array; type: string } {
	const b = c.boundary;
	const sample = samples[c.sample];
	const join = (parts: Uint8Array[]) => new Uint8Array(Buffer.concat(parts));
	const close = enc.encode(`--${b}--\r\n`);
	const typeOf = `multipart/form-data; boundary=${b}`;
	switch (c.kind) {
		case 'random_file':
			return { body: join([...part(b, 'file', c.name, c.bytes), close]), type: typeOf };
		case 'cut_short': {
			// a whole file in a body that stops before its closing boundary
			const whole = join([...part(b, 'file', c.name, sample), close]);
			return { body: whole.subarray(0, c.cut % (whole.length - close.length - 2)), type: typeOf };
		}
		case 'wrong_boundary':
			return { body: join([...part(b, 'file', c.name, sample), close]), type: `multipart/form-data; boundary=${b}x` };
		case 'no_boundary':
			return { body: join([...part(b, 'file', c.name, sample), close]), type: 'multipart/form-data' };
		case 'other_type':
			return { body: join([...part(b, 'file', c.name, sample), close]), type: ['application/json', 'text/plain', 'image/png', 'multipart/mixed; boundary=' + b][c.cut % 4] };
		case 'wrong_field':
			return { body: join([...part(b, 'photo', c.name, c.bytes), close]), type: typeOf };
		case 'two_files':
			return { body: join([...part(b, 'file', c.name, c.bytes), ...part(b, 'file', c.name, c.bytes.subarray(0, c.cut % (c.bytes.length + 1))), close]), type: typeOf };
		case 'odd_name':
			return { body: join([...part(b, 'file', ['../../etc/passwd', 'a\u0000.png', 'ü'.repeat(5000), '', '.svg'][c.cut % 5], c.bytes), close]), type: typeOf };
		case 'empty':
			return { body: new Uint8Array(), type: typeOf };
	}
}

const ROUTES = [
	{ label: 'POST …/fittings/{fittingId}/photos', routeId: '/api/studios/[studioId]/fittings/[fittingId]/photos', query: '', previewMayRead: false },
	{ label: 'POST …/styles/{styleId}/imports', routeId: '/api/studios/[studioId]/styles/[styleId]/imports', query: '', previewMayRead: false },
	{ label: 'POST …/styles/{styleId}/imports?preview=1', routeId: '/api/studios/[studioId]/styles/[styleId]/imports', query: '?preview=1', previewMayRead: true }
];

describe('random multipart bodies', () => {
	it.each(ROUTES)('$label answers every one with a 4xx and a message', { timeout: 300_000 }, async ({ label, routeId, query, previewMayRead }) => {
		const path = routePath(routeId, w.ids) + query;
		const cases = fc.sample(caseArbitrary, { seed: SEED + ROUTES.findIndex((r) => r.label === label), numRuns: PER_ROUTE });
		const findings = new Findings();
		const kinds: Record<string, number> = {};
		await inBatches(cases, 8, async (c) => {
			const { body, type } = request(c);
			kinds[c.kind] = (kinds[c.kind] ?? 0) + 1;
			// each on a connection of its own: the app may refuse a body unread and close the connection
			const r = await requestAlone(w.app.baseUrl, 'POST', path, { ...sessionHeaders(w.owner), 'content-type': type, 'content-length': String(body.byteLength) }, body);
			if (!('status' in r)) return findings.add(`${c.kind}: no answer (${r.error})`);
			if (previewMayRead && r.status === 200) return;
			if (r.status < 400 || r.status >= 500) findings.add(`${c.kind} (${c.name}, ${type}) → ${r.status} ${r.text.slice(0, 200)}`);
			else if (!/"message":"[^"]+"/.test(r.text)) findings.add(`${c.kind} → ${r.status} without a message`);
		});
		tried[label] = cases.length;
		console.log(`${label}: ${cases.length} bodies ${JSON.stringify(kinds)}`);
		expect(findings.list).toEqual([]);
	});

	it('stored nothing: every table has as many rows as before, the object store the same keys', async () => {
		console.log(`multipart bodies tried: ${Object.values(tried).reduce((a, b) => a + b, 0)} ${JSON.stringify(tried)}`);
		expect(await storedState()).toEqual(before);
	});
});
