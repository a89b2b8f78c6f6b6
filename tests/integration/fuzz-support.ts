// Shared set-up of the fuzzing tests (body-fuzz-random, multipart-fuzz, path-fuzz): a studio of their own
// (one member per role, a style, a piece signed off, a fitting and a fit note) with ids for every route
// parameter, a second studio with ids of its own (which the first one's owner must never
// reach), the routes of the authorization table, and what "nothing stored" is compared on: the row
// count and contents of every table, and the object store's keys.
import http from 'node:http';
import { sql } from 'kysely';
import { AUTHZ, type Method } from '../../src/lib/server/authz';
import { storageList } from '../../src/lib/server/storage';
import { startApp, type RunningApp } from './app-server';
import { fittingWorld, storageEnvUse } from './fittings-support';
import { testDb, type Client } from './helpers';

export interface FuzzWorld {
	app: RunningApp;
	/** the studio's owner: every role rule lets an owner through */
	owner: Client;
	/** ids of the studio for every route parameter */
	ids: Record<string, string>;
	/** ids of another studio, one per parameter where it has one */
	otherIds: Record<string, string>;
}

/**
 * Every allowance far above what a fuzzing run sends, so that throttling never answers in place of the
 * handler (names from src/lib/server/rate-limits.ts). Set before the app starts: it reads them then.
 */
export function rateLimitsLift(): void {
	for (const name of ['PHOTO_USER', 'IMPORT_USER', 'INVITE_STUDIO', 'RESET_EMAIL', 'RESET_ADDRESS', 'SIGNUP_ADDRESS']) {
		process.env[`RATE_LIMIT_${name}`] = '1000000';
	}
}

async function studioIds(studioId: string, userId: string): Promise<Record<string, string>> {
	const db = testDb();
	const style = await db.selectFrom('styles').select('id').where('studio_id', '=', studioId).orderBy('created_at').executeTakeFirstOrThrow();
	const piece = await db.selectFrom('pieces').select(['id', 'head_version_id']).where('style_id', '=', style.id).orderBy('created_at').executeTakeFirstOrThrow();
	const pair = await db.selectFrom('seam_pairs').select('id').where('style_id', '=', style.id).executeTakeFirst();
	const set = await db
		.insertInto('measurement_sets')
		.values({ studio_id: studioId, name: `Fuzz client ${crypto.randomUUID().slice(0, 8)}`, kind: 'client', values: JSON.stringify([]), created_by: userId })
		.returning('id')
		.executeTakeFirstOrThrow();
	const fitting =
		(await db.selectFrom('fittings').select('id').where('style_id', '=', style.id).executeTakeFirst()) ??
		(await db.insertInto('fittings').values({ style_id: style.id, fitted_on: '2026-12-03', title: 'Fuzz fitting', fit_model: 'A', created_by: userId }).returning('id').executeTakeFirstOrThrow());
	const note =
		(await db.selectFrom('fit_notes').select('id').where('fitting_id', '=', fitting.id).executeTakeFirst()) ??
		(await db
			.insertInto('fit_notes')
			.values({ fitting_id: fitting.id, piece_id: piece.id, version_id: piece.head_version_id!, x_mm: 0, y_mm: 0, category: 'other', body: 'Fuzz note', created_by: userId })
			.returning('id')
			.executeTakeFirstOrThrow());
	const photo = await db.selectFrom('fitting_photos').select('id').where('fitting_id', '=', fitting.id).executeTakeFirst();
	const invitation = await db.selectFrom('invitations').select('id').where('studio_id', '=', studioId).executeTakeFirst();
	const run = await db.selectFrom('size_runs').select('id').where('style_id', '=', style.id).executeTakeFirst();
	const sizeSet = await db.selectFrom('size_sets').select('id').where('style_id', '=', style.id).executeTakeFirst();
	const ids: Record<string, string> = {
		studioId,
		styleId: style.id,
		pieceId: piece.id,
		versionId: piece.head_version_id!,
		setId: set.id,
		fittingId: fitting.id,
		noteId: note.id,
		token: 'not-a-real-token-0123456789abcdef'
	};
	if (pair) ids.seamPairId = pair.id;
	if (photo) ids.photoId = photo.id;
	if (invitation) ids.invitationId = invitation.id;
	if (run) ids.sizeRunId = run.id;
	if (sizeSet) ids.sizeSetId = sizeSet.id;
	return ids;
}

