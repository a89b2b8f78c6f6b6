// Every POST and PATCH route, taken from the one authorization table, answers bodies that carry
// nothing it can use (empty objects, only unknown keys, arrays, null, numbers, strings, booleans)
// with a 4xx and a message: never 500, never a success, and nothing is changed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import demo from '../../fixtures/demo-studio.json';
import { AUTHZ, type Method } from '../../src/lib/server/authz';
import { usersByEmail } from '../../src/lib/server/repositories/users';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { startApp, type RunningApp } from './app-server';
import { sessionClient, testDb, testDbClose, type Client } from './helpers';

const BODIES: unknown[] = [
	{},
	{ unknownField: 1 },
	{ zz: 'text', nested: { a: [1, 2] }, __proto_like: null },
	[],
	[1, 'two', { three: 3 }],
	null,
	0,
	42,
	-1.5,
	'',
	'some text',
	true,
	false
];

let app: RunningApp;
let owner: Client;
const ids: Record<string, string> = {};

/** Fills a route id's parameters with ids of the demo studio (and drops route groups). */
function routePath(routeId: string): string {
	return routeId
		.replace(/\/\([^)]+\)/g, '')
		.replace(/\[(\w+)\]/g, (_, name: string) => {
			const id = ids[name];
			if (!id) throw new Error(`no test value for [${name}] in ${routeId}`);
			return id;
		});
}

const routes = Object.entries(AUTHZ).flatMap(([routeId, methods]) =>
	(['POST', 'PATCH'] as Method[]).filter((m) => methods[m]).map((method) => ({ routeId, method }))
);

beforeAll(async () => {
	app = await startApp();
	const { studioId } = await demoStudioSeed(testDb());
	const db = testDb();
	const ownerUser = (await usersByEmail(db, demo.users.find((u) => u.role === 'owner')!.email))!;
	const cutter = (await usersByEmail(db, demo.users.find((u) => u.role === 'patterncutter')!.email))!;
	const style = await db.selectFrom('styles').select('id').where('studio_id', '=', studioId).executeTakeFirstOrThrow();
	const piece = await db.selectFrom('pieces').select(['id', 'head_version_id']).where('style_id', '=', style.id).executeTakeFirstOrThrow();
	const pair = await db.selectFrom('seam_pairs').select('id').where('style_id', '=', style.id).executeTakeFirst();
	const set = await db
		.insertInto('measurement_sets')
		.values({ studio_id: studioId, name: `Fuzz client ${Date.now()}`, kind: 'client', values: JSON.stringify([]), created_by: ownerUser.id })
		.returning('id')
		.executeTakeFirstOrThrow();
	// a fitting of the style with a note on the piece (the demo fitting when there is one)
	const fitting =
		(await db.selectFrom('fittings').select('id').where('style_id', '=', style.id).executeTakeFirst()) ??
		(await db.insertInto('fittings').values({ style_id: style.id, fitted_on: '2026-12-03', title: 'Fuzz fitting', fit_model: 'A', created_by: ownerUser.id }).returning('id').executeTakeFirstOrThrow());
	const note =
		(await db.selectFrom('fit_notes').select('id').where('fitting_id', '=', fitting.id).executeTakeFirst()) ??
		(await db
			.insertInto('fit_notes')
			.values({ fitting_id: fitting.id, piece_id: piece.id, version_id: piece.head_version_id!, x_mm: 0, y_mm: 0, category: 'other', body: 'Fuzz note', created_by: ownerUser.id })
			.returning('id')
			.executeTakeFirstOrThrow());
	Object.assign(ids, {
		studioId,
		fittingId: fitting.id,
		noteId: note.id,
		styleId: style.id,
		pieceId: piece.id,
		versionId: piece.head_version_id!,
		seamPairId: pair?.id ?? crypto.randomUUID(),
		// no such run or size set: a usable body would be answered 404, never a success
		sizeRunId: crypto.randomUUID(),
		sizeSetId: crypto.randomUUID(),
		setId: set.id,
		userId: cutter.id,
		token: 'not-a-real-token-0123456789abcdef'
	});
	owner = await sessionClient(app.baseUrl, ownerUser.id);
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

describe('bodies with nothing usable', () => {
	it('finds the POST and PATCH routes to try in the authorization table', () => {
		expect(routes.filter((r) => r.method === 'PATCH').length).toBeGreaterThanOrEqual(5);
		expect(routes.filter((r) => r.routeId.startsWith('/api/') && r.method === 'POST').length).toBeGreaterThanOrEqual(8);
	});

	it.each(routes)('$method $routeId answers every such body with a 4xx and a message', async ({ routeId, method }) => {
		const path = routePath(routeId);
		const failures: string[] = [];
		for (const body of BODIES) {
			const r = await owner.request(method, path, { body: JSON.stringify(body), headers: { 'content-type': 'application/json', accept: 'application/json' } });
			const text = await r.text();
			if (r.status < 400 || r.status >= 500) failures.push(`${JSON.stringify(body)} → ${r.status} ${text.slice(0, 160)}`);
			else if (routeId.startsWith('/api/') && !/"message":"[^"]+"/.test(text)) failures.push(`${JSON.stringify(body)} → ${r.status} without a message`);
		}
		expect(failures).toEqual([]);
	});

	it('says which fields a PATCH can change when it is sent nothing to change', async () => {
		const r = await owner.api('PATCH', `/api/studios/${ids.studioId}/styles/${ids.styleId}`, { colour: 'madder' });
		expect(r.status).toBe(400);
		const body = await r.json();
		expect(body.error.code).toBe('nothing_to_change');
		expect(body.error.message).toBe('Nothing to change: send at least one of name, code, season, notes, status.');
	});
});
