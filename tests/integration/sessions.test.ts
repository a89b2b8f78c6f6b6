// Sessions, sign-in, sign-out, throttling, cross-site form posts and security headers, over HTTP
// against the built app.
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApp, type RunningApp } from './app-server';
import {
	Client,
	appHeardChanges,
	PASSWORD,
	SESSION_COOKIE,
	memberAdd,
	signIn,
	signedInClient,
	studioMake,
	testDb,
	testDbClose,
	throttleAddressReset,
	uniq,
	userMake
} from './helpers';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

let app: RunningApp;
beforeAll(async () => {
	await throttleAddressReset();
	app = await startApp();
});
afterAll(async () => {
	await app?.close();
	await throttleAddressReset();
	await testDbClose();
});

async function sessionRow(id: string) {
	return testDb().selectFrom('sessions').selectAll().where('id_hash', '=', sha256(id)).executeTakeFirst();
}

describe('sign-up', () => {
	it('creates a user, a studio with the user as owner, and signs in', async () => {
		const c = new Client(app.baseUrl);
		const email = `new-${uniq()}@example.test`;
		const r = await c.post('/signup', { name: 'Ada Cutter', email, password: PASSWORD, studioName: 'Bias & Grain' });
		expect(r.status).toBe(303);
		const location = r.headers.get('location')!;
		expect(location).toMatch(/^\/studios\/[0-9a-f-]{36}$/);
		expect(c.session).toBeTruthy();
		const me = await c.api('GET', '/api/me');
		expect(me.status).toBe(200);
		const body = await me.json();
		expect(body.user.email).toBe(email);
		expect(body.memberships).toEqual([
			{ studioId: location.split('/')[2], studioName: 'Bias & Grain', role: 'owner' }
		]);
		const user = await testDb().selectFrom('users').select('password_hash').where('email', '=', email).executeTakeFirstOrThrow();
		expect(user.password_hash).toMatch(/^\$argon2id\$/);
	});

	it('answers 400 with field errors and 409 for a taken e-mail', async () => {
		const c = new Client(app.baseUrl);
		const bad = await c.post('/signup', { name: '', email: 'nope', password: 'short', studioName: '' });
		expect(bad.status).toBe(400);
		const html = await bad.text();
		expect(html).toContain('Enter an e-mail address');
		expect(html).toContain('at least 10 characters');
		const u = await userMake('taken');
		const taken = await c.post('/signup', { name: 'X', email: u.email, password: PASSWORD, studioName: 'S' });
		expect(taken.status).toBe(409);
		expect(c.session).toBeNull();
	});
});

