// Benchmark: saving a version of a 2,000-vertex piece through the API on loopback (the server
// replays the pivot, recomputes metrics, runs the checks, stores the version in one transaction).
// Run: npx vite build && npx tsx tests/bench/version-save.ts   (uses the test database)
import { execFileSync } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { pivot } from '../../src/lib/pattern/operations/pivot';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';
import { benchPiece } from './big-piece';

const SAVES = Number(process.env.SAVES ?? 60);

const url = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start test >&2 && printf %s "$DATABASE_URL"'], { encoding: 'utf8' }).trim();
process.env.DATABASE_URL = url;
process.env.BODY_SIZE_LIMIT = '8M';
const db = dbCreate(url, 1);
await migrateToLatest(db);
await db.destroy();

type Handler = (req: http.IncomingMessage, res: http.ServerResponse, next: () => void) => void;
let handler: Handler = (_req, res) => res.end();
const server = http.createServer((req, res) => handler(req, res, () => res.end()));
await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
process.env.ORIGIN = base; // read by adapter-node when its handler is loaded
handler = ((await import(pathToFileURL(path.resolve('build/handler.js')).href)) as { handler: Handler }).handler;

let cookie = '';
async function call(method: string, p: string, body?: unknown, form?: Record<string, string>) {
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
let piece: Piece = benchPiece(2000);
const created = await (await call('POST', `/api/studios/${studioId}/styles/${style.id}/pieces`, { name: 'Bench piece', geometry: piece, origin: { op: 'draft' } })).json();
const pieceId: string = created.piece.id;
let head: string = created.version.id;

const times: number[] = [];
for (let i = 0; i < SAVES; i++) {
	// Move the dart to the middle of an outline segment further round each time.
	const segs = piece.outline.segments;
	const k = [300, 700, 1100, 1500][i % 4];
	const s = segs[k];
	const to = s.kind === 'line' ? { x: (s.p0.x + s.p1.x) / 2, y: (s.p0.y + s.p1.y) / 2 } : s.p0;
	const params = { dartId: 'd', to };
	const r = pivot(piece, params);
	if (!r.ok) throw new Error(r.error.message);
	const t0 = performance.now();
	const res = await call('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, { baseVersionId: head, message: `pivot ${i}`, geometry: r.piece, recipe: [{ op: 'pivot', params }] });
	const t1 = performance.now();
	if (res.status !== 201) throw new Error(`save ${i}: ${res.status} ${await res.text()}`);
	head = (await res.json()).version.id;
	piece = r.piece;
	times.push(t1 - t0);
}
server.close();
const sorted = [...times].sort((a, b) => a - b);
const q = (p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
console.log(`version save, 2,000-vertex piece, ${SAVES} saves on loopback: p50 ${q(0.5).toFixed(1)} ms, p95 ${q(0.95).toFixed(1)} ms, max ${sorted.at(-1)!.toFixed(1)} ms`);
process.exit(0);
