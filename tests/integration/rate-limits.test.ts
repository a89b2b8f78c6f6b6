// Rate limits on password-reset requests, sign-ups, invitations and uploads, counted in PostgreSQL:
// past each allowance the app answers 429 with Retry-After and a message a person can act on, stores
// nothing, and every limiter on the same database (another app process, this test's own) shares the count.
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import { poolCreate } from '../../src/lib/server/db/index';
import { RATE_LIMITS, rateLimiterCreate, rateLimitPoints, type RateLimitName } from '../../src/lib/server/rate-limits';
import { appProcessStart } from './app-process';
import { startApp, type RunningApp } from './app-server';
import { fittingWorld, storageEnvUse, upload, type FittingWorld } from './fittings-support';
import { Client, memberAdd, PASSWORD, sessionClient, studioMake, studioOnStudioPlan, testDb, testDbClose, uniq, userMake } from './helpers';

let app: RunningApp;
let w: FittingWorld;
const pool = poolCreate(inject('databaseUrl'), 2, 'rate limits test');

beforeAll(async () => {
	storageEnvUse();
	app = await startApp();
	w = await fittingWorld(app.baseUrl, 'Limits');
});

afterAll(async () => {
	await app?.close();
	await pool.end();
	await testDbClose();
});

beforeEach(async () => {
	await sql`delete from rate_limits`.execute(testDb());
});

/** Uses up what is left of an allowance from this process, as another app process would. */
async function useUp(name: RateLimitName, key: string, already = 0): Promise<void> {
	await rateLimiterCreate(name, pool).consume(key, rateLimitPoints(name) - already);
}

/** The key the app counted a client address under (whatever form 127.0.0.1 took). */
async function addressKey(name: RateLimitName): Promise<string> {
	const rows = await sql<{ key: string }>`select key from rate_limits where key like ${name + ':%'}`.execute(testDb());
	expect(rows.rows).toHaveLength(1);
	return rows.rows[0].key.slice(name.length + 1);
}

function expectRetryAfter(r: Response, maxS = 3600): number {
	const s = Number(r.headers.get('retry-after'));
	expect(Number.isInteger(s)).toBe(true);
	expect(s).toBeGreaterThan(0);
	expect(s).toBeLessThanOrEqual(maxS);
	return s;
}

describe('password-reset requests', () => {
	it('allow three an hour for one e-mail address, then 429 with Retry-After on the form, for an unknown address the same', async () => {
		for (const email of [(await userMake('reset')).email, `nobody-${uniq()}@example.test`]) {
			for (let i = 0; i < RATE_LIMITS.reset_email.points; i++) {
				expect((await new Client(app.baseUrl).post('/reset', { email })).status).toBe(200);
			}
			const r = await new Client(app.baseUrl).post('/reset', { email });
			expect(r.status).toBe(429);
			expectRetryAfter(r);
			expect(await r.text()).toMatch(/Too many password-reset requests for this e-mail address: 3 are allowed in an hour\. Try again in \d+ minutes/);
		}
	});

	it('allow twenty an hour from one client address, whatever the e-mail addresses', async () => {
		expect((await new Client(app.baseUrl).post('/reset', { email: `a-${uniq()}@example.test` })).status).toBe(200);
		await useUp('reset_address', await addressKey('reset_address'), 1);
		const r = await new Client(app.baseUrl).post('/reset', { email: `b-${uniq()}@example.test` });
		expect(r.status).toBe(429);
		expectRetryAfter(r);
		expect(await r.text()).toContain('Too many password-reset requests from your network address');
	});

	it('are counted together by a second app process on the same database', async () => {
		const other = await appProcessStart(inject('databaseUrl'));
		try {
			const email = `shared-${uniq()}@example.test`; // no account: no mail to send, in either process
			expect((await new Client(app.baseUrl).post('/reset', { email })).status).toBe(200);
			expect((await new Client(other.baseUrl).post('/reset', { email })).status).toBe(200);
			expect((await new Client(app.baseUrl).post('/reset', { email })).status).toBe(200);
			const r = await new Client(other.baseUrl).post('/reset', { email });
			expect(r.status, other.output()).toBe(429);
			expectRetryAfter(r);
		} finally {
			await other.stop();
		}
	});
});

describe('sign-ups', () => {
	it('allow twenty an hour from one client address, then 429 with Retry-After and no account made', async () => {
		const form = () => ({ name: 'Ada Cutter', email: `signup-${uniq()}@example.test`, password: PASSWORD, studioName: 'Bias & Grain' });
		expect((await new Client(app.baseUrl).post('/signup', form())).status).toBe(303);
		await useUp('signup_address', await addressKey('signup_address'), 1);
		const refused = form();
		const r = await new Client(app.baseUrl).post('/signup', refused);
		expect(r.status).toBe(429);
		expectRetryAfter(r);
		expect(await r.text()).toContain('Too many sign-ups from your network address: 20 are allowed in an hour.');
		expect(await testDb().selectFrom('users').select('id').where('email', '=', refused.email).executeTakeFirst()).toBeUndefined();
	});
});

