// Random bodies, fast-check with a fixed seed, to every JSON route of the authorization table that
// changes data (POST, PATCH, PUT, and DELETE /api/me, the one DELETE with a body): random JSON values,
// the route's own field names holding wrong types, huge strings, deep nesting, prototype keys, text with
// NUL characters, malformed JSON and the wrong content type. Every answer must be a 4xx with a message,
// never a 5xx nor a success (a PATCH may meet a body that happens to fit: it changes the row, counted
// apart), and nothing may be stored: every table has as many rows after as before, the object store the
// same keys. The multipart routes are fuzzed in multipart-fuzz.test.ts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fuzzBodies, deepObject } from './fuzz-bodies';
import { testDbClose } from './helpers';
import { sessionHeaders } from './fittings-support';
import { authzRoutes, Findings, fuzzWorld, inBatches, requestAlone, routePath, storedState, type FuzzWorld } from './fuzz-support';

const BODIES_PER_ROUTE = Number(process.env.FUZZ_BODIES ?? 2000);
const CONCURRENCY = 16;
/** over every JSON body limit (1 MB; 4 MB for pieces and versions; style changes' limit) and under adapter-node's 16 MB): refused with a 4xx, mostly 413 */
const BIG_BODY_CHARS = 9_000_000;
const SEED = 20261204;
const MULTIPART = ['/api/studios/[studioId]/fittings/[fittingId]/photos', '/api/studios/[studioId]/styles/[styleId]/imports'];

const routes = authzRoutes(
	(routeId, method) =>
		routeId.startsWith('/api/') && !MULTIPART.includes(routeId) && (method === 'POST' || method === 'PATCH' || method === 'PUT' || (method === 'DELETE' && routeId === '/api/me'))
);

let w: FuzzWorld;
let before: Awaited<ReturnType<typeof storedState>>;
const tried: Record<string, number> = {};
const acceptedPatches: Record<string, number> = {};
let retriedAlone = 0;

beforeAll(async () => {
	w = await fuzzWorld();
	await w.owner.api('GET', '/api/me'); // a session's first use may refresh it: before the snapshot
	before = await storedState();
}, 120_000);

afterAll(async () => {
	await w?.app.close();
	await testDbClose();
});

/** The field names a route asks for, read from its own answer to an empty object. */
async function fieldsOf(method: string, path: string): Promise<string[]> {
	const r = await w.owner.request(method, path, { body: '{}', headers: { 'content-type': 'application/json', accept: 'application/json' } });
	const err = ((await r.json().catch(() => ({}))) as { error?: { fields?: Record<string, unknown>; message?: string } }).error;
	const fromList = /send at least one of ([\w, ]+)\./.exec(err?.message ?? '')?.[1]?.split(', ') ?? [];
	return [...new Set([...Object.keys(err?.fields ?? {}).map((k) => k.split('.')[0]), ...fromList])].filter((k) => /^\w+$/.test(k));
}

describe('random bodies to every JSON route that changes data', () => {
	it('finds the routes in the authorization table', () => {
		expect(routes.length).toBeGreaterThanOrEqual(25);
	});

	it.each(routes)('$method $routeId answers every random body with a 4xx and a message', { timeout: 300_000 }, async ({ routeId, method }) => {
		const path = routePath(routeId, w.ids);
		const fields = await fieldsOf(method, path);
		const seed = SEED + routes.findIndex((r) => r.routeId === routeId && r.method === method);
		const bodies = fuzzBodies(fields, seed, BODIES_PER_ROUTE);
		// a deep object made by hand, then a body over every JSON limit on a connection of its own
		bodies.push({ text: deepObject(100_000), type: 'application/json' });
		const findings = new Findings();
		let accepted = 0;
		let retried = 0;
		await inBatches(bodies, CONCURRENCY, async (b) => {
			let status: number;
			let text: string;
			try {
				const r = await w.owner.request(method, path, { body: b.text, headers: { 'content-type': b.type, accept: 'application/json' } });
				[status, text] = [r.status, await r.text()];
			} catch {
				// a kept-alive connection the app closed after refusing an earlier body unread: once more alone
				const again = await requestAlone(w.app.baseUrl, method, path, { ...sessionHeaders(w.owner), 'content-type': b.type }, b.text);
				if (!('status' in again)) return findings.add(`no answer (${again.error}) ← ${b.text.slice(0, 200)}`);
				[status, text] = [again.status, again.text];
				retried++;
			}
			// a PATCH may meet a body that happens to fit (a field that takes '' or a number): it changes, never adds
			if (status < 300 && method === 'PATCH') accepted++;
			else if (status < 400 || status >= 500) findings.add(`${status} ← ${b.text.slice(0, 200)} → ${text.slice(0, 160)}`);
			else if (!/"message":"[^"]+"/.test(text)) findings.add(`${status} without a message ← ${b.text.slice(0, 200)}`);
		});
		const big = await requestAlone(w.app.baseUrl, method, path, { ...sessionHeaders(w.owner), 'content-type': 'application/json' }, JSON.stringify({ [fields[0] ?? 'name']: 'y'.repeat(BIG_BODY_CHARS) }));
		// refused unread: a 4xx, or the connection closed while the body was still being sent
		if ('status' in big ? big.status < 400 || big.status >= 500 : !/ECONNRESET|EPIPE/.test(big.error)) findings.add(`a body of 9 MB → ${JSON.stringify(big).slice(0, 200)}`);
		tried[`${method} ${routeId}`] = bodies.length + 1;
		if (accepted > 0) acceptedPatches[`${method} ${routeId}`] = accepted;
		retriedAlone += retried;
		expect(findings.list).toEqual([]);
	});

	it('stored nothing: every table has as many rows as before, the object store the same keys', async () => {
		const total = Object.values(tried).reduce((a, b) => a + b, 0);
		console.log(`random bodies tried: ${total} over ${Object.keys(tried).length} routes\n${Object.entries(tried).map(([r, n]) => `  ${n}  ${r}`).join('\n')}`);
		console.log(`PATCH bodies that happened to fit (answered 200): ${JSON.stringify(acceptedPatches)}; sent again alone after a closed connection: ${retriedAlone}`);
		expect(await storedState()).toEqual(before);
	});
});
