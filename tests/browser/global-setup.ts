// Browser tests drive Debian's Chromium against the BUILT app (`vite build` runs first), served on a
// loopback port with the test database and the project's fake SMTP server with its inbox page.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { sql } from 'kysely';
import type { TestProject } from 'vitest/node';
import { PAYMENTS_FAKE_KEY, PAYMENTS_FAKE_WEBHOOK_SECRET, paymentsFakeStart } from '../../scripts/payments-fake/server';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';
import { childStop, childTrack } from '../child-processes';
import { s3FakeStart } from '../s3-fake';

async function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const srv = createServer();
		srv.listen(0, '127.0.0.1', () => {
			const addr = srv.address();
			srv.close(() => (typeof addr === 'object' && addr ? resolve(addr.port) : reject(new Error('no port'))));
		});
	});
}

async function waitFor(url: string, child: ChildProcess, ms = 30_000) {
	const until = Date.now() + ms;
	while (Date.now() < until) {
		if (child.exitCode !== null) throw new Error(`${url}: process exited with ${child.exitCode}`);
		try {
			const r = await fetch(url);
			if (r.status < 500) return;
		} catch {
			/* not up yet */
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	throw new Error(`${url} did not answer within ${ms} ms`);
}

export default async function setup(project: TestProject) {
	const databaseUrl = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start test >&2 && printf %s "$DATABASE_URL"'], {
		encoding: 'utf8'
	}).trim();
	// The same migrations as `npm test` runs first, so the browser project also works on its own.
	const db = dbCreate(databaseUrl, 1);
	try {
		await migrateToLatest(db);
		// every run starts with fresh rate-limit counts (all its requests come from 127.0.0.1)
		await sql`delete from rate_limits`.execute(db);
	} finally {
		await db.destroy();
	}
	const [appPort, smtpPort, inboxPort] = [await freePort(), await freePort(), await freePort()];
	const s3 = await s3FakeStart('test-browser');
	process.env.S3_ENDPOINT = s3.endpoint;
	process.env.S3_BUCKET = s3.bucket;
	const env = { ...process.env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn', DATABASE_URL: databaseUrl, S3_ENDPOINT: s3.endpoint, S3_BUCKET: s3.bucket };
	// the payment provider's local fake, in this process; its webhooks go to the app below
	const payments = await paymentsFakeStart({ port: 0, demo: true, webhookUrl: `http://127.0.0.1:${appPort}/api/billing/webhook` });
	const mail = spawn('npx', ['tsx', 'scripts/mail-dev.ts'], {
		env: { ...env, MAIL_DEV_SMTP_PORT: String(smtpPort), MAIL_DEV_HTTP_PORT: String(inboxPort) },
		stdio: ['ignore', 'inherit', 'inherit'],
		detached: true // its own process group, so teardown ends npx and the server under it
	});
	childTrack(mail, true);
	const app = spawn('node', ['build'], {
		env: {
			...env,
			HOST: '127.0.0.1',
			PORT: String(appPort),
			ORIGIN: `http://127.0.0.1:${appPort}`,
			BODY_SIZE_LIMIT: '16M',
			// every browser test signs up a studio of its own, all from 127.0.0.1
			RATE_LIMIT_SIGNUP_ADDRESS: '1000',
			SMTP_HOST: '127.0.0.1',
			SMTP_PORT: String(smtpPort),
			MAIL_FROM: 'Dartelier <studio@dartelier.localhost>',
			STRIPE_SECRET_KEY: PAYMENTS_FAKE_KEY,
			STRIPE_WEBHOOK_SECRET: PAYMENTS_FAKE_WEBHOOK_SECRET,
			STRIPE_API_HOST: '127.0.0.1',
			STRIPE_API_PORT: String(payments.port),
			STRIPE_API_PROTOCOL: 'http'
		},
		stdio: ['ignore', 'inherit', 'inherit']
	});
	childTrack(app);
	/** Everything started here, stopped and waited for: the app (SIGTERM, then SIGKILL), the mail server's group, the fakes. */
	const teardown = async () => {
		await Promise.all([childStop(app), childStop(mail)]);
		await payments.close();
		await s3.close();
	};
	const baseUrl = `http://127.0.0.1:${appPort}`;
	const inboxUrl = `http://127.0.0.1:${inboxPort}`;
	try {
		await waitFor(baseUrl, app);
		await waitFor(inboxUrl, mail);
	} catch (e) {
		await teardown(); // a set-up that fails gets no teardown from Vitest
		throw e;
	}
	project.provide('baseUrl', baseUrl);
	project.provide('inboxUrl', inboxUrl);
	project.provide('paymentsUrl', payments.url);
	project.provide('databaseUrl', databaseUrl);
	project.provide('s3Endpoint', s3.endpoint);
	return teardown;
}

declare module 'vitest' {
	export interface ProvidedContext {
		baseUrl: string;
		inboxUrl: string;
		databaseUrl: string;
		/** the local payments fake (its /_fake/events lists what it sent) */
		paymentsUrl: string;
		s3Endpoint: string;
	}
}
