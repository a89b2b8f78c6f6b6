// The JSON API of studios and members: validation, conflicts, body limits, studio boundaries.
import http from 'node:http';
import { describe, expect, it } from 'vitest';
import { appForFile } from './app-server';
import { Client, memberAdd, sessionClient, studioMake, userMake } from './helpers';

const app = appForFile();

async function studioOf(roles: ('owner' | 'patterncutter' | 'designer' | 'sampleroom')[]) {
	const studio = await studioMake('Api');
	const people = [];
	for (const role of roles) {
		const u = await userMake(role);
		await memberAdd(studio.id, u.id, role);
		people.push({ ...u, role, client: await sessionClient(app.baseUrl, u.id) });
	}
	return { studio, people };
}

describe('studios', () => {
	it('lists, creates and renames; a user can belong to several studios', async () => {
		const u = await userMake('multi');
		const c = await sessionClient(app.baseUrl, u.id);
		expect(await (await c.api('GET', '/api/studios')).json()).toEqual({ studios: [] });
		const a = await c.api('POST', '/api/studios', { name: '  Atelier Nord  ' });
		expect(a.status).toBe(201);
		const sa = (await a.json()).studio;
		expect(sa).toMatchObject({ name: 'Atelier Nord', role: 'owner' });
		const other = await studioMake('Guest');
		await memberAdd(other.id, u.id, 'designer');
		const list = (await (await c.api('GET', '/api/studios')).json()).studios;
		expect(list).toHaveLength(2);
		expect(list).toContainEqual({ id: other.id, name: other.name, role: 'designer' });

		const renamed = await c.api('PATCH', `/api/studios/${sa.id}`, { name: 'Atelier Sud' });
		expect(renamed.status).toBe(200);
		expect((await renamed.json()).studio.name).toBe('Atelier Sud');
		// not the owner there
		expect((await c.api('PATCH', `/api/studios/${other.id}`, { name: 'Mine now' })).status).toBe(403);
	});

	it('answers 400 with field errors', async () => {
		const u = await userMake('v');
		const c = await sessionClient(app.baseUrl, u.id);
		const r = await c.api('POST', '/api/studios', { name: '' });
		expect(r.status).toBe(400);
		expect(await r.json()).toEqual({
			error: { code: 'invalid', message: 'Some fields are not valid.', fields: { name: ['Enter a studio name.'] } }
		});
		const notJson = await c.request('POST', '/api/studios', {
			body: '{"name":',
			headers: { 'content-type': 'application/json' }
		});
		expect(notJson.status).toBe(400);
		expect((await notJson.json()).error.code).toBe('invalid_json');
		const form = await c.request('POST', '/api/studios', {
			body: 'name=x',
			headers: { 'content-type': 'text/plain' }
		});
		expect(form.status).toBe(415);
	});

	it('answers 401 in JSON when signed out', async () => {
		const r = await new Client(app.baseUrl).api('GET', '/api/studios');
		expect(r.status).toBe(401);
		expect(r.headers.get('content-type')).toContain('application/json');
		expect(await r.json()).toEqual({ error: { code: 'unauthenticated', message: 'Sign in first.' } });
	});
});

describe('body limit', () => {
	const big = JSON.stringify({ name: 'x'.repeat(1024 * 1024 + 10) });

	it('refuses a body over 1 MB by its content-length (413)', async () => {
		const u = await userMake('big');
		const c = await sessionClient(app.baseUrl, u.id);
		const r = await c.request('POST', '/api/studios', { body: big, headers: { 'content-type': 'application/json' } });
		expect(r.status).toBe(413);
		expect((await r.json()).error.code).toBe('payload_too_large');
	});

	it('refuses a body over 1 MB sent without content-length (chunked), by what it reads (413)', async () => {
		const u = await userMake('chunked');
		const c = await sessionClient(app.baseUrl, u.id);
		const url = new URL('/api/studios', app.baseUrl);
		const { status, body } = await new Promise<{ status: number; body: string }>((resolve, reject) => {
			const req = http.request(
				url,
				{
					method: 'POST',
					headers: {
						'content-type': 'application/json',
						'transfer-encoding': 'chunked',
						cookie: `dartelier_session=${c.session}`,
						origin: app.baseUrl
					}
				},
				(res) => {
					let b = '';
					res.on('data', (d) => (b += d));
					res.on('end', () => resolve({ status: res.statusCode ?? 0, body: b }));
				}
			);
			req.on('error', reject);
			for (let i = 0; i < big.length; i += 64 * 1024) req.write(big.slice(i, i + 64 * 1024));
			req.end();
		});
		expect(status).toBe(413);
		expect(JSON.parse(body).error.code).toBe('payload_too_large');
	});
});

