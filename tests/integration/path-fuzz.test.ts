// Every route of the authorization table with parameters in its path, every method, asked by a studio's
// owner with one parameter at a time replaced: by another studio's id of the same kind, or by random
// strings (fast-check, fixed seed: uuids, text, traversal, quotes, NUL, very long). A request that changes
// data carries a body with plausible values for many routes' fields, so that a route that reads its body
// first still gets as far as its own checks. Never a success nor a 5xx; nothing anywhere changes (every
// table's rows compared, contents included, and the object store's keys).
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { authzRoutes, Findings, fuzzWorld, inBatches, routePath, storedState, type FuzzWorld } from './fuzz-support';
import { testDbClose } from './helpers';

const RANDOM_PER_PARAM = Number(process.env.FUZZ_PATH ?? 25);
const SEED = 20261206;

const routes = authzRoutes((routeId) => /\[\w+\]/.test(routeId));

/** Plausible values for the fields of many routes (unknown keys are ignored by every route). */
const PLAUSIBLE = {
	name: 'Fuzz path name',
	code: 'FZ-1',
	role: 'designer',
	email: 'fuzz-path@example.test',
	body: 'Fuzz path text',
	label: 'Fuzz path',
	message: 'Fuzz path change',
	action: 'propose',
	title: 'Fuzz fitting',
	fittedOn: '2026-12-04',
	status: 'active',
	done: true,
	category: 'other'
};

const randomParam = fc.oneof(
	{ arbitrary: fc.uuid(), weight: 3 },
	{ arbitrary: fc.string({ minLength: 1, maxLength: 30 }), weight: 3 },
	{ arbitrary: fc.constantFrom('..', '.', '%00', 'null', 'undefined', '0', '-1', "' or '1'='1", '"; drop table styles;--', 'a'.repeat(3000), '\u0000', '../../api/me', '00000000-0000-0000-0000-000000000000'), weight: 2 }
);

let w: FuzzWorld;
let before: Awaited<ReturnType<typeof storedState>>;

beforeAll(async () => {
	w = await fuzzWorld('Path fuzz');
	await w.owner.api('GET', '/api/me');
	before = await storedState(true);
}, 120_000);

afterAll(async () => {
	await w?.app.close();
	await testDbClose();
});

describe('path parameters: random strings and another studio\'s ids', () => {
	it('finds the routes with parameters in the authorization table', () => {
		expect(routes.filter((r) => r.routeId.startsWith('/api/')).length).toBeGreaterThanOrEqual(40);
	});

	it('answers every such request with neither a success nor a 5xx', { timeout: 300_000 }, async () => {
		const requests: { method: string; path: string; what: string }[] = [];
		const perRoute: Record<string, number> = {};
		routes.forEach(({ routeId, method }, i) => {
			const params = [...routeId.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
			const first = requests.length;
			for (const [j, p] of params.entries()) {
				const values = fc.sample(randomParam, { seed: SEED + i * 10 + j, numRuns: RANDOM_PER_PARAM });
				for (const v of values) requests.push({ method, path: routePath(routeId, w.ids, { [p]: v }), what: `${method} ${routeId} [${p}]=${JSON.stringify(v).slice(0, 40)}` });
				if (w.otherIds[p] && w.otherIds[p] !== w.ids[p]) requests.push({ method, path: routePath(routeId, w.ids, { [p]: w.otherIds[p] }), what: `${method} ${routeId} [${p}]=another studio's` });
			}
			perRoute[`${method} ${routeId}`] = requests.length - first;
		});
		const findings = new Findings();
		const statuses: Record<number, number> = {};
		await inBatches(requests, 12, async ({ method, path, what }) => {
			const json = path.startsWith('/api/');
			const body = method === 'GET' ? undefined : json ? JSON.stringify(PLAUSIBLE) : new URLSearchParams(PLAUSIBLE as unknown as Record<string, string>).toString();
			const headers: Record<string, string> = { accept: json ? 'application/json' : 'text/html' };
			if (body !== undefined) headers['content-type'] = json ? 'application/json' : 'application/x-www-form-urlencoded';
			let status: number;
			try {
				const r = await w.owner.request(method, path, { body, headers });
				status = r.status;
				await r.arrayBuffer();
			} catch (e) {
				return findings.add(`${what}: no answer (${(e as Error).message})`);
			}
			statuses[status] = (statuses[status] ?? 0) + 1;
			if (status < 300 || status >= 500) findings.add(`${what} → ${status}`);
		});
		console.log(`path parameters tried: ${requests.length} requests over ${routes.length} routes and methods; answers ${JSON.stringify(statuses)}\n${Object.entries(perRoute).map(([r, n]) => `  ${n}  ${r}`).join('\n')}`);
		expect(findings.list).toEqual([]);
	});

	it('changed nothing: every table\'s rows and the object store are as before', async () => {
		expect(await storedState(true)).toEqual(before);
	});
});
