// Runs the BUILT app as its own Node process (`node build`, as `npm start` does), for tests that
// must see whether the process itself survives. Build first: `npx vite build`.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { childStop, childTrack } from '../child-processes';

export interface AppProcess {
	baseUrl: string;
	child: ChildProcess;
	/** Set when the process ended: its exit code or signal. */
	exited: () => { code: number | null; signal: NodeJS.Signals | null } | null;
	/** What the process printed (stdout and stderr), for failure messages. */
	output: () => string;
	stop(): Promise<void>;
}

async function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const srv = createServer();
		srv.listen(0, '127.0.0.1', () => {
			const addr = srv.address();
			srv.close(() => (typeof addr === 'object' && addr ? resolve(addr.port) : reject(new Error('no port'))));
		});
	});
}

export async function appProcessStart(databaseUrl: string, extraEnv: NodeJS.ProcessEnv = {}): Promise<AppProcess> {
	if (!existsSync('build/index.js')) throw new Error('build/index.js is missing: run `npx vite build` first');
	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const child = spawn(process.execPath, ['build'], {
		env: {
			...process.env,
			LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
			DATABASE_URL: databaseUrl,
			HOST: '127.0.0.1',
			PORT: String(port),
			ORIGIN: baseUrl,
			BODY_SIZE_LIMIT: '12M',
			...extraEnv
		},
		stdio: ['ignore', 'pipe', 'pipe']
	});
	childTrack(child);
	let out = '';
	child.stdout?.on('data', (d) => (out += String(d)));
	child.stderr?.on('data', (d) => (out += String(d)));
	let ended: { code: number | null; signal: NodeJS.Signals | null } | null = null;
	child.on('exit', (code, signal) => (ended = { code, signal }));
	const until = Date.now() + 30_000;
	for (;;) {
		if (ended) throw new Error(`the app exited before serving:\n${out}`);
		try {
			await fetch(baseUrl, { signal: AbortSignal.timeout(2000) });
			break;
		} catch {
			if (Date.now() > until) {
				await childStop(child);
				throw new Error(`the app did not answer within 30 s:\n${out}`);
			}
			await new Promise((r) => setTimeout(r, 200));
		}
	}
	return {
		baseUrl,
		child,
		exited: () => ended,
		output: () => out,
		/** SIGTERM (the app finishes its requests in flight), SIGKILL after 10 s; resolves once it has exited. */
		stop: () => childStop(child)
	};
}