describe('members', () => {
	it('the owner changes roles and removes members; everyone sees the list', async () => {
		const { studio, people } = await studioOf(['owner', 'patterncutter', 'designer']);
		const [owner, cutter, designer] = people;
		const list = await designer.client.api('GET', `/api/studios/${studio.id}/members`);
		expect(list.status).toBe(200);
		const { members } = await list.json();
		expect(members.map((m: { email: string }) => m.email).sort()).toEqual(people.map((p) => p.email).sort());
		expect(members[0]).not.toHaveProperty('password_hash');

		const r = await owner.client.api('PATCH', `/api/studios/${studio.id}/members/${designer.id}`, { role: 'sampleroom' });
		expect(r.status).toBe(200);
		expect(await r.json()).toEqual({ member: { userId: designer.id, role: 'sampleroom' } });
		expect((await cutter.client.api('PATCH', `/api/studios/${studio.id}/members/${designer.id}`, { role: 'owner' })).status).toBe(403);

		const bad = await owner.client.api('PATCH', `/api/studios/${studio.id}/members/${designer.id}`, { role: 'boss' });
		expect(bad.status).toBe(400);
		expect((await bad.json()).error.fields.role).toBeDefined();

		expect((await owner.client.api('DELETE', `/api/studios/${studio.id}/members/${cutter.id}`)).status).toBe(204);
		expect((await cutter.client.api('GET', `/api/studios/${studio.id}/members`)).status).toBe(404); // gone
		expect((await owner.client.api('DELETE', `/api/studios/${studio.id}/members/${cutter.id}`)).status).toBe(404);
	});

	it('the last owner cannot be demoted or removed (409); with two owners, one can go', async () => {
		const { studio, people } = await studioOf(['owner', 'patterncutter']);
		const [owner, cutter] = people;
		const demote = await owner.client.api('PATCH', `/api/studios/${studio.id}/members/${owner.id}`, { role: 'designer' });
		expect(demote.status).toBe(409);
		const err = (await demote.json()).error;
		expect(err.code).toBe('last_owner');
		expect(err.message).toMatch(/last owner/);
		const remove = await owner.client.api('DELETE', `/api/studios/${studio.id}/members/${owner.id}`);
		expect(remove.status).toBe(409);
		expect((await remove.json()).error.code).toBe('last_owner');

		expect((await owner.client.api('PATCH', `/api/studios/${studio.id}/members/${cutter.id}`, { role: 'owner' })).status).toBe(200);
		expect((await owner.client.api('PATCH', `/api/studios/${studio.id}/members/${owner.id}`, { role: 'designer' })).status).toBe(200);
		// now the cutter is the only owner
		expect((await cutter.client.api('DELETE', `/api/studios/${studio.id}/members/${cutter.id}`)).status).toBe(409);
	});

	it('two owners demoting each other at once leave one owner', async () => {
		const { studio, people } = await studioOf(['owner', 'owner']);
		const [a, b] = people;
		const [ra, rb] = await Promise.all([
			a.client.api('PATCH', `/api/studios/${studio.id}/members/${b.id}`, { role: 'designer' }),
			b.client.api('PATCH', `/api/studios/${studio.id}/members/${a.id}`, { role: 'designer' })
		]);
		// One wins; the other is refused, by the gate (403: no longer an owner) or by the lock (409).
		const statuses = [ra.status, rb.status].sort();
		expect(statuses[0]).toBe(200);
		expect([403, 409]).toContain(statuses[1]);
		const { members } = await (await (ra.status === 200 ? a : b).client.api('GET', `/api/studios/${studio.id}/members`)).json();
		expect(members.filter((m: { role: string }) => m.role === 'owner')).toHaveLength(1);
	});

	it("another studio's members and resources answer 404, not 403", async () => {
		const one = await studioOf(['owner', 'designer']);
		const two = await studioOf(['owner']);
		const intruder = two.people[0].client;
		for (const [method, path, body] of [
			['GET', `/api/studios/${one.studio.id}`, undefined],
			['GET', `/api/studios/${one.studio.id}/members`, undefined],
			['PATCH', `/api/studios/${one.studio.id}/members/${one.people[1].id}`, { role: 'owner' }],
			['DELETE', `/api/studios/${one.studio.id}/members/${one.people[1].id}`, undefined],
			['POST', `/api/studios/${one.studio.id}/invitations`, { email: 'x@example.test', role: 'owner' }]
		] as const) {
			const r = await intruder.api(method, path, body);
			expect(r.status, `${method} ${path}`).toBe(404);
		}
		expect((await intruder.get(`/studios/${one.studio.id}/members`)).status).toBe(404);
		// and the owner of studio two cannot touch studio one's members through their own studio id
		const cross = await intruder.api('PATCH', `/api/studios/${two.studio.id}/members/${one.people[1].id}`, { role: 'owner' });
		expect(cross.status).toBe(404);
	});
});

describe('pages', () => {
	it('the members page and the studio layout render for members', async () => {
		const { studio, people } = await studioOf(['owner', 'sampleroom']);
		for (const p of people) {
			const r = await p.client.get(`/studios/${studio.id}/members`);
			expect(r.status).toBe(200);
			expect(await r.text()).toContain(`Members of ${studio.name}`);
		}
	});

	it('creating a studio through the form makes its creator owner', async () => {
		const u = await userMake('former');
		const c = await sessionClient(app.baseUrl, u.id);
		const r = await c.post('/studios/new', { name: 'Second Room' });
		expect(r.status).toBe(303);
		const id = r.headers.get('location')!.split('/').pop()!;
		expect(await (await c.api('GET', `/api/studios/${id}`)).json()).toEqual({ studio: { id, name: 'Second Room', role: 'owner' } });
	});
});
