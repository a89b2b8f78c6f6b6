// A person's own account: the download of their data (theirs only), and deleting the account (confirmed
// by e-mail and password; refused for a studio's last owner; their work stays, by "former member";
// every session ends; the address is free again).
import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { startApp, type RunningApp } from './app-server';
import { Client, memberAdd, PASSWORD, sessionClient, studioMake, studioOnStudioPlan, testDb, testDbClose, throttleAddressReset, userMake } from './helpers';

let app: RunningApp;
beforeAll(async () => {
	app = await startApp();
});
afterAll(async () => {
	await app?.close();
	await testDbClose();
});
beforeEach(async () => {
	await throttleAddressReset();
	await sql`delete from rate_limits`.execute(testDb());
});

/** A studio with an owner and a pattern cutter who has made a style, a piece (version 1) and a comment. */
async function studioWithWork() {
	const studio = await studioMake('Account');
	await studioOnStudioPlan(studio.id);
	const owner = await userMake('owner');
	const cutter = await userMake('cutter');
	await memberAdd(studio.id, owner.id, 'owner');
	await memberAdd(studio.id, cutter.id, 'patterncutter');
	const asOwner = await sessionClient(app.baseUrl, owner.id);
	const asCutter = await sessionClient(app.baseUrl, cutter.id);
	const s = await asCutter.api('POST', `/api/studios/${studio.id}/styles`, { name: 'Juniper bodice', code: 'LR-401' });
	const styleId = (await s.json()).style.id as string;
	const p = await asCutter.api('POST', `/api/studios/${studio.id}/styles/${styleId}/pieces`, {
		name: 'Front bodice',
		geometry: frontBodiceBlock(),
		origin: { op: 'draft', params: { note: 'block' } }
	});
	expect(p.status).toBe(201);
	const created = await p.json();
	const pieceId = created.piece.id as string;
	const versionId = created.version.id as string;
	const comments = `/api/studios/${studio.id}/pieces/${pieceId}/versions/${versionId}/comments`;
	expect((await asCutter.api('POST', comments, { body: 'Bust dart moved 1 cm toward the side seam.' })).status).toBe(201);
	expect((await asOwner.api('POST', comments, { body: 'The owner writes this: not the cutter\'s data.' })).status).toBe(201);
	return { studio, owner, cutter, asOwner, asCutter, styleId, pieceId, versionId, comments };
}

describe('downloading one\'s own data', () => {
	it('gives a JSON file of the profile, memberships and authored work, with nothing of other people', async () => {
		const w = await studioWithWork();
		const r = await w.asCutter.get('/api/me/export');
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toContain('application/json');
		expect(r.headers.get('content-disposition')).toMatch(/^attachment; filename="dartelier-my-data-\d{4}-\d\d-\d\d\.json"$/);
		const text = await r.text();
		const data = JSON.parse(text);
		expect(data.profile).toMatchObject({ id: w.cutter.id, email: w.cutter.email, name: w.cutter.name });
		expect(data.memberships).toEqual([expect.objectContaining({ studioId: w.studio.id, role: 'patterncutter' })]);
		expect(data.authored.versions).toEqual([expect.objectContaining({ id: w.versionId, pieceId: w.pieceId, styleId: w.styleId, number: 1 })]);
		expect(data.authored.styles.map((s: { id: string }) => s.id)).toEqual([w.styleId]);
		expect(data.authored.comments.map((c: { body: string }) => c.body)).toEqual(['Bust dart moved 1 cm toward the side seam.']);
		expect(data.sessions.length).toBeGreaterThan(0);
		// nothing of the owner's, no session ids, no password hash, no geometry
		expect(text).not.toContain(w.owner.email);
		expect(text).not.toContain('The owner writes this');
		expect(text).not.toMatch(/password|argon|geometry|id_hash/i);
		expect((await new Client(app.baseUrl).api('GET', '/api/me/export')).status).toBe(401);
	});
});

