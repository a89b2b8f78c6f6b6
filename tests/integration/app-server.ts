// Runs the BUILT app (adapter-node's build/handler.js) inside this test process, in a worker thread
// (app-worker.mjs), served by node:http on 127.0.0.1:<free port>, with mail going to an in-process
// fake SMTP server. Build first: `npx vite build`. DARTELIER_BUILD_DIR may name another build folder.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { afterAll, beforeAll, inject } from 'vitest';
import { PAYMENTS_FAKE_KEY, PAYMENTS_FAKE_WEBHOOK_SECRET, paymentsFakeStart, type PaymentsFake } from '../../scripts/payments-fake/server';
import { testDbClose } from './helpers';
import { startMailbox, type Mailbox } from './mailbox';

export interface RunningApp {
	baseUrl: string;
	mailbox: Mailbox;
	/** the local payments fake the app's SDK talks to; its webhooks go to this app */
	payments: PaymentsFake;
	close(): Promise<void>;
}

export async function startApp(): Promise<RunningApp> {
	const handlerFile = path.resolve(process.env.DARTELIER_BUILD_DIR ?? 'build', 'handler.js');
	if (!existsSync(handlerFile)) throw new Error(`${handlerFile} is missing: run \`npx vite build\` first`);
	const mailbox = await startMailbox();
	const payments = await paymentsFakeStart({ port: 0, demo: true });
	const env: NodeJS.ProcessEnv = {
		...process.env,
		// the app's own request lines stay out of the tests' output; trouble (warn, error) still shows
		LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
		DATABASE_URL: inject('databaseUrl'),
		S3_ENDPOINT: inject('s3Endpoint'),
		SMTP_HOST: '127.0.0.1',
		SMTP_PORT: String(mailbox.port),
		MAIL_FROM: 'Dartelier tests <tests@dartelier.localhost>',
		// adapter-node's own cap (default 512K) set above the photo limit (15 MB), as `npm start` does.
		BODY_SIZE_LIMIT: process.env.BODY_SIZE_LIMIT ?? '16M',
		STRIPE_SECRET_KEY: PAYMENTS_FAKE_KEY,
		STRIPE_WEBHOOK_SECRET: PAYMENTS_FAKE_WEBHOOK_SECRET,
		STRIPE_API_HOST: '127.0.0.1',
		STRIPE_API_PORT: String(payments.port),
		STRIPE_API_PROTOCOL: 'http'
	};
	const worker = new Worker(new URL('./app-worker.mjs', import.meta.url), { workerData: { handlerFile }, env });
	const port = await new Promise<number>((resolve, reject) => {
		worker.once('message', (m: { port: number }) => resolve(m.port));
		worker.once('error', reject);
		worker.once('exit', (code) => reject(new Error(`app worker exited (${code}) before listening`)));
	});
	payments.setWebhookUrl(`http://127.0.0.1:${port}/api/billing/webhook`);
	return {
		baseUrl: `http://127.0.0.1:${port}`,
		mailbox,
		payments,
		async close() {
			await new Promise<void>((resolve) => {
				const t = setTimeout(resolve, 2000);
				worker.once('message', () => {
					clearTimeout(t);
					resolve();
				});
				worker.postMessage('close');
			});
			await worker.terminate();
			await mailbox.close();
			await payments.close();
		}
	};
}

/**
 * The built app for the whole test file: started before its tests, closed after them together with the
 * tests' database pool. Call once at the top of the file; read the app's fields inside tests and hooks.
 */
export function appForFile(): RunningApp {
	let running: RunningApp | undefined;
	beforeAll(async () => {
		running = await startApp();
	});
	afterAll(async () => {
		await running?.close();
		await testDbClose();
	});
	const started = (): RunningApp => {
		if (!running) throw new Error('the app is not started yet: read it inside a test or hook');
		return running;
	};
	return {
		get baseUrl() {
			return started().baseUrl;
		},
		get mailbox() {
			return started().mailbox;
		},
		get payments() {
			return started().payments;
		},
		close: () => started().close()
	};
}
