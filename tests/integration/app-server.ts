// Runs the BUILT app (adapter-node's build/handler.js) inside this test process, in a worker thread
// (app-worker.mjs), served by node:http on 127.0.0.1:<free port>, with mail going to an in-process
// fake SMTP server. Build first: `npx vite build`. DARTELIER_BUILD_DIR may name another build folder.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { inject } from 'vitest';
import { startMailbox, type Mailbox } from './mailbox';

export interface RunningApp {
	baseUrl: string;
	mailbox: Mailbox;
	close(): Promise<void>;
}

export async function startApp(): Promise<RunningApp> {
	const handlerFile = path.resolve(process.env.DARTELIER_BUILD_DIR ?? 'build', 'handler.js');
	if (!existsSync(handlerFile)) throw new Error(`${handlerFile} is missing: run \`npx vite build\` first`);
	const mailbox = await startMailbox();
	const env: NodeJS.ProcessEnv = {
		...process.env,
		DATABASE_URL: inject('databaseUrl'),
		SMTP_HOST: '127.0.0.1',
		SMTP_PORT: String(mailbox.port),
		MAIL_FROM: 'Dartelier tests <tests@dartelier.localhost>',
		// adapter-node's own cap (default 512K) set above the API's 1 MB limit, as in production.
		BODY_SIZE_LIMIT: process.env.BODY_SIZE_LIMIT ?? '12M'
	};
	const worker = new Worker(new URL('./app-worker.mjs', import.meta.url), { workerData: { handlerFile }, env });
	const port = await new Promise<number>((resolve, reject) => {
		worker.once('message', (m: { port: number }) => resolve(m.port));
		worker.once('error', reject);
		worker.once('exit', (code) => reject(new Error(`app worker exited (${code}) before listening`)));
	});
	return {
		baseUrl: `http://127.0.0.1:${port}`,
		mailbox,
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
		}
	};
}
