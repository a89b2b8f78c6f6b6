// Graceful shutdown of the BUILT app as its own process (`node build`, as `npm start` runs it): a version
// save is in flight (its headers and half its body sent) when SIGTERM comes. Checked: the app at once
// refuses new connections, the save, once its body is complete, is answered 201 and stored as the
// piece's head, and the process then closes its worker and pools and exits 0.
import http from 'node:http';
import { connect } from 'node:net';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { pivot } from '../../src/lib/pattern/operations/pivot';
import { appProcessStart, type AppProcess } from './app-process';
import { memberAdd, SESSION_COOKIE, sessionClient, studioMake, testDb, testDbClose, userMake } from './helpers';

/** The shoulder dart of the demo block goes to the side seam (trade-primer §1). */
const SIDE_SEAM = { x: 235 - 10 / 3, y: 300 };

let app: AppProcess;

beforeAll(async () => {
	app = await appProcessStart(inject('databaseUrl'), { LOG_LEVEL: 'info' });
}, 60_000);

afterAll(async () => {
	await app?.stop();
	await testDbClose();
});

function refused(port: number): Promise<boolean> {
	return new Promise((resolve) => {
		const s = connect(port, '127.0.0.1');
		s.once('connect', () => {
			s.destroy();
			resolve(false);
		});
		s.once('error', () => resolve(true));
	});
}

describe('graceful shutdown', () => {
	it('on SIGTERM refuses new connections, finishes the save in flight (201, stored) and exits 0', async () => {
		const owner = await userMake('shutdown-owner');
		const studio = await studioMake('Shutdown');
		await memberAdd(studio.id, owner.id, 'owner');
		const c = await sessionClient(app.baseUrl, owner.id);
		const style = await (await c.api('POST', `/api/studios/${studio.id}/styles`, { name: 'Last save', code: 'SD-1', season: 'AW27' })).json();
		const made = await c.api('POST', `/api/studios/${studio.id}/styles/${style.style.id}/pieces`, {
			name: 'Front',
			geometry: frontBodiceBlock(),
			origin: { op: 'draft', params: { note: 'block' } }
		});
		expect(made.status).toBe(201);
		const piece = (await made.json()).piece;
		const head = (await (await c.api('GET', `/api/studios/${studio.id}/pieces/${piece.id}`)).json()).shown;
		const moved = pivot(head.geometry, { dartId: 'shoulder-dart', to: SIDE_SEAM });
		if (!moved.ok) throw new Error(moved.error.message);
		const body = Buffer.from(
			JSON.stringify({
				baseVersionId: head.id,
				message: 'dart to the side seam, saved while the app stops',
				geometry: moved.piece,
				recipe: [{ op: 'pivot', params: { dartId: 'shoulder-dart', to: SIDE_SEAM } }]
			})
		);

		const port = Number(new URL(app.baseUrl).port);
		let pending: http.ClientRequest | undefined;
		const answer = new Promise<{ status: number; text: string }>((resolve, reject) => {
			const req = http.request(
				{
					host: '127.0.0.1',
					port,
					method: 'POST',
					path: `/api/studios/${studio.id}/pieces/${piece.id}/versions`,
					agent: false,
					headers: {
						'content-type': 'application/json',
						'content-length': body.byteLength,
						accept: 'application/json',
						origin: app.baseUrl,
						cookie: `${SESSION_COOKIE}=${c.session}`
					}
				},
				(res) => {
					let text = '';
					res.on('data', (d) => (text += d));
					res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
				}
			);
			req.on('error', reject);
			req.write(body.subarray(0, body.byteLength >> 1));
			pending = req;
		});
		// the server has the request's headers: it is in flight
		await new Promise((r) => setTimeout(r, 1000));
		const exited = new Promise<{ code: number | null; signal: string | null }>((resolve) =>
			app.child.once('exit', (code, signal) => resolve({ code, signal }))
		);
		app.child.kill('SIGTERM');
		await expect.poll(() => refused(port), { timeout: 10_000, interval: 100 }).toBe(true);
		expect(app.exited()).toBeNull(); // still finishing the save

		pending!.end(body.subarray(body.byteLength >> 1));
		const saved = await answer;
		expect(saved.status, saved.text).toBe(201);
		const versionId = JSON.parse(saved.text).version.id as string;
		expect(await exited).toEqual({ code: 0, signal: null });

		const row = await testDb().selectFrom('pieces').select('head_version_id').where('id', '=', piece.id).executeTakeFirstOrThrow();
		expect(row.head_version_id).toBe(versionId);
		expect(app.output()).toContain('"msg":"stopped"');
	});
});
