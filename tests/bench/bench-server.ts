// Set-up shared by the save benchmarks: the test database (started and migrated), the built app served
// in this process on a loopback port, a new account signed up and one style to work in.
// Needs `npx vite build` first (it loads build/handler.js).
import { execFileSync } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';

type Handler = (req: http.IncomingMessage, res: http.ServerResponse, next: () => void) => void;

export interface BenchServer {
	/** One request as the signed-in user (JSON body, or a form when `form` is given). */
	call(method: string, p: string, body?: unknown, form?: Record<string, string>): Promise<Response>;
	readonly studioId: string;
	readonly styleId: string;
	close(): void;
}

/** Starts the test cluster (idempotent, DARTELIER_TEST_PG_PORT) and gives its database's URL. */
export function testClusterUrl(): string {
	return execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start test >&2 && printf %s "$DATABASE_URL"'], { encoding: 'utf8' }).trim();
}

export async function benchServer(): Promise<BenchServer> {
	const url = testClusterUrl();
	process.env.DATABASE_URL = url;
	process.env.BODY_SIZE_LIMIT = '8M';
	const db = dbCreate(url, 1);
	await migrateToLatest(db);
	await db.destroy();

	let handler: Handler = (_req, res) => res.end();
	const server = http.createServer((req, res) => handler(req, res, () => res.end()));
	await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
	const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
	process.env.ORIGIN = base; // read by adapter-node when its handler is loaded
	handler = ((await import(pathToFileURL(path.resolve('build/handler.js')).href)) as { handler: Handler }).handler;

	let cookie = '';
	async function call(method: string, p: string, body?: unknown, form?: Record<string, string>): Promise<Response> {
		const headers: Record<string, string> = { origin: base, cookie };
		let payload: string | undefined;
		if (form) {
			headers['content-type'] = 'application/x-www-form-urlencoded';
			headers.accept = 'text/html';
			payload = new URLSearchParams(form).toString();
		} else if (body !== undefined) {
			headers['content-type'] = 'application/json';
			payload = JSON.stringify(body);
		}
		const r = await fetch(base + p, { method, headers, body: payload, redirect: 'manual' });
		for (const c of r.headers.getSetCookie()) if (c.startsWith('dartelier_session=')) cookie = c.split(';')[0];
		return r;
	}

	const email = `bench-${Date.now()}@example.test`;
	const signup = await call('POST', '/signup', undefined, { name: 'Bench', email, password: 'bench-password-123', studioName: 'Bench studio' });
	if (signup.status !== 303) throw new Error(`sign-up failed: ${signup.status} ${await signup.text()}`);
	const me = await (await call('GET', '/api/me')).json();
	const studioId: string = me.memberships?.[0]?.studioId ?? me.studios?.[0]?.id;
	const style = (await (await call('POST', `/api/studios/${studioId}/styles`, { name: 'Bench style' })).json()).style;
	return { call, studioId, styleId: style.id, close: () => server.close() };
}

/** "p50 … ms, p95 … ms, max … ms" of a list of times. */
export function percentiles(times: readonly number[]): string {
	const sorted = [...times].sort((a, b) => a - b);
	const q = (p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
	return `p50 ${q(0.5).toFixed(1)} ms, p95 ${q(0.95).toFixed(1)} ms, max ${sorted.at(-1)!.toFixed(1)} ms`;
}
