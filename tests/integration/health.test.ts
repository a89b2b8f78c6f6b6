// /healthz (the process is up) and /readyz (the database, the object store and the size-run queue
// answer), as a load balancer asks them: signed out, against the BUILT app. /readyz answers 503 naming
// what failed while the test PostgreSQL cluster is stopped (then 200 again once it is back), and when
// the object store cannot be reached.
import { execFileSync } from 'node:child_process';
import { createServer } from 'node:net';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { appProcessStart, type AppProcess } from './app-process';
import { startApp, type RunningApp } from './app-server';
import { Client } from './helpers';

let app: RunningApp;

function cluster(action: 'start' | 'stop') {
	execFileSync('bash', ['scripts/db.sh', action, 'test'], { stdio: ['ignore', 'ignore', 'inherit'] });
}

async function probe(base: string, path: string) {
	const r = await new Client(base).get(path, { accept: 'application/json' });
	return { status: r.status, body: await r.json(), type: r.headers.get('content-type'), cache: r.headers.get('cache-control') };
}

beforeAll(async () => {
	app = await startApp();
}, 60_000);

afterAll(async () => {
	cluster('start'); // whatever happened, the next tests find their database
	await app?.close();
});

describe('health endpoints', () => {
	it('answer a signed-out probe: /healthz up, /readyz ready with every part ok, neither cached', async () => {
		const health = await probe(app.baseUrl, '/healthz');
		expect(health).toMatchObject({ status: 200, body: { status: 'up' }, cache: 'no-store' });
		await expect.poll(async () => (await probe(app.baseUrl, '/readyz')).status, { timeout: 20_000 }).toBe(200);
		const ready = await probe(app.baseUrl, '/readyz');
		expect(ready.body).toEqual({ status: 'ready', checks: { database: 'ok', objectStore: 'ok', queue: 'ok' } });
		expect(ready.type).toContain('application/json');
	});

	it('answers /readyz 503 naming the database while PostgreSQL is stopped, /healthz still 200, and ready again after', async () => {
		cluster('stop');
		try {
			const ready = await probe(app.baseUrl, '/readyz');
			expect(ready.status).toBe(503);
			expect(ready.body.status).toBe('unavailable');
			expect(ready.body.failed).toContain('database');
			expect(ready.body.checks.database).toBe('failed');
			expect(ready.body.checks.objectStore).toBe('ok');
			expect((await probe(app.baseUrl, '/healthz')).status).toBe(200);
		} finally {
			cluster('start');
		}
		await expect.poll(async () => (await probe(app.baseUrl, '/readyz')).status, { timeout: 30_000, interval: 500 }).toBe(200);
	});

	it('answers /readyz 503 naming the object store when it cannot be reached', async () => {
		// a port that was free a moment ago: nothing answers there
		const port = await new Promise<number>((resolve) => {
			const srv = createServer().listen(0, '127.0.0.1', () => {
				const a = srv.address() as { port: number };
				srv.close(() => resolve(a.port));
			});
		});
		let lonely: AppProcess | undefined;
		try {
			lonely = await appProcessStart(inject('databaseUrl'), { S3_ENDPOINT: `http://127.0.0.1:${port}` });
			const ready = await probe(lonely.baseUrl, '/readyz');
			expect(ready.status).toBe(503);
			expect(ready.body.failed).toEqual(expect.arrayContaining(['objectStore']));
			expect(ready.body.failed).not.toContain('database');
			expect((await probe(lonely.baseUrl, '/healthz')).status).toBe(200);
		} finally {
			await lonely?.stop();
		}
	});
});
