// `npm start` (scripts/start.sh) as a user runs it, on the start script's scratch cluster and free
// ports, with a stand-in for the build that prints what the real build prints (fixtures/noisy-build.mjs)
// so that the app `npm test` built is served as it is.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { afterAll, describe, expect, it } from 'vitest';
import demo from '../../fixtures/demo-studio.json';
import { childStop, childTrack } from '../child-processes';

async function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const srv = createServer();
		srv.listen(0, '127.0.0.1', () => {
			const addr = srv.address();
			srv.close(() => (typeof addr === 'object' && addr ? resolve(addr.port) : reject(new Error('no port'))));
		});
	});
}

describe('npm start', () => {
	let child: ChildProcess | null = null;
	afterAll(async () => {
		// the script's group: it and what it started (the app, the fakes), SIGTERM then SIGKILL
		if (child) await childStop(child);
		execFileSync('bash', ['scripts/db.sh', 'stop', 'scratch']);
	});

	it('prints only where the app is, the demo sign-in with every e-mail, what else runs, and keeps the build warnings in .run/build.log', async () => {
		const [appPort, smtpPort, inboxPort, paymentsPort, s3Port] = [await freePort(), await freePort(), await freePort(), await freePort(), await freePort()];
		// a stale build stamp would skip the build step this test is about
		execFileSync('rm', ['-f', 'build/.dartelier-built']);
		child = spawn('bash', ['scripts/start.sh'], {
			env: {
				...process.env,
				PORT: String(appPort),
				MAIL_DEV_SMTP_PORT: String(smtpPort),
				MAIL_DEV_HTTP_PORT: String(inboxPort),
				PAYMENTS_FAKE_PORT: String(paymentsPort),
				S3_DEV_PORT: String(s3Port),
				// the tests' own store is in the environment; unset, npm start runs its local one
				S3_ENDPOINT: '',
				DARTELIER_START_CLUSTER: 'scratch',
				DARTELIER_START_BUILD: 'node tests/integration/fixtures/noisy-build.mjs'
			},
			stdio: ['ignore', 'pipe', 'pipe'],
			detached: true // its own process group: the test ends the script and what it started
		});
		childTrack(child, true);
		let output = '';
		child.stdout!.on('data', (b) => (output += b));
		child.stderr!.on('data', (b) => (output += b));
		await expect.poll(() => output, { timeout: 120_000, interval: 250 }).toContain('Ctrl-C stops');
		// the app answers where the output says it is
		const appUrl = `http://127.0.0.1:${appPort}`;
		expect(output).toContain(appUrl);
		expect((await fetch(appUrl)).status).toBe(200);
		expect((await fetch(`http://127.0.0.1:${inboxPort}`)).status).toBe(200);
		// the payments fake answers the provider's API (with the local key only)
		expect((await fetch(`http://127.0.0.1:${paymentsPort}/v1/invoices`)).status).toBe(401);

		const plain = output.replace(/\x1b\[[0-9;]*m/g, '');
		// the demo sign-in: the password and every demo user's e-mail, roles as people say them
		expect(plain).toContain(demo.password);
		for (const u of demo.users) expect(plain).toContain(u.email);
		expect(plain).toContain('pattern cutter');
		expect(plain).toContain('sample room');
		expect(plain).not.toContain('patterncutter');
		// what else runs
		expect(plain).toContain(`http://127.0.0.1:${inboxPort}`);
		expect(plain).toMatch(/PostgreSQL \(scratch\)/);
		expect(plain).toContain(`http://127.0.0.1:${paymentsPort}`);
		// the object store answers where the output says it is, with the bucket made
		expect(plain).toContain(`http://127.0.0.1:${s3Port}, bucket dartelier-photos`);
		expect((await fetch(`http://127.0.0.1:${s3Port}/dartelier-photos`)).status).not.toBe(404);
		// none of the build's own output, and no command the user need not run
		expect(plain).not.toContain('Circular dependency');
		expect(plain).not.toContain('npm run preview');
		expect(plain.trim().split('\n').length).toBeLessThanOrEqual(30);
		const buildLog = readFileSync('.run/build.log', 'utf8');
		expect(buildLog).toContain('Circular dependency');
		expect(buildLog).toContain('npm run preview');
	}, 180_000);

	it('lists the demo sign-in in the README as well: the password and every e-mail', () => {
		const readme = readFileSync('README.md', 'utf8');
		expect(readme).toContain(demo.password);
		for (const u of demo.users) expect(readme).toContain(u.email);
	});
});
