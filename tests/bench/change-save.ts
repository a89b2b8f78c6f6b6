// Benchmark: saving a carry of two 2,000-vertex panels as one style change through the API on loopback
// (the server loads both base versions, recomputes the carry, compares every new piece, runs the checks
// across the pieces, stores the change, the new pieces and their first versions in one transaction).
// Run: npx vite build && npx tsx tests/bench/change-save.ts   (uses the test database)
import { execFileSync } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { lineSegment } from '../../src/lib/pattern/kernel';
import { benchPanels } from '../../src/lib/pattern/panels/fixtures/bench-pieces';
import { changeRecompute, type ChangeStep } from '../../src/lib/pattern/recipe/change';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';

const SAVES = Number(process.env.SAVES ?? 40);
const VERTICES = 2000;

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

// two panels whose seam opens as a 12° wedge below D (bench-pieces.ts), stored as version 1 each
const { panels, seams } = benchPanels(VERTICES);
const stored: { id: string; v1: string }[] = [];
for (const [i, g] of panels.entries()) {
	const r = await (await call('POST', `/api/studios/${studioId}/styles/${style.id}/pieces`, { name: `Panel ${i + 1}`, geometry: g, origin: { op: 'draft' } })).json();
	stored.push({ id: r.piece.id, v1: r.version.id });
}
const styleLine = { segments: [lineSegment({ x: -10, y: 200 }, { x: 220, y: 200 })] };
const steps: ChangeStep[] = [{ op: 'carry', sources: stored.map((s) => ({ pieceId: s.id })), params: { seams, styleLine, fuse: 'below', name: 'Band' } }];
const rc = changeRecompute(new Map(stored.map((s, i) => [s.id, panels[i]])), steps);
if (!rc.ok) throw new Error(rc.message);
const body = {
	message: 'Carry into the style seam',
	bases: stored.map((s) => ({ pieceId: s.id, versionId: s.v1 })),
	steps,
	pieces: rc.unused.map((u, n) => ({ ...u, name: `New piece ${n + 1}`, cut: 'pair', geometry: rc.steps[u.step].result.pieces[u.result] }))
};
const vertices = body.pieces.reduce((t, p) => t + p.geometry.outline.segments.length, 0);

// the sources stay the heads (a change makes new pieces), so the same change can be saved again and again
const times: number[] = [];
for (let i = 0; i < SAVES; i++) {
	const t0 = performance.now();
	const res = await call('POST', `/api/studios/${studioId}/styles/${style.id}/changes`, body);
	const t1 = performance.now();
	if (res.status !== 201) throw new Error(`save ${i}: ${res.status} ${await res.text()}`);
	await res.arrayBuffer();
	times.push(t1 - t0);
}
server.close();
const sorted = [...times].sort((a, b) => a - b);
const q = (p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
console.log(`change save, carry of two ${VERTICES}-vertex panels (${body.pieces.length} new pieces, ${vertices} segments), ${SAVES} saves on loopback: p50 ${q(0.5).toFixed(1)} ms, p95 ${q(0.95).toFixed(1)} ms, max ${sorted.at(-1)!.toFixed(1)} ms`);
process.exit(0);