describe('deleting one\'s account', () => {
	it('refuses a body without the confirmation (400), the wrong address (400) and a wrong password (403), deleting nothing', async () => {
		const w = await studioWithWork();
		const empty = await w.asCutter.api('DELETE', '/api/me', {});
		expect(empty.status).toBe(400);
		expect((await empty.json()).error.fields).toMatchObject({ email: ['Type your e-mail address to confirm.'], password: ['Type your password to confirm.'] });
		const other = await w.asCutter.api('DELETE', '/api/me', { email: w.owner.email, password: PASSWORD });
		expect(other.status).toBe(400);
		expect((await other.json()).error.fields.email[0]).toBe(`Type your own e-mail address, ${w.cutter.email}, to confirm.`);
		const wrong = await w.asCutter.api('DELETE', '/api/me', { email: w.cutter.email, password: 'not-the-password' });
		expect(wrong.status).toBe(403);
		expect((await wrong.json()).error).toMatchObject({ code: 'wrong_password', message: 'That password is not right. Nothing was deleted.' });
		expect((await w.asCutter.api('GET', '/api/me')).status).toBe(200);
	});

	it('refuses the last owner of a studio (409, naming it), and lets them go once another member is owner', async () => {
		const w = await studioWithWork();
		const r = await w.asOwner.api('DELETE', '/api/me', { email: w.owner.email, password: PASSWORD });
		expect(r.status).toBe(409);
		const err = (await r.json()).error;
		expect(err.code).toBe('last_owner');
		expect(err.message).toContain(`You are the last owner of "${w.studio.name}"`);
		expect((await w.asOwner.api('GET', '/api/me')).status).toBe(200);
		expect((await w.asOwner.api('PATCH', `/api/studios/${w.studio.id}/members/${w.cutter.id}`, { role: 'owner' })).status).toBe(200);
		expect((await w.asOwner.api('DELETE', '/api/me', { email: w.owner.email, password: PASSWORD })).status).toBe(204);
	});

	it('refuses the last owner of a studio with other members (409): make another member owner first, nothing deleted', async () => {
		const w = await studioWithWork();
		const r = await w.asOwner.api('DELETE', '/api/me', { email: w.owner.email, password: PASSWORD });
		expect(r.status).toBe(409);
		expect((await r.json()).error).toEqual({
			code: 'last_owner',
			message: `You are the last owner of "${w.studio.name}", and a studio needs an owner. Make another member owner first (on its Members page), then delete your account. Nothing was deleted.`
		});
		expect(await testDb().selectFrom('memberships').select('role').where('studio_id', '=', w.studio.id).where('user_id', '=', w.owner.id).executeTakeFirst()).toEqual({ role: 'owner' });
	});

	it('refuses the only member of a studio (409) saying the studio is not deleted and someone must be invited as owner first', async () => {
		const studio = await studioMake('Alone');
		const shared = await studioWithWork();
		const owner = shared.owner;
		await memberAdd(studio.id, owner.id, 'owner');
		const r = await shared.asOwner.api('DELETE', '/api/me', { email: owner.email, password: PASSWORD });
		expect(r.status).toBe(409);
		const { message } = (await r.json()).error;
		expect(message).toContain(`You are the last owner of "${shared.studio.name}"`);
		expect(message).toContain(`You are the only member of "${studio.name}". Studios are not deleted in the app, and it needs an owner: invite someone as owner on its Members page and, once they have joined, delete your account.`);
		expect(message).toMatch(/Nothing was deleted\.$/);
		expect(await testDb().selectFrom('studios').select('id').where('id', '=', studio.id).executeTakeFirst()).toEqual({ id: studio.id });
		expect((await shared.asOwner.api('GET', '/api/me')).status).toBe(200);
	});

	it('the account page says up front which studios stop the deletion, and shows the refusal after trying', async () => {
		const studio = await studioMake('Solo');
		const owner = await userMake('solo');
		await memberAdd(studio.id, owner.id, 'owner');
		const asOwner = await sessionClient(app.baseUrl, owner.id);
		const html = await (await asOwner.get('/settings/account')).text();
		expect(html).toMatch(new RegExp(`role="status"[^>]*>You are the only member of (&quot;|")${studio.name}(&quot;|")\\. Studios are not deleted in the app`));
		const refused = await asOwner.post('/settings/account?/delete', { email: owner.email, password: PASSWORD });
		expect(refused.status).toBe(409);
		const text = await refused.text();
		expect(text).toContain('role="alert"');
		expect(text).toContain('once they have joined, delete your account. Nothing was deleted.');
		expect(await testDb().selectFrom('users').select('id').where('id', '=', owner.id).executeTakeFirst()).toEqual({ id: owner.id });
	});

	it('leaves the studio\'s payment-provider customer as it is when an owner who is not the last deletes the account', async () => {
		const w = await studioWithWork();
		const customerId = `cus_account_${w.studio.id.slice(0, 8)}`;
		await testDb().updateTable('studio_billing').set({ customer_id: customerId }).where('studio_id', '=', w.studio.id).execute();
		const before = await testDb().selectFrom('studio_billing').selectAll().where('studio_id', '=', w.studio.id).executeTakeFirstOrThrow();
		expect((await w.asOwner.api('PATCH', `/api/studios/${w.studio.id}/members/${w.cutter.id}`, { role: 'owner' })).status).toBe(200);
		const deliveries = app.payments.deliveries.length;
		expect((await w.asOwner.api('DELETE', '/api/me', { email: w.owner.email, password: PASSWORD })).status).toBe(204);
		expect(await testDb().selectFrom('studio_billing').selectAll().where('studio_id', '=', w.studio.id).executeTakeFirstOrThrow()).toEqual(before);
		expect(app.payments.deliveries.length).toBe(deliveries);
	});

	it('deletes the account: every session ends, the work stays with the studio by "former member", the address is free', async () => {
		const w = await studioWithWork();
		const otherSession = await sessionClient(app.baseUrl, w.cutter.id);
		const r = await w.asCutter.api('DELETE', '/api/me', { email: w.cutter.email.toUpperCase(), password: PASSWORD });
		expect(r.status).toBe(204);
		expect(r.headers.getSetCookie().some((c) => /^dartelier_session=;/.test(c))).toBe(true);
		expect((await otherSession.api('GET', '/api/me')).status).toBe(401);
		expect((await new Client(app.baseUrl).post('/signin', { email: w.cutter.email, password: PASSWORD })).status).toBe(400);
		expect(await testDb().selectFrom('sessions').select('id_hash').where('user_id', '=', w.cutter.id).execute()).toEqual([]);

		const versions = await (await w.asOwner.api('GET', `/api/studios/${w.studio.id}/pieces/${w.pieceId}/versions`)).json();
		expect(versions.versions).toEqual([expect.objectContaining({ id: w.versionId, authorId: null, authorName: 'former member' })]);
		const thread = await (await w.asOwner.api('GET', w.comments)).json();
		expect(thread.comments.map((c: { authorName: string; body: string }) => [c.authorName, c.body])).toEqual([
			['former member', 'Bust dart moved 1 cm toward the side seam.'],
			[w.owner.name, 'The owner writes this: not the cutter\'s data.']
		]);
		const members = await (await w.asOwner.api('GET', `/api/studios/${w.studio.id}/members`)).json();
		expect(members.members.map((m: { userId: string }) => m.userId)).toEqual([w.owner.id]);
		const style = await testDb().selectFrom('styles').select('created_by').where('id', '=', w.styleId).executeTakeFirstOrThrow();
		expect(style.created_by).toBeNull();

		const again = await new Client(app.baseUrl).post('/signup', { name: 'Cutter Again', email: w.cutter.email, password: PASSWORD, studioName: 'New start' });
		expect(again.status).toBe(303);
		const fresh = await testDb().selectFrom('users').select('id').where('email', '=', w.cutter.email).executeTakeFirstOrThrow();
		expect(fresh.id).not.toBe(w.cutter.id);
	});

	it('the account page asks for the address and password, says what stays, and signs out after deleting', async () => {
		const w = await studioWithWork();
		const page = await w.asCutter.get('/settings/account');
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('Delete your account');
		expect(html).toContain('Your work stays with the studios');
		expect(html).toContain('Download my data (JSON)');
		const wrong = await w.asCutter.post('/settings/account?/delete', { email: w.cutter.email, password: 'nope-nope-nope' });
		expect(wrong.status).toBe(403);
		expect(await wrong.text()).toContain('That password is not right. Nothing was deleted.');
		const done = await w.asCutter.post('/settings/account?/delete', { email: w.cutter.email, password: PASSWORD });
		expect(done.status).toBe(303);
		expect(done.headers.get('location')).toBe('/?account=deleted');
		expect(w.asCutter.session).toBeNull();
		expect(await testDb().selectFrom('users').select('id').where('id', '=', w.cutter.id).executeTakeFirst()).toBeUndefined();
	});
});
