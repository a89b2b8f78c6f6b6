// Invitations and password resets by e-mail: the mail reaches a fake SMTP server, its link works
// once, never again, and not after it expires.
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type RunningApp } from './app-server';
import {
	Client,
	PASSWORD,
	memberAdd,
	sessionClient,
	signIn,
	studioMake,
	testDb,
	testDbClose,
	throttleAddressReset,
	uniq,
	userMake
} from './helpers';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const NEW_PASSWORD = 'a-new-toile-every-week';

let app: RunningApp;
beforeAll(async () => {
	await throttleAddressReset();
	app = await startApp();
});
afterAll(async () => {
	await app?.close();
	await testDbClose();
});

/** The path of the link in a mail, checked to point at this app. */
function linkPath(links: string[], prefix: string): string {
	const link = links.find((l) => l.startsWith(`${app.baseUrl}${prefix}`));
	expect(link, `a ${prefix} link in ${links.join(', ')}`).toBeDefined();
	return link!.slice(app.baseUrl.length);
}

async function ownerWithStudio() {
	const owner = await userMake('owner');
	const studio = await studioMake('Invites');
	await memberAdd(studio.id, owner.id, 'owner');
	return { owner, studio, client: await sessionClient(app.baseUrl, owner.id) };
}

describe('invitations', () => {
	it('a newcomer signs up through the link, once; the token is stored hashed', async () => {
		const { studio, client } = await ownerWithStudio();
		const email = `Newcomer-${uniq()}@Example.test`;
		const r = await client.api('POST', `/api/studios/${studio.id}/invitations`, { email, role: 'designer' });
		expect(r.status).toBe(201);
		const { invitation } = await r.json();
		expect(invitation.email).toBe(email.toLowerCase());
		expect(new Date(invitation.expiresAt).getTime() - Date.now()).toBeGreaterThan(6.9 * 24 * 3600 * 1000);

		const mail = await app.mailbox.waitFor(email);
		expect(mail.subject).toContain(studio.name);
		const path = linkPath(mail.links, '/invite/');
		const token = path.split('/').pop()!;
		const row = await testDb().selectFrom('invitations').select('token_hash').where('id', '=', invitation.id).executeTakeFirstOrThrow();
		expect(row.token_hash).toBe(sha256(token));

		const guest = new Client(app.baseUrl);
		const page = await guest.get(path);
		expect(page.status).toBe(200);
		expect(await page.text()).toContain(studio.name);
		const join = await guest.post(`${path}?/signup`, { name: 'Nell Newcomer', password: PASSWORD });
		expect(join.status).toBe(303);
		expect(join.headers.get('location')).toBe(`/studios/${studio.id}`);
		const me = await (await guest.api('GET', '/api/me')).json();
		expect(me.memberships).toEqual([{ studioId: studio.id, studioName: studio.name, role: 'designer' }]);

		// never again
		expect((await new Client(app.baseUrl).get(path)).status).toBe(404);
		const again = await new Client(app.baseUrl).post(`${path}?/signup`, { name: 'Someone', password: PASSWORD });
		expect(again.status).toBe(404);
		const members = await (await client.api('GET', `/api/studios/${studio.id}/members`)).json();
		expect(members.members).toHaveLength(2);
	});

	it('the invitation e-mail and the invitation page name the role in words ("pattern cutter", "sample room")', async () => {
		const { studio, client } = await ownerWithStudio();
		for (const [role, words] of [['patterncutter', 'pattern cutter'], ['sampleroom', 'sample room']] as const) {
			const email = `role-words-${role}-${uniq()}@example.test`;
			expect((await client.api('POST', `/api/studios/${studio.id}/invitations`, { email, role })).status).toBe(201);
			const mail = await app.mailbox.waitFor(email);
			expect(mail.text).toContain(`as ${words}.`);
			expect(mail.html).toContain(`as ${words}.`);
			expect(`${mail.text}${mail.html}`).not.toContain(role);
			const page = await (await new Client(app.baseUrl).get(linkPath(mail.links, '/invite/'))).text();
			expect(page).toContain(`>${words}</span>`);
			expect(page).not.toMatch(new RegExp(`>${role}<`));
		}
	});

	it('someone with an account joins when signed in with the invited address', async () => {
		const { studio, client } = await ownerWithStudio();
		const invitee = await userMake('invitee');
		const elsewhere = await studioMake('Home');
		await memberAdd(elsewhere.id, invitee.id, 'owner');
		expect((await client.api('POST', `/api/studios/${studio.id}/invitations`, { email: invitee.email, role: 'sampleroom' })).status).toBe(201);
		const path = linkPath((await app.mailbox.waitFor(invitee.email)).links, '/invite/');

		// signing up with that address is refused: it has an account
		const anon = new Client(app.baseUrl);
		expect(await (await anon.get(path)).text()).toContain('Sign in to join');
		const dup = await anon.post(`${path}?/signup`, { name: 'Dup', password: PASSWORD });
		expect(dup.status).toBe(409);
		// someone else signed in cannot use it
		const stranger = await sessionClient(app.baseUrl, (await userMake('stranger')).id);
		expect((await stranger.post(`${path}?/join`, {})).status).toBe(403);
		// joining needs a session
		const signedOut = await anon.post(`${path}?/join`, {});
		expect(signedOut.status).toBe(303);
		expect(signedOut.headers.get('location')).toMatch(/^\/signin\?next=/);

		const c = new Client(app.baseUrl);
		expect((await signIn(c, invitee.email)).status).toBe(303);
		const joined = await c.post(`${path}?/join`, {});
		expect(joined.status).toBe(303);
		expect(joined.headers.get('location')).toBe(`/studios/${studio.id}`);
		const me = await (await c.api('GET', '/api/me')).json();
		expect(me.memberships.map((m: { studioId: string; role: string }) => [m.studioId, m.role]).sort()).toEqual(
			[[elsewhere.id, 'owner'], [studio.id, 'sampleroom']].sort()
		);
		expect((await c.post(`${path}?/join`, {})).status).toBe(404); // used
	});

	it('an expired link does not work', async () => {
		const { studio, client } = await ownerWithStudio();
		const email = `late-${uniq()}@example.test`;
		const r = await client.api('POST', `/api/studios/${studio.id}/invitations`, { email, role: 'patterncutter' });
		const { invitation } = await r.json();
		const path = linkPath((await app.mailbox.waitFor(email)).links, '/invite/');
		await testDb().updateTable('invitations').set({ expires_at: new Date(Date.now() - 1000) }).where('id', '=', invitation.id).execute();
		expect((await new Client(app.baseUrl).get(path)).status).toBe(404);
		const late = new Client(app.baseUrl);
		expect((await late.post(`${path}?/signup`, { name: 'Late', password: PASSWORD })).status).toBe(404);
		expect(late.session).toBeNull();
		expect(await testDb().selectFrom('users').select('id').where('email', '=', email).executeTakeFirst()).toBeUndefined();
	});

	it('refuses to invite a member again (409) and checks the body (400)', async () => {
		const { owner, studio, client } = await ownerWithStudio();
		const dup = await client.api('POST', `/api/studios/${studio.id}/invitations`, { email: owner.email, role: 'designer' });
		expect(dup.status).toBe(409);
		expect((await dup.json()).error.code).toBe('already_member');
		const bad = await client.api('POST', `/api/studios/${studio.id}/invitations`, { email: 'nope', role: 'boss' });
		expect(bad.status).toBe(400);
		const { error } = await bad.json();
		expect(Object.keys(error.fields).sort()).toEqual(['email', 'role']);
	});
});

