// The floor of the stack under the load benchmark's conditions (not a test): the same app, database and
// sign-in as load.ts, then a few GETs, each at 50 connections for DURATION seconds (default 5).
// PROBE is a comma-separated list of paths; {studioId} and {styleId} are filled in.
// Run: npx vite build && npx tsx tests/bench/load-probe.ts   (default PROBE=/healthz,/api/me)
import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import { loadAppStart } from './load-app';

const app = await loadAppStart();
const headers = { cookie: app.cookie, accept: 'application/json' };
try {
	for (const p of (process.env.PROBE ?? '/healthz,/api/me').split(',')) {
		const url = app.base + p.replace('{studioId}', app.studioId).replace('{styleId}', app.styleId);
		const r = await autocannon({ url, connections: 50, duration: Number(process.env.DURATION ?? 5), headers });
		const load = readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
		console.log(`${p}: ${r.requests.average.toFixed(0)} req/s, p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, answers other than 2xx ${r.non2xx}, errors ${r.errors}; load ${load}`);
	}
} finally {
	await app.close();
}
process.exit(0);
