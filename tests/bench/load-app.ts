// Set-up of the load benchmark (load.ts): a database of its own (`dartelier_bench` on the test cluster,
// made afresh each run, migrated, seeded with the demo studio and its style), the object store fake, and
// the built app started as its own process (`node build`) on a loopback port, then signed in as the
// demo owner. Needs `npx vite build` first.
import { spawn, type ChildProcess } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync } from 'node:fs';
import { createServer } from 'node:net';
import pg from 'pg';
import demo from '../../fixtures/demo-studio.json';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';
import { RATE_LIMITS } from '../../src/lib/server/rate-limits';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { s3FakeStart } from '../s3-fake';
import { testClusterUrl } from './bench-server';

const BENCH_DB = 'dartelier_bench';

export interface LoadApp {
	base: string;
	/** the demo owner's session cookie (`dartelier_session=…`) */
	cookie: string;
	studioId: string;
	styleId: string;
	/** the app process's id, for reading its CPU time */
	pid: number;
	close(): Promise<void>;
}

async function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const s = createServer();
		s.once('error', reject);
		s.listen(0, '127.0.0.1', () => {
			const port = (s.address() as { port: number }).port;
			s.close(() => resolve(port));
		});
	});
}

/** The bench database, dropped and made again: every run starts from the same seeded state. */
async function benchDatabaseFresh(): Promise<string> {
	const testUrl = new URL(testClusterUrl());
	const admin = new pg.Client({ connectionString: Object.assign(new URL(testUrl), { pathname: '/postgres' }).toString() });
	await admin.connect();
	try {
		await admin.query(`drop database if exists ${BENCH_DB} with (force)`);
		await admin.query(`create database ${BENCH_DB}`);
	} finally {
		await admin.end();
	}
	return Object.assign(new URL(testUrl), { pathname: `/${BENCH_DB}` }).toString();
}

async function waitReady(base: string, child: ChildProcess): Promise<void> {
	const until = Date.now() + 30_000;
	while (Date.now() < until) {
		if (child.exitCode !== null) throw new Error(`the app exited (${child.exitCode}) before it answered; see .run/bench-load-app.log`);
		try {
			if ((await fetch(`${base}/healthz`)).ok) return;
		} catch {
			// not listening yet
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	throw new Error('the app did not answer /healthz within 30 s');
}

export async function loadAppStart(): Promise<LoadApp> {
	if (!existsSync('build/index.js')) throw new Error('build/index.js is missing: run `npx vite build` first');
	const url = await benchDatabaseFresh();
	const s3 = await s3FakeStart('bench-load');
	process.env.S3_ENDPOINT = s3.endpoint;
	process.env.S3_BUCKET = s3.bucket;
	const db = dbCreate(url, 2);
	let studioId: string;
	try {
		await migrateToLatest(db);
		({ studioId } = await demoStudioSeed(db));
	} finally {
		await db.destroy();
	}

	const port = await freePort();
	const base = `http://127.0.0.1:${port}`;
	// Every allowance far above what the run sends, so no limit decides an answer (reads and saves are
	// not limited anyway; sign-in failures are counted apart and none happen here).
	const limits = Object.fromEntries(Object.keys(RATE_LIMITS).map((name) => [`RATE_LIMIT_${name.toUpperCase()}`, '1000000']));
	mkdirSync('.run', { recursive: true });
	// the app writes its log lines straight into the file (no relay through this process)
	const appLog = openSync('.run/bench-load-app.log', 'w');
	// LOAD_PROFILE=1: the app writes a CPU profile into .run/prof when it stops
	const profile = process.env.LOAD_PROFILE ? ['--cpu-prof', '--cpu-prof-dir=.run/prof'] : [];
	const child = spawn(process.execPath, [...profile, 'build'], {
		env: {
			...process.env,
			...limits,
			DATABASE_URL: url,
			HOST: '127.0.0.1',
			PORT: String(port),
			ORIGIN: base,
			BODY_SIZE_LIMIT: '16M',
			// one JSON line per request as in production, written to a file
			LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
			S3_ENDPOINT: s3.endpoint,
			S3_BUCKET: s3.bucket
		},
		stdio: ['ignore', appLog, appLog]
	});
	closeSync(appLog);
	await waitReady(base, child);

	const owner = demo.users.find((u) => u.role === 'owner')!;
	const signin = await fetch(`${base}/signin`, {
		method: 'POST',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base, accept: 'text/html' },
		body: new URLSearchParams({ email: owner.email, password: demo.password }).toString(),
		redirect: 'manual'
	});
	const cookie = signin.headers.getSetCookie().find((c) => c.startsWith('dartelier_session='))?.split(';')[0];
	if (signin.status !== 303 || !cookie) throw new Error(`sign-in failed: ${signin.status}`);
	const styles = await (await fetch(`${base}/api/studios/${studioId}/styles`, { headers: { cookie } })).json();
	const style = (styles.styles as { id: string; code: string | null }[]).find((s) => s.code === 'LR-214') ?? styles.styles[0];

	return {
		base,
		cookie,
		studioId,
		styleId: style.id,
		pid: child.pid!,
		async close() {
			const exited = new Promise((r) => child.once('exit', r));
			child.kill('SIGTERM');
			await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
			if (child.exitCode === null) child.kill('SIGKILL');
			await s3.close();
		}
	};
}