describe('sessions', () => {
	it('issues a new token at each sign-in and stores only its SHA-256', async () => {
		const u = await userMake('tok');
		const c = new Client(app.baseUrl);
		expect((await signIn(c, u.email)).status).toBe(303);
		const first = c.session!;
		expect(first).toMatch(/^[a-z2-7]{40}$/);
		expect(await sessionRow(first)).toBeTruthy();
		const raw = await testDb().selectFrom('sessions').select('id_hash').where('id_hash', '=', first).executeTakeFirst();
		expect(raw).toBeUndefined(); // the raw id is never stored

		expect((await signIn(c, u.email)).status).toBe(303);
		const second = c.session!;
		expect(second).not.toBe(first);
		expect(await sessionRow(first)).toBeUndefined(); // the earlier token of this browser is ended
		expect(await sessionRow(second)).toBeTruthy();
	});

	it('sets HttpOnly, SameSite=Lax, and no Secure on plain-http 127.0.0.1 (Secure elsewhere: unit test)', async () => {
		const u = await userMake('cookie');
		const c = new Client(app.baseUrl);
		await signIn(c, u.email);
		const set = c.lastSetCookies.find((s) => s.startsWith(`${SESSION_COOKIE}=`))!;
		expect(set).toMatch(/HttpOnly/i);
		expect(set).toMatch(/SameSite=Lax/i);
		expect(set).toMatch(/Path=\//);
		expect(set).not.toMatch(/Secure/i);
	});

	it('sign-out deletes the session on the server', async () => {
		const u = await userMake('out');
		const c = await signedInClient(app.baseUrl, u);
		const token = c.session!;
		const r = await c.post('/signout', {});
		expect(r.status).toBe(303);
		expect(c.session).toBeNull();
		expect(await sessionRow(token)).toBeUndefined();
		// replaying the old cookie gets nowhere
		const replay = new Client(app.baseUrl);
		replay.session = token;
		expect((await replay.api('GET', '/api/me')).status).toBe(401);
	});

	it('refuses an expired session and clears the cookie', async () => {
		const u = await userMake('exp');
		const c = await signedInClient(app.baseUrl, u);
		expect((await c.api('GET', '/api/me')).status).toBe(200);
		await testDb()
			.updateTable('sessions')
			.set({ expires_at: new Date(Date.now() - 60_000) })
			.where('id_hash', '=', sha256(c.session!))
			.execute();
		await appHeardChanges(app.baseUrl);
		const token = c.session!;
		const r = await c.api('GET', '/api/me');
		expect(r.status).toBe(401);
		expect(c.session).toBeNull(); // the response cleared it
		expect(await sessionRow(token)).toBeUndefined();
	});

	it('ignores a forged cookie', async () => {
		const c = new Client(app.baseUrl);
		c.session = 'a'.repeat(40);
		expect((await c.api('GET', '/api/me')).status).toBe(401);
		c.session = '<script>';
		expect((await c.api('GET', '/api/me')).status).toBe(401);
		// a real session's hash used as the cookie is not a session either
		const u = await userMake('forge');
		const real = await signedInClient(app.baseUrl, u);
		c.session = sha256(real.session!);
		expect((await c.api('GET', '/api/me')).status).toBe(401);
	});

	it('sends a signed-out visitor of a studio page to sign-in, and back after', async () => {
		const u = await userMake('next');
		const s = await studioMake();
		await memberAdd(s.id, u.id, 'designer');
		const anon = new Client(app.baseUrl);
		const r = await anon.get(`/studios/${s.id}/members`);
		expect(r.status).toBe(303);
		expect(r.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(`/studios/${s.id}/members`)}`);
		const signin = await anon.request('POST', '/signin', {
			form: { email: u.email, password: PASSWORD, next: `/studios/${s.id}/members` }
		});
		expect(signin.headers.get('location')).toBe(`/studios/${s.id}/members`);
		const evil = await new Client(app.baseUrl).post('/signin', { email: u.email, password: PASSWORD, next: '//evil.example/' });
		expect(evil.headers.get('location')).toBe(`/studios/${s.id}`);
	});
});

describe('sign-in throttling', () => {
	it('gives the same answer for an unknown e-mail and a wrong password', async () => {
		const u = await userMake('same');
		const a = await new Client(app.baseUrl).post('/signin', { email: u.email, password: 'wrong-password-1' });
		const b = await new Client(app.baseUrl).post('/signin', { email: `nobody-${uniq()}@example.test`, password: 'x' });
		expect(a.status).toBe(400);
		expect(b.status).toBe(400);
		const msg = 'That e-mail and password do not match an account.';
		expect(await a.text()).toContain(msg);
		expect(await b.text()).toContain(msg);
	});

	it('answers 429 with when to try again after repeated failures for one e-mail', async () => {
		const u = await userMake('throttle');
		const c = new Client(app.baseUrl);
		for (let i = 0; i < 5; i++) expect((await c.post('/signin', { email: u.email, password: `wrong-${i}` })).status).toBe(400);
		const r = await c.post('/signin', { email: u.email, password: PASSWORD }); // even the right one
		expect(r.status).toBe(429);
		expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(0);
		expect(await r.text()).toMatch(/Too many failed sign-ins\. Try again in \d+ (minutes|seconds) \(after \d\d:\d\d UTC\)\./);
		expect(c.session).toBeNull();
		// the block is per e-mail: someone else signs in fine from the same address
		const other = await userMake('other');
		expect((await signIn(new Client(app.baseUrl), other.email)).status).toBe(303);
	});

	it('answers 429 after repeated failures from one address, whatever the e-mail', async () => {
		await throttleAddressReset();
		const c = new Client(app.baseUrl);
		let last = 0;
		for (let i = 0; i < 31 && last !== 429; i++) {
			last = (await c.post('/signin', { email: `spray-${i}-${uniq()}@example.test`, password: 'guess' })).status;
		}
		expect(last).toBe(429);
		const u = await userMake('blocked');
		const r = await signIn(c, u.email);
		expect(r.status).toBe(429);
		expect(await r.text()).toContain('Try again in');
		await throttleAddressReset();
		expect((await signIn(c, u.email)).status).toBe(303);
	});
});

describe('cross-site requests', () => {
	it('refuses a form POST with a foreign Origin (403)', async () => {
		const u = await userMake('csrf');
		const c = new Client(app.baseUrl);
		const r = await c.request('POST', '/signin', {
			form: { email: u.email, password: PASSWORD },
			origin: 'https://evil.example'
		});
		expect(r.status).toBe(403);
		expect(c.session).toBeNull();
		const signedIn = await signedInClient(app.baseUrl, u);
		const out = await signedIn.request('POST', '/signout', { form: {}, origin: 'https://evil.example' });
		expect(out.status).toBe(403);
		expect((await signedIn.api('GET', '/api/me')).status).toBe(200);
	});

	it('refuses a JSON API write with a foreign Origin (403)', async () => {
		const u = await userMake('csrf-api');
		const c = await signedInClient(app.baseUrl, u);
		const r = await c.request('POST', '/api/studios', { json: { name: 'Evil' }, origin: 'https://evil.example' });
		expect(r.status).toBe(403);
		expect((await r.json()).error.code).toBe('forbidden');
	});
});

describe('security headers', () => {
	it('sends a CSP whose nonce is on every inline script of the page', async () => {
		const r = await new Client(app.baseUrl).get('/signin');
		expect(r.status).toBe(200);
		const csp = r.headers.get('content-security-policy')!;
		expect(csp).toContain("default-src 'self'");
		expect(csp).toContain("frame-ancestors 'none'");
		expect(csp).toContain("img-src 'self' data: blob:");
		const nonce = csp.match(/'nonce-([^']+)'/)![1];
		const html = await r.text();
		const scripts = html.match(/<script\b[^>]*>/g) ?? [];
		expect(scripts.length).toBeGreaterThan(0);
		for (const s of scripts) {
			if (/\bsrc=/.test(s)) continue;
			expect(s).toContain(`nonce="${nonce}"`);
		}
		expect(r.headers.get('x-content-type-options')).toBe('nosniff');
		expect(r.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
		// a fresh nonce each time
		const again = (await new Client(app.baseUrl).get('/signin')).headers.get('content-security-policy')!;
		expect(again).not.toBe(csp);
	});

	it('adds the object store origin to the img-src of a rendered page, for fitting photos', async () => {
		const r = await new Client(app.baseUrl).get('/signin');
		const imgSrc = r.headers.get('content-security-policy')!.split(';').map((d) => d.trim()).find((d) => d.startsWith('img-src'))!;
		expect(imgSrc.split(' ')).toContain(new URL(inject('s3Endpoint')).origin);
	});

	it('gives every answer a request id, keeping a plain one a proxy sent and replacing one that is not', async () => {
		const page = await new Client(app.baseUrl).get('/signin');
		const api = await new Client(app.baseUrl).api('GET', '/api/me');
		const ids = [page.headers.get('x-request-id'), api.headers.get('x-request-id')];
		for (const id of ids) expect(id).toMatch(/^[0-9a-f-]{36}$/);
		expect(ids[0]).not.toBe(ids[1]);
		const kept = await new Client(app.baseUrl).get('/signin', { 'x-request-id': 'lb-7f3a9c21.0042' });
		expect(kept.headers.get('x-request-id')).toBe('lb-7f3a9c21.0042');
		const replaced = await new Client(app.baseUrl).get('/signin', { 'x-request-id': 'a b<script>' });
		expect(replaced.headers.get('x-request-id')).toMatch(/^[0-9a-f-]{36}$/);
	});

	it('sends the headers on API answers too', async () => {
		const r = await new Client(app.baseUrl).api('GET', '/api/me');
		expect(r.headers.get('content-security-policy')).toBe("default-src 'none'; frame-ancestors 'none'");
		expect(r.headers.get('x-content-type-options')).toBe('nosniff');
	});
});
