// Withdrawing an invitation and leaving a studio: the owner withdraws an open invitation (its link stops
// working, its seat is free); a member leaves a studio; the last owner cannot leave (409).
import { beforeEach, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { appForFile } from './app-server';
import { Client, memberAdd, sessionClient, studioMake, testDb, uniq, userMake } from './helpers';

const app = appForFile();
beforeEach(async () => {
	await sql`delete from rate_limits`.execute(testDb());
});

/** A studio on the free plan (3 seats) with its owner and one designer. */
async function studioWithTeam() {
	const studio = await studioMake('Members');
	const owner = await userMake('owner');
	const designer = await userMake('designer');
	await memberAdd(studio.id, owner.id, 'owner');
	await memberAdd(studio.id, designer.id, 'designer');
	return { studio, owner, designer, asOwner: await sessionClient(app.baseUrl, owner.id), asDesigner: await sessionClient(app.baseUrl, designer.id) };
}

async function invite(c: Client, studioId: string, email = `guest-${uniq()}@example.test`) {
	const r = await c.api('POST', `/api/studios/${studioId}/invitations`, { email, role: 'patterncutter' });
	return { r, email };
}

describe('withdrawing an invitation', () => {
	it('answers 204; the link then answers 404 and the seat it held is free for another invitation', async () => {
		const t = await studioWithTeam();
		const first = await invite(t.asOwner, t.studio.id);
		expect(first.r.status).toBe(201);
		const { invitation } = await first.r.json();
		const mail = await app.mailbox.waitFor(first.email);
		const link = mail.links.find((l) => l.includes('/invite/'))!.slice(app.baseUrl.length);
		// the free plan's third seat is taken by the invitation: a fourth person is refused
		expect((await invite(t.asOwner, t.studio.id)).r.status).toBe(402);

		const w = await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/invitations/${invitation.id}`);
		expect(w.status).toBe(204);
		expect((await new Client(app.baseUrl).get(link)).status).toBe(404);
		expect((await new Client(app.baseUrl).post(`${link}?/signup`, { name: 'Late Guest', password: 'cut-on-the-bias-42' })).status).toBe(404);
		const list = await (await t.asOwner.api('GET', `/api/studios/${t.studio.id}/invitations`)).json();
		expect(list.invitations.map((i: { id: string }) => i.id)).not.toContain(invitation.id);
		expect((await invite(t.asOwner, t.studio.id)).r.status).toBe(201);
		// withdrawn already
		const again = await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/invitations/${invitation.id}`);
		expect(again.status).toBe(404);
		expect((await again.json()).error.message).toMatch(/no invitation with this id/);
	});

	it('refuses an accepted invitation (409), another studio\'s (404), a malformed id (400) and a non-owner (403)', async () => {
		const t = await studioWithTeam();
		const joiner = await userMake('joiner');
		const sent = await invite(t.asOwner, t.studio.id, joiner.email);
		const { invitation } = await sent.r.json();
		const link = (await app.mailbox.waitFor(joiner.email)).links.find((l) => l.includes('/invite/'))!.slice(app.baseUrl.length);
		const joinerClient = await sessionClient(app.baseUrl, joiner.id);
		expect((await joinerClient.post(`${link}?/join`, {})).status).toBe(303);
		const used = await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/invitations/${invitation.id}`);
		expect(used.status).toBe(409);
		const err = (await used.json()).error;
		expect(err.code).toBe('invitation_used');
		expect(err.message).toContain('accepted already');

		const other = await studioWithTeam();
		const theirs = await (await invite(other.asOwner, other.studio.id)).r.json();
		expect((await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/invitations/${theirs.invitation.id}`)).status).toBe(404);
		expect((await t.asOwner.api('DELETE', `/api/studios/${other.studio.id}/invitations/${theirs.invitation.id}`)).status).toBe(404);
		expect((await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/invitations/not-an-id`)).status).toBe(400);
		expect((await other.asDesigner.api('DELETE', `/api/studios/${other.studio.id}/invitations/${theirs.invitation.id}`)).status).toBe(403);
		const stillThere = await testDb().selectFrom('invitations').select('id').where('id', '=', theirs.invitation.id).executeTakeFirst();
		expect(stillThere).toBeDefined();
	});
});

describe('leaving a studio', () => {
	it('a member leaves (204) and no longer sees the studio; their versions stay with it', async () => {
		const t = await studioWithTeam();
		const r = await t.asDesigner.api('DELETE', `/api/studios/${t.studio.id}/membership`);
		expect(r.status).toBe(204);
		expect((await t.asDesigner.api('GET', `/api/studios/${t.studio.id}`)).status).toBe(404);
		expect((await t.asDesigner.api('DELETE', `/api/studios/${t.studio.id}/membership`)).status).toBe(404);
		const members = await (await t.asOwner.api('GET', `/api/studios/${t.studio.id}/members`)).json();
		expect(members.members.map((m: { userId: string }) => m.userId)).toEqual([t.owner.id]);
	});

	it('the last owner cannot leave (409, saying what to do); with a second owner, an owner can', async () => {
		const t = await studioWithTeam();
		const r = await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/membership`);
		expect(r.status).toBe(409);
		const err = (await r.json()).error;
		expect(err.code).toBe('last_owner');
		expect(err.message).toContain("You are this studio's last owner");
		expect(err.message).toContain('make another member owner first');
		expect((await t.asOwner.api('GET', `/api/studios/${t.studio.id}`)).status).toBe(200);

		expect((await t.asOwner.api('PATCH', `/api/studios/${t.studio.id}/members/${t.designer.id}`, { role: 'owner' })).status).toBe(200);
		expect((await t.asOwner.api('DELETE', `/api/studios/${t.studio.id}/membership`)).status).toBe(204);
		// the new owner is now the last one
		expect((await t.asDesigner.api('DELETE', `/api/studios/${t.studio.id}/membership`)).status).toBe(409);
	});

	it('the members page offers to leave the studio', async () => {
		const t = await studioWithTeam();
		const page = await t.asDesigner.get(`/studios/${t.studio.id}/members`);
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('Leave this studio');
	});
});