/** A studio of its own for the fuzzing (its owner signed in), and another studio beside it. */
export async function fuzzWorld(label = 'Fuzz'): Promise<FuzzWorld> {
	rateLimitsLift();
	storageEnvUse();
	const app = await startApp();
	const own = await fittingWorld(app.baseUrl, label);
	const other = await fittingWorld(app.baseUrl, `${label} elsewhere`);
	const ids = {
		// no such run, size set, photo, invitation or seam pair: a usable request would be answered 404
		sizeRunId: crypto.randomUUID(),
		sizeSetId: crypto.randomUUID(),
		photoId: crypto.randomUUID(),
		invitationId: crypto.randomUUID(),
		seamPairId: crypto.randomUUID(),
		...(await studioIds(own.studioId, own.users.owner.id)),
		userId: own.users.patterncutter.id
	};
	const otherIds = { ...(await studioIds(other.studioId, other.users.owner.id)), userId: other.users.patterncutter.id };
	// the studio's subscription was made in the database only: without it, billing requests are refused
	// by the app (4xx) rather than by the payment provider, which knows no such subscription (502)
	await testDb().deleteFrom('studio_billing').where('studio_id', '=', own.studioId).execute();
	return { app, owner: own.as.owner, ids, otherIds };
}

/** Fills a route id's parameters (and drops route groups); `override` names values for some of them. */
export function routePath(routeId: string, ids: Record<string, string>, override: Record<string, string> = {}): string {
	return routeId
		.replace(/\/\([^)]+\)/g, '')
		.replace(/\[(\w+)\]/g, (_, name: string) => {
			const id = override[name] ?? ids[name];
			if (id === undefined) throw new Error(`no test value for [${name}] in ${routeId}`);
			return override[name] !== undefined ? encodeURIComponent(id) : id;
		});
}

/** The routes and methods of the authorization table, filtered. */
export function authzRoutes(keep: (routeId: string, method: Method) => boolean): { routeId: string; method: Method }[] {
	return Object.entries(AUTHZ).flatMap(([routeId, methods]) =>
		(Object.keys(methods) as Method[]).filter((m) => keep(routeId, m)).map((method) => ({ routeId, method }))
	);
}

/** Tables whose rows are counters of requests, not stored data (rate limits, sign-in throttling). */
const COUNTERS = new Set(['rate_limits', 'sign_in_limits']);

/**
 * What is stored: per table of the public schema its row count (with `contents`, also an md5 of its rows,
 * so that an update shows as well as an insert or a delete), and the object store's keys.
 */
export async function storedState(contents = false): Promise<{ tables: Record<string, string>; objects: string[] }> {
	const db = testDb();
	const names = await sql<{ table_name: string }>`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name`.execute(db);
	const tables: Record<string, string> = {};
	for (const { table_name } of names.rows) {
		if (COUNTERS.has(table_name)) continue;
		const hash = contents ? sql`md5(string_agg(t::text, '|' order by t::text))` : sql`''`;
		const r = await sql<{ n: string; h: string | null }>`select count(*) as n, ${hash} as h from ${sql.table(table_name)} t`.execute(db);
		tables[table_name] = `${r.rows[0].n} rows ${r.rows[0].h ?? ''}`.trim();
	}
	return { tables, objects: (await storageList()).sort() };
}

/** Runs `fn` over the items with at most `concurrency` at a time. */
export async function inBatches<T>(items: readonly T[], concurrency: number, fn: (item: T, index: number) => Promise<void>): Promise<void> {
	let next = 0;
	const lane = async () => {
		while (next < items.length) {
			const i = next++;
			await fn(items[i], i);
		}
	};
	await Promise.all(Array.from({ length: Math.min(concurrency, items.length) }, lane));
}

/** What went wrong in a fuzzing run, kept short: the first few of each kind. */
export class Findings {
	readonly list: string[] = [];
	add(line: string): void {
		if (this.list.length < 40) this.list.push(line.slice(0, 400));
	}
}

/**
 * One request on a connection of its own, closed after the answer: for bodies the app refuses before
 * reading them (past a size limit it answers and closes the connection while the body is still sent,
 * which a shared keep-alive connection would carry over to the next request as a reset).
 */
export function requestAlone(base: string, method: string, path: string, headers: Record<string, string>, body: string | Uint8Array): Promise<{ status: number; text: string } | { error: string }> {
	return new Promise((resolve) => {
		const req = http.request(base + path, { method, headers: { ...headers, connection: 'close' }, agent: false }, (res) => {
			let text = '';
			res.setEncoding('utf8');
			res.on('data', (d) => (text += d));
			res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
			res.on('error', (e) => resolve({ error: e.message }));
		});
		req.on('error', (e) => resolve({ error: e.message }));
		req.end(body);
	});
}
