// The authorization matrix, generated from src/lib/server/authz.ts: every route id and method of the
// table, for every kind of visitor (signed out, each role of a studio, a member of another studio),
// against the built app. Route files without a row fail here; so do rows without a route.
import { randomUUID } from 'node:crypto';
import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AUTHZ, type Method, type Rule } from '../../src/lib/server/authz';
import type { Role } from '../../src/lib/server/db/schema';
import { startApp, type RunningApp } from './app-server';
import { Client, memberAdd, sessionClient, studioMake, testDbClose, userMake } from './helpers';

type Actor = 'anonymous' | Role | 'outsider';
const ACTORS: Actor[] = ['anonymous', 'owner', 'patterncutter', 'designer', 'sampleroom', 'outsider'];

/** How to call a route when a visitor is let through, and what it then answers. */
interface Sample {
	path: string; // with [studioId] etc. still in it
	form?: Record<string, string>;
	json?: unknown;
	ok: number | ((actor: Actor) => number);
	/** The request ends the visitor's session: use a session of its own. */
	endsSession?: boolean;
	/** The request ends the visitor's membership or account: a new member of the same role makes it. */
	freshMember?: boolean;
}

/**
 * Expected answers of the routes of this part of the app when the gate lets the visitor through
 * (bodies chosen so nothing changes: validation refuses them). Routes without a sample get the
 * generic check: the gate decision must show (401/303, 404, 403), and a visitor let through must
 * not get 401, 403 or 405.
 */