describe('password reset', () => {
	it('the link sets a new password once and ends the other sessions', async () => {
		const u = await userMake('forgetful');
		const other = await sessionClient(app.baseUrl, u.id);
		expect((await other.api('GET', '/api/me')).status).toBe(200);

		const asker = new Client(app.baseUrl);
		const ask = await asker.post('/reset', { email: u.email.toUpperCase() });
		expect(ask.status).toBe(200);
		expect(await ask.text()).toContain('a link is on its way');
		const path = linkPath((await app.mailbox.waitFor(u.email)).links, '/reset/');

		expect((await asker.get(path)).status).toBe(200);
		const mismatch = await asker.post(path, { password: NEW_PASSWORD, confirm: 'something else' });
		expect(mismatch.status).toBe(400);
		const done = await asker.post(path, { password: NEW_PASSWORD, confirm: NEW_PASSWORD });
		expect(done.status).toBe(303);
		expect(asker.session).toBeTruthy();
		expect((await asker.api('GET', '/api/me')).status).toBe(200);
		expect((await other.api('GET', '/api/me')).status).toBe(401); // other sessions ended

		expect((await signIn(new Client(app.baseUrl), u.email, PASSWORD)).status).toBe(400);
		expect((await signIn(new Client(app.baseUrl), u.email, NEW_PASSWORD)).status).toBe(303);

		// never again
		expect((await new Client(app.baseUrl).get(path)).status).toBe(404);
		const replay = await new Client(app.baseUrl).post(path, { password: 'yet-another-one-99', confirm: 'yet-another-one-99' });
		expect(replay.status).toBe(404);
		expect((await signIn(new Client(app.baseUrl), u.email, NEW_PASSWORD)).status).toBe(303);
	});

	it('an expired link does not work; unknown addresses get the same answer and no mail', async () => {
		const u = await userMake('slow');
		await new Client(app.baseUrl).post('/reset', { email: u.email });
		const path = linkPath((await app.mailbox.waitFor(u.email)).links, '/reset/');
		await testDb()
			.updateTable('password_resets')
			.set({ expires_at: new Date(Date.now() - 1000) })
			.where('token_hash', '=', sha256(path.split('/').pop()!))
			.execute();
		expect((await new Client(app.baseUrl).get(path)).status).toBe(404);
		expect((await new Client(app.baseUrl).post(path, { password: NEW_PASSWORD, confirm: NEW_PASSWORD })).status).toBe(404);
		expect((await signIn(new Client(app.baseUrl), u.email, PASSWORD)).status).toBe(303);

		const nobody = `nobody-${uniq()}@example.test`;
		const r = await new Client(app.baseUrl).post('/reset', { email: nobody });
		expect(r.status).toBe(200);
		expect(await r.text()).toContain('a link is on its way');
		await expect(app.mailbox.waitFor(nobody, 500)).rejects.toThrow();
	});

	it('a reset link lives one hour', async () => {
		const u = await userMake('hour');
		await new Client(app.baseUrl).post('/reset', { email: u.email });
		const path = linkPath((await app.mailbox.waitFor(u.email)).links, '/reset/');
		const row = await testDb()
			.selectFrom('password_resets')
			.select(['expires_at', 'created_at'])
			.where('token_hash', '=', sha256(path.split('/').pop()!))
			.executeTakeFirstOrThrow();
		const ms = row.expires_at.getTime() - Date.now();
		expect(ms).toBeGreaterThan(59 * 60 * 1000);
		expect(ms).toBeLessThanOrEqual(60 * 60 * 1000);
	});
});
