// Ad-hoc: request rates of a few GETs (floor of the stack), 5 s each at 50 connections.
import autocannon from 'autocannon';
import { loadAppStart } from './load-app';
const app = await loadAppStart();
const headers = { cookie: app.cookie, accept: 'application/json' };
for (const p of (process.env.PROBE ?? '/healthz,/api/me').split(',')) {
	const url = app.base + p.replace('{studioId}', app.studioId).replace('{styleId}', app.styleId);
	const r = await autocannon({ url, connections: 50, duration: Number(process.env.DURATION ?? 5), headers });
	console.log(p, 'req/s', r.requests.average, 'p50', r.latency.p50, 'p99', r.latency.p99, 'non2xx', r.non2xx, 'load', (await import('node:fs')).readFileSync('/proc/loadavg', 'utf8').trim());
}
await app.close();
process.exit(0);