const SAMPLES: Record<string, Partial<Record<Method, Sample>>> = {
	'/': { GET: { path: '/', ok: (a) => (a === 'anonymous' ? 200 : 303) } },
	'/(auth)/signup': { GET: { path: '/signup', ok: 200 }, POST: { path: '/signup', form: {}, ok: 400 } },
	'/(auth)/signin': { GET: { path: '/signin', ok: 200 }, POST: { path: '/signin', form: {}, ok: 400 } },
	'/(auth)/signout': {
		GET: { path: '/signout', ok: 200 },
		POST: { path: '/signout', form: {}, ok: 303, endsSession: true }
	},
	'/(auth)/reset': { GET: { path: '/reset', ok: 200 }, POST: { path: '/reset', form: {}, ok: 400 } },
	'/(auth)/reset/[token]': {
		GET: { path: '/reset/no-such-token', ok: 404 },
		// the action refuses the body (400), then rendering the page finds no such link: 404
		POST: { path: '/reset/no-such-token', form: {}, ok: 404 }
	},
	'/(auth)/invite/[token]': {
		GET: { path: '/invite/no-such-token', ok: 404 },
		POST: { path: '/invite/no-such-token?/signup', form: {}, ok: 404 }
	},
	'/studios/new': { GET: { path: '/studios/new', ok: 200 }, POST: { path: '/studios/new', form: {}, ok: 400 } },
	'/studios/[studioId]': { GET: { path: '/studios/[studioId]', ok: 200 } },
	'/studios/[studioId]/members': { GET: { path: '/studios/[studioId]/members', ok: 200 } },
	'/studios/[studioId]/styles/[styleId]/size-runs': { GET: { path: '/studios/[studioId]/styles/[styleId]/size-runs', ok: 404 } },
	'/studios/[studioId]/size-runs/[sizeRunId]': { GET: { path: '/studios/[studioId]/size-runs/[sizeRunId]', ok: 404 } },
	'/api/me': { GET: { path: '/api/me', ok: 200 }, DELETE: { path: '/api/me', json: {}, ok: 400 } },
	'/api/me/export': { GET: { path: '/api/me/export', ok: 200 } },
	'/settings/account': {
		GET: { path: '/settings/account', ok: 200 },
		POST: { path: '/settings/account?/delete', form: {}, ok: 400 }
	},
	'/api/studios': { GET: { path: '/api/studios', ok: 200 }, POST: { path: '/api/studios', json: {}, ok: 400 } },
	'/api/studios/[studioId]': {
		GET: { path: '/api/studios/[studioId]', ok: 200 },
		PATCH: { path: '/api/studios/[studioId]', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/members': { GET: { path: '/api/studios/[studioId]/members', ok: 200 } },
	'/api/studios/[studioId]/members/[userId]': {
		PATCH: { path: '/api/studios/[studioId]/members/not-a-uuid', json: {}, ok: 400 },
		DELETE: { path: '/api/studios/[studioId]/members/not-a-uuid', ok: 400 }
	},
	'/api/studios/[studioId]/invitations': {
		GET: { path: '/api/studios/[studioId]/invitations', ok: 200 },
		POST: { path: '/api/studios/[studioId]/invitations', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/invitations/[invitationId]': { DELETE: { path: '/api/studios/[studioId]/invitations/[invitationId]', ok: 404 } },
	'/api/studios/[studioId]/membership': { DELETE: { path: '/api/studios/[studioId]/membership', ok: 204, freshMember: true } },
	// billing: owners only; the provider's webhook is open to anyone, and refuses a body without its signature
	'/studios/[studioId]/billing': { GET: { path: '/studios/[studioId]/billing', ok: 200 } },
	'/api/studios/[studioId]/billing': { GET: { path: '/api/studios/[studioId]/billing?invoices=no', ok: 200 } },
	'/api/studios/[studioId]/billing/checkout': { POST: { path: '/api/studios/[studioId]/billing/checkout', json: {}, ok: 400 } },
	'/api/studios/[studioId]/billing/portal': { POST: { path: '/api/studios/[studioId]/billing/portal', json: {}, ok: 400 } },
	'/api/studios/[studioId]/billing/subscription': { PATCH: { path: '/api/studios/[studioId]/billing/subscription', json: {}, ok: 400 } },
	'/api/billing/webhook': { POST: { path: '/api/billing/webhook', json: {}, ok: 400 } },
	// fittings, fit notes, the review of a version, e-mail settings (ids that do not exist: 404; bodies refused: 400)
	'/studios/[studioId]/fittings/[fittingId]': { GET: { path: '/studios/[studioId]/fittings/[fittingId]', ok: 404 } },
	'/settings/notifications': { GET: { path: '/settings/notifications', ok: 200 }, POST: { path: '/settings/notifications', form: {}, ok: 400 } },
	'/api/me/notifications': {
		GET: { path: '/api/me/notifications', ok: 200 },
		PATCH: { path: '/api/me/notifications', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/styles/[styleId]/fittings': {
		GET: { path: '/api/studios/[studioId]/styles/[styleId]/fittings', ok: 404 },
		POST: { path: '/api/studios/[studioId]/styles/[styleId]/fittings', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/fittings/[fittingId]': {
		GET: { path: '/api/studios/[studioId]/fittings/[fittingId]', ok: 404 },
		DELETE: { path: '/api/studios/[studioId]/fittings/[fittingId]', ok: 404 }
	},
	'/api/studios/[studioId]/fittings/[fittingId]/photos': { POST: { path: '/api/studios/[studioId]/fittings/[fittingId]/photos', json: {}, ok: 404 } },
	'/api/studios/[studioId]/fittings/[fittingId]/photos/[photoId]': { DELETE: { path: '/api/studios/[studioId]/fittings/[fittingId]/photos/[photoId]', ok: 404 } },
	'/api/studios/[studioId]/fittings/[fittingId]/notes': { POST: { path: '/api/studios/[studioId]/fittings/[fittingId]/notes', json: {}, ok: 400 } },
	'/api/studios/[studioId]/fittings/[fittingId]/notes/[noteId]': { PATCH: { path: '/api/studios/[studioId]/fittings/[fittingId]/notes/[noteId]', json: {}, ok: 400 } },
	'/api/studios/[studioId]/fittings/[fittingId]/notes/[noteId]/done': {
		POST: { path: '/api/studios/[studioId]/fittings/[fittingId]/notes/[noteId]/done', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/pieces/[pieceId]/fit-notes': { GET: { path: '/api/studios/[studioId]/pieces/[pieceId]/fit-notes', ok: 404 } },
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/comments': {
		GET: { path: '/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/comments', ok: 404 },
		POST: { path: '/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/comments', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/review': {
		GET: { path: '/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/review', ok: 404 }
	},
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/state': {
		POST: { path: '/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/state', json: {}, ok: 400 }
	},
	// size runs: pattern cutters and owners start and cancel them; whoever sees drafts reads them
	'/api/studios/[studioId]/styles/[styleId]/size-runs': {
		GET: { path: '/api/studios/[studioId]/styles/[styleId]/size-runs', ok: 404 },
		POST: { path: '/api/studios/[studioId]/styles/[styleId]/size-runs', json: {}, ok: 400 }
	},
	'/api/studios/[studioId]/size-runs/[sizeRunId]': {
		GET: { path: '/api/studios/[studioId]/size-runs/[sizeRunId]', ok: 404 },
		DELETE: { path: '/api/studios/[studioId]/size-runs/[sizeRunId]', ok: 404 }
	},
	// size sets: pattern cutters and owners keep a run, the signers sign sizes off, everyone reads (handlers filter)
	'/api/studios/[studioId]/size-runs/[sizeRunId]/keep': { POST: { path: '/api/studios/[studioId]/size-runs/[sizeRunId]/keep', json: { name: '' }, ok: 400 } },
	'/api/studios/[studioId]/styles/[styleId]/size-sets': { GET: { path: '/api/studios/[studioId]/styles/[styleId]/size-sets', ok: 404 } },
	'/api/studios/[studioId]/size-sets/[sizeSetId]': { GET: { path: '/api/studios/[studioId]/size-sets/[sizeSetId]', ok: 404 } },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/sign-off': { POST: { path: '/api/studios/[studioId]/size-sets/[sizeSetId]/sign-off', json: {}, ok: 400 } },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/export.svg': { GET: { path: '/api/studios/[studioId]/size-sets/[sizeSetId]/export.svg', ok: 404 } },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/export.pdf': { GET: { path: '/api/studios/[studioId]/size-sets/[sizeSetId]/export.pdf', ok: 404 } },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/export.dxf': { GET: { path: '/api/studios/[studioId]/size-sets/[sizeSetId]/export.dxf', ok: 404 } }
};

/** Route ids of the app, from the files under src/routes (as SvelteKit derives them). */
function routeIds(dir = path.resolve('src/routes'), base = ''): string[] {
	const out: string[] = [];
	const entries = readdirSync(dir);
	if (entries.some((f) => /^\+(page(\.server)?\.(ts|js|svelte)|server\.(ts|js))$/.test(f))) out.push(base || '/');
	for (const e of entries) {
		if (statSync(path.join(dir, e)).isDirectory()) out.push(...routeIds(path.join(dir, e), `${base}/${e}`));
	}
	return out;
}

const isApi = (routeId: string) => routeId.startsWith('/api/');
const allows = (rule: Rule, actor: Actor) =>
	rule === 'public' ||
	(actor !== 'anonymous' && (rule === 'signed_in' || (actor !== 'outsider' && (rule as readonly string[]).includes(actor))));

/** What the gate answers a visitor it does not let through; null when it lets them through. */
function denial(routeId: string, rule: Rule, actor: Actor): number | null {
	if (allows(rule, actor)) return null;
	if (actor === 'anonymous') return isApi(routeId) ? 401 : 303;
	if (actor === 'outsider') return 404;
	return 403;
}

let app: RunningApp;
let studioId: string;
const users = {} as Record<Exclude<Actor, 'anonymous'>, string>;
const clients = {} as Record<Actor, Client>;

beforeAll(async () => {
	app = await startApp();
	const studio = await studioMake('Matrix');
	const other = await studioMake('Elsewhere');
	studioId = studio.id;
	for (const role of ['owner', 'patterncutter', 'designer', 'sampleroom'] as const) {
		const u = await userMake(role);
		await memberAdd(studio.id, u.id, role);
		users[role] = u.id;
	}
	const outsider = await userMake('outsider');
	await memberAdd(other.id, outsider.id, 'owner');
	users.outsider = outsider.id;
	clients.anonymous = new Client(app.baseUrl);
	for (const a of ACTORS) if (a !== 'anonymous') clients[a] = await sessionClient(app.baseUrl, users[a]);
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const onDisk = new Set(routeIds());

describe('the authz table covers the app', () => {
	it('has a row for every route of src/routes', () => {
		const missing = [...onDisk].filter((id) => !(id in AUTHZ));
		expect(missing, 'add these routes to AUTHZ in src/lib/server/authz.ts').toEqual([]);
	});
	it('has no row for a route that does not exist', () => {
		const stale = Object.keys(AUTHZ).filter((id) => !onDisk.has(id));
		expect(stale, 'remove these rows from AUTHZ').toEqual([]);
	});
	it('has an exact sample for every route of this part of the app', () => {
		for (const [id, methods] of Object.entries(SAMPLES)) {
			expect(AUTHZ[id], id).toBeDefined();
			expect(Object.keys(methods).sort(), id).toEqual(Object.keys(AUTHZ[id]).sort());
		}
	});
});

const cases = Object.entries(AUTHZ)
	.filter(([id]) => onDisk.has(id))
	.flatMap(([routeId, methods]) =>
		Object.entries(methods).flatMap(([method, rule]) =>
			ACTORS.map((actor) => ({ routeId, method: method as Method, rule: rule as Rule, actor }))
		)
	);

function fill(p: string): string {
	return p.replace(/\[studioId\]/g, studioId).replace(/\[[^\]]+\]/g, () => randomUUID());
}

function genericPath(routeId: string): string {
	return routeId.replace(/\/\([^)]+\)/g, '') || '/';
}

describe('authorization matrix', () => {
	it.each(cases)('$method $routeId as $actor', async ({ routeId, method, rule, actor }) => {
		const sample = SAMPLES[routeId]?.[method];
		const target = fill(sample?.path ?? genericPath(routeId));
		let client = clients[actor];
		if (sample?.endsSession && actor !== 'anonymous') client = await sessionClient(app.baseUrl, users[actor]);
		if (sample?.freshMember && actor !== 'anonymous' && actor !== 'outsider') {
			const u = await userMake(actor);
			await memberAdd(studioId, u.id, actor);
			client = await sessionClient(app.baseUrl, u.id);
		}
		const body =
			sample?.form !== undefined
				? { form: sample.form }
				: sample?.json !== undefined || (!sample && method !== 'GET' && method !== 'DELETE' && isApi(routeId))
					? { json: sample?.json ?? {} }
					: method !== 'GET' && method !== 'DELETE' && !isApi(routeId)
						? { form: {} }
						: { headers: isApi(routeId) ? { accept: 'application/json' } : undefined };
		const res = await client.request(method, target, body as never);
		const denied = denial(routeId, rule, actor);
		const what = `${method} ${target} as ${actor} → ${res.status}`;
		if (denied !== null) {
			expect(res.status, what).toBe(denied);
			if (denied === 303) expect(res.headers.get('location'), what).toMatch(/^\/signin\?next=/);
			if (isApi(routeId)) {
				const err = (await res.json()).error;
				expect(err.code, what).toBe({ 401: 'unauthenticated', 403: 'forbidden', 404: 'not_found' }[denied]);
				expect(typeof err.message).toBe('string');
			}
			return;
		}
		if (sample) {
			const ok = typeof sample.ok === 'function' ? sample.ok(actor) : sample.ok;
			expect(res.status, what).toBe(ok);
		} else {
			expect([401, 403, 405], what).not.toContain(res.status);
			if (res.status === 303) expect(res.headers.get('location'), what).not.toMatch(/^\/signin/);
		}
	});
});

describe('default deny', () => {
	it('answers 405 with Allow for a method the table does not list', async () => {
		const r = await clients.owner.request('PUT', '/api/me', { json: {} });
		expect(r.status).toBe(405);
		expect(r.headers.get('allow')).toBe('GET, DELETE, HEAD');
		expect((await r.json()).error.code).toBe('method_not_allowed');
		const page = await clients.owner.request('POST', `/studios/${studioId}`, { form: {} });
		expect(page.status).toBe(405);
	});

	it('answers JSON 404 for an unknown API path, signed in or not', async () => {
		for (const a of ['anonymous', 'owner'] as const) {
			const r = await clients[a].api('GET', '/api/no-such-thing');
			expect(r.status).toBe(404);
			expect((await r.json()).error.code).toBe('not_found');
		}
	});

	it('answers 404 for a malformed or unknown studio id, as for another studio', async () => {
		for (const id of ['not-a-uuid', randomUUID()]) {
			expect((await clients.owner.api('GET', `/api/studios/${id}`)).status).toBe(404);
			expect((await clients.owner.get(`/studios/${id}/members`)).status).toBe(404);
		}
	});
});