describe('invitations', () => {
	it('allow thirty an hour from one studio, then 429 in JSON with Retry-After and no invitation stored', async () => {
		const studio = await studioMake('Inviting');
		await studioOnStudioPlan(studio.id, 100);
		const owner = await userMake('owner');
		await memberAdd(studio.id, owner.id, 'owner');
		const c = await sessionClient(app.baseUrl, owner.id);
		const path = `/api/studios/${studio.id}/invitations`;
		for (let i = 0; i < RATE_LIMITS.invite_studio.points; i++) {
			expect((await c.api('POST', path, { email: `guest-${i}-${uniq()}@example.test`, role: 'designer' })).status).toBe(201);
		}
		const refused = `late-${uniq()}@example.test`;
		const r = await c.api('POST', path, { email: refused, role: 'designer' });
		expect(r.status).toBe(429);
		expectRetryAfter(r);
		const body = await r.json();
		expect(body.error.code).toBe('rate_limited');
		expect(body.error.message).toMatch(/^Too many invitations sent from this studio: 30 are allowed in an hour\. Try again in \d+ (minutes|seconds) \(after \d\d:\d\d UTC\)\.$/);
		expect(await testDb().selectFrom('invitations').select('id').where('email', '=', refused).executeTakeFirst()).toBeUndefined();
		// another studio's owner is not held back
		const elsewhere = await studioMake('Elsewhere');
		const otherOwner = await userMake('owner');
		await memberAdd(elsewhere.id, otherOwner.id, 'owner');
		const o = await sessionClient(app.baseUrl, otherOwner.id);
		expect((await o.api('POST', `/api/studios/${elsewhere.id}/invitations`, { email: refused, role: 'designer' })).status).toBe(201);
	});
});

describe('uploads', () => {
	async function fittingMake(): Promise<string> {
		const r = await w.as.sampleroom.api('POST', `/api/studios/${w.studioId}/styles/${w.styleId}/fittings`, {
			fittedOn: '2026-12-02',
			title: 'Toile fitting',
			fitModel: 'Fit model A',
			versionIds: [w.v1]
		});
		expect(r.status).toBe(201);
		return (await r.json()).fitting.id;
	}

	it('allow two hundred fitting photos an hour per person, then 429 with Retry-After, the body read to its end and nothing stored', async () => {
		const fittingId = await fittingMake();
		await useUp('photo_user', w.users.sampleroom.id);
		// 2 MB still on its way when the refusal is decided: the client gets the 429, not a broken connection
		const r = await upload(w.as.sampleroom, `/api/studios/${w.studioId}/fittings/${fittingId}/photos`, randomBytes(2 * 1024 * 1024), 'toile.jpg', 'image/jpeg');
		expect(r.status).toBe(429);
		expectRetryAfter(r);
		expect((await r.json()).error.message).toMatch(/^Too many photo uploads from your account: 200 are allowed in an hour\./);
		const stored = await testDb().selectFrom('fitting_photos').select('id').where('fitting_id', '=', fittingId).execute();
		expect(stored).toEqual([]);
		// the owner, counted apart, still uploads (and is refused only for what the bytes are)
		const owner = await upload(w.as.owner, `/api/studios/${w.studioId}/fittings/${fittingId}/photos`, randomBytes(64), 'noise.jpg', 'image/jpeg');
		expect(owner.status).toBe(415);
	});

	it('allow sixty imports (or previews) an hour per person, then 429 with Retry-After and no piece stored', async () => {
		const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="10cm" height="10cm" viewBox="0 0 100 100"><path d="M0 0 H100 V100 H0 Z"/></svg>';
		const path = `/api/studios/${w.studioId}/styles/${w.styleId}/imports`;
		expect((await upload(w.as.patterncutter, `${path}?preview=1`, new TextEncoder().encode(svg), 'square.svg')).status).toBe(200);
		await useUp('import_user', w.users.patterncutter.id, 1);
		const before = await testDb().selectFrom('pieces').select('id').where('style_id', '=', w.styleId).execute();
		const r = await upload(w.as.patterncutter, path, new TextEncoder().encode(svg), 'square.svg');
		expect(r.status).toBe(429);
		expectRetryAfter(r);
		expect((await r.json()).error.message).toMatch(/^Too many file imports from your account: 60 are allowed in an hour\./);
		const after = await testDb().selectFrom('pieces').select('id').where('style_id', '=', w.styleId).execute();
		expect(after).toHaveLength(before.length);
	});
});

describe('the store', () => {
	it('is shared: two limiters on two pools of the same database count one allowance', async () => {
		const otherPool = poolCreate(inject('databaseUrl'), 1, 'rate limits test 2');
		try {
			const a = rateLimiterCreate('reset_email', pool);
			const b = rateLimiterCreate('reset_email', otherPool);
			const key = `two-${uniq()}@example.test`;
			await a.consume(key);
			await b.consume(key);
			const third = await a.consume(key);
			expect(third.remainingPoints).toBe(0);
			await expect(b.consume(key)).rejects.toMatchObject({ remainingPoints: 0 });
			expect((await a.get(key))?.consumedPoints).toBe(4);
		} finally {
			await otherPool.end();
		}
	});
});
