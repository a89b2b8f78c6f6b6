// Shared test helpers: a cookie-keeping HTTP client and quick fixtures made through the repositories.
import { createHash, randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { inject } from 'vitest';
import { passwordHash } from '../../src/lib/server/auth/password';
import { dbCreate, type Db } from '../../src/lib/server/db/index';
import type { Role } from '../../src/lib/server/db/schema';
import { membershipsCreate } from '../../src/lib/server/repositories/memberships';
import { studiosCreate } from '../../src/lib/server/repositories/studios';
import { usersCreate } from '../../src/lib/server/repositories/users';

export const SESSION_COOKIE = 'dartelier_session';
export const PASSWORD = 'cut-on-the-bias-42';

export function uniq(): string {
	return randomBytes(5).toString('hex');
}

let sharedDb: Db | undefined;
export function testDb(): Db {
	sharedDb ??= dbCreate(inject('databaseUrl'), 3);
	return sharedDb;
}
export async function testDbClose(): Promise<void> {
	await sharedDb?.destroy();
	sharedDb = undefined;
}

interface RequestOptions {
	form?: Record<string, string>;
	json?: unknown;
	body?: BodyInit;
	headers?: Record<string, string>;
	origin?: string | null;
	signal?: AbortSignal;
}

/** Keeps the session cookie like a browser would; never follows redirects. */
/**
 * fetch, sent once more when a kept-alive connection was reset before any answer came (the server closed
 * it as idle just as the request went out: the request never reached a handler). Any other failure, or a
 * second reset, is thrown as it is.
 */
async function fetchOnceMore(url: string, init: RequestInit): Promise<Response> {
	try {
		return await fetch(url, init);
	} catch (e) {
		const code = (e as { cause?: { code?: string } }).cause?.code;
		if (code !== 'ECONNRESET' || typeof init.body === 'object') throw e;
		return fetch(url, init);
	}
}

export class Client {
	session: string | null = null;
	lastSetCookies: string[] = [];
	constructor(readonly base: string) {}

	async request(method: string, path: string, o: RequestOptions = {}): Promise<Response> {
		// Like a browser (fetch's default */* would make SvelteKit answer form actions in JSON).
		const headers: Record<string, string> = { accept: 'text/html,*/*;q=0.8', ...(o.headers ?? {}) };
		if (this.session !== null) headers.cookie = `${SESSION_COOKIE}=${this.session}`;
		if (method !== 'GET' && method !== 'HEAD' && o.origin !== null) headers.origin = o.origin ?? this.base;
		let body: BodyInit | undefined = o.body;
		if (o.form) {
			headers['content-type'] = 'application/x-www-form-urlencoded';
			body = new URLSearchParams(o.form).toString();
		} else if (o.json !== undefined) {
			headers['content-type'] = 'application/json';
			headers.accept = 'application/json';
			body = JSON.stringify(o.json);
		}
		const res = await fetchOnceMore(this.base + path, { method, headers, body, redirect: 'manual', signal: o.signal });
		this.lastSetCookies = res.headers.getSetCookie();
		for (const c of this.lastSetCookies) {
			const m = c.match(new RegExp(`^${SESSION_COOKIE}=([^;]*)`));
			if (m) this.session = m[1] === '' ? null : m[1];
		}
		return res;
	}
	get(path: string, headers?: Record<string, string>) {
		return this.request('GET', path, { headers });
	}
	post(path: string, form: Record<string, string>) {
		return this.request('POST', path, { form });
	}
	api(method: string, path: string, json?: unknown) {
		return this.request(method, path, json === undefined ? { headers: { accept: 'application/json' } } : { json });
	}
}

let cachedHash: Promise<string> | undefined;

export interface TestUser {
	id: string;
	email: string;
	name: string;
	password: string;
}

/** A user straight in the database (password PASSWORD). */
export async function userMake(label = 'user'): Promise<TestUser> {
	cachedHash ??= passwordHash(PASSWORD);
	const email = `${label}-${uniq()}@example.test`;
	const u = await usersCreate(testDb(), { email, name: `${label} ${uniq()}`, passwordHash: await cachedHash });
	return { ...u, password: PASSWORD };
}

export async function studioMake(name = 'Atelier'): Promise<{ id: string; name: string }> {
	return studiosCreate(testDb(), `${name} ${uniq()}`);
}

/**
 * Puts a studio on the Studio plan straight in the database, as a handled subscription would leave it:
 * for tests about other things that make more styles or members than the free plan allows.
 */
export async function studioOnStudioPlan(studioId: string, seats = 50): Promise<void> {
	await testDb()
		.insertInto('studio_billing')
		.values({ studio_id: studioId, subscription_id: `sub_test_${uniq()}`, status: 'active', interval: 'month', seats, provider_updated_at: new Date() })
		.execute();
}

export async function memberAdd(studioId: string, userId: string, role: Role): Promise<void> {
	await membershipsCreate(testDb(), { studioId, userId, role });
}

/** Signs in through the form; returns the response (303 on success). */
export async function signIn(client: Client, email: string, password = PASSWORD): Promise<Response> {
	return client.post('/signin', { email, password });
}

export async function signedInClient(base: string, user: TestUser): Promise<Client> {
	const c = new Client(base);
	const r = await signIn(c, user.email, user.password);
	if (r.status !== 303 || !c.session) throw new Error(`sign-in of ${user.email} failed: ${r.status}`);
	return c;
}

/** Clears the per-address sign-in counters (every test signs in from 127.0.0.1). */
export async function throttleAddressReset(): Promise<void> {
	await sql`delete from sign_in_limits where key like 'signin_addr%'`.execute(testDb());
}

function base32(bytes: Uint8Array): string {
	const alphabet = 'abcdefghijklmnopqrstuvwxyz234567';
	let bits = 0;
	let value = 0;
	let out = '';
	for (const b of bytes) {
		value = (value << 8) | b;
		bits += 8;
		while (bits >= 5) {
			out += alphabet[(value >>> (bits - 5)) & 31];
			bits -= 5;
		}
	}
	if (bits > 0) out += alphabet[(value << (5 - bits)) & 31];
	return out;
}

/**
 * A change written straight to the database (not through the app) reaches what the app keeps between
 * requests by a change notice, heard a moment after the commit; a write request's answer waits until the
 * app has heard every notice committed before it (src/lib/server/hooks/change-sync.ts), so after this
 * the app at `base` answers from the database as it now is.
 */
export async function appHeardChanges(base: string): Promise<void> {
	await fetch(`${base}/healthz`, { method: 'POST' });
}

/** A session made straight in the database (as lucia would: 25 random bytes, stored as SHA-256). */
export async function sessionClient(base: string, userId: string): Promise<Client> {
	const id = base32(randomBytes(25));
	await testDb()
		.insertInto('sessions')
		.values({
			id_hash: createHash('sha256').update(id).digest('hex'),
			user_id: userId,
			expires_at: new Date(Date.now() + 24 * 3600 * 1000)
		})
		.execute();
	const c = new Client(base);
	c.session = id;
	return c;
}
