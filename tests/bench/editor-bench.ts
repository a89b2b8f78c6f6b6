// Editor benchmark (not a test): `npx vite build && npx tsx tests/bench/editor-bench.ts`.
// Serves the BUILT app on a free loopback port with the test database, drives Debian's Chromium through
// playwright-core, makes a style of 50 pieces of about 500 outline vertices through the API, and prints:
//   - time to open the editor (navigation to the first frame with every piece drawn),
//   - frame intervals while dragging a piece on the table,
//   - frame intervals and script ms per frame while a pivot previews live during a drag.
import { execFileSync, spawn } from 'node:child_process';
import { createServer } from 'node:net';
import { chromium, type CDPSession, type Page } from 'playwright-core';
import { segmentSplitAtMany, vecLerp, type Segment } from '../../src/lib/geometry';
import { frontBodiceBlock, FRONT_BLOCK_BUST_POINT } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { pieceFromInput } from '../../src/lib/pattern/piece';
import type { Piece } from '../../src/lib/pattern/piece-schema';

const PIECES = Number(process.env.BENCH_PIECES ?? 50);
const VERTICES = Number(process.env.BENCH_VERTICES ?? 500);

/** The demo block with its seams cut into many short segments (dart legs kept whole). */
function denseBlock(i: number): Piece {
	const b = frontBodiceBlock();
	const bp = FRONT_BLOCK_BUST_POINT;
	const isLeg = (s: Segment) => s.kind === 'line' && (Math.hypot(s.p0.x - bp.x, s.p0.y - bp.y) < 1e-6 || Math.hypot(s.p1.x - bp.x, s.p1.y - bp.y) < 1e-6);
	const body = b.outline.segments.filter((s) => !isLeg(s)).length;
	const legs = b.outline.segments.length - body;
	const per = Math.max(1, Math.round((VERTICES - legs) / body));
	const segments: Segment[] = [];
	for (const s of b.outline.segments) {
		if (isLeg(s)) segments.push(s);
		else if (s.kind === 'line') for (let k = 0; k < per; k++) segments.push({ kind: 'line', p0: vecLerp(s.p0, s.p1, k / per), p1: vecLerp(s.p0, s.p1, (k + 1) / per) });
		else segments.push(...segmentSplitAtMany(s, Array.from({ length: per - 1 }, (_, k) => (k + 1) / per)));
	}
	return pieceFromInput({ ...b, id: `bench-${i}`, name: `Bench piece ${i + 1}`, outline: { segments } });
}

async function freePort(): Promise<number> {
	return new Promise((resolve) => {
		const srv = createServer();
		srv.listen(0, '127.0.0.1', () => {
			const a = srv.address();
			srv.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
		});
	});
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;
const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * p))] ?? NaN;
const f1 = (n: number) => n.toFixed(1);

async function frameRecorderStart(page: Page) {
	// a string, so that the TypeScript loader adds no helpers the page does not have
	await page.evaluate(`(() => {
		window.__frames = [];
		window.__recording = true;
		const tick = (t) => { window.__frames.push(t); if (window.__recording) requestAnimationFrame(tick); };
		requestAnimationFrame(tick);
	})()`);
}

async function frameRecorderStop(page: Page): Promise<number[]> {
	const ts = await page.evaluate(() => {
		const w = window as unknown as { __frames: number[]; __recording: boolean };
		w.__recording = false;
		return w.__frames;
	});
	return ts.slice(1).map((t, i) => t - ts[i]);
}

async function scriptMs(cdp: CDPSession): Promise<number> {
	const { metrics } = await cdp.send('Performance.getMetrics');
	return (metrics.find((m) => m.name === 'ScriptDuration')?.value ?? 0) * 1000;
}

async function drag(page: Page, key: string, from: { x: number; y: number }, to: { x: number; y: number }, steps: number) {
	const toPage = (p: { x: number; y: number }) => page.evaluate(([k, q]) => window.dartelierEditor!.toPage(k as string, q as { x: number; y: number }), [key, p] as const);
	const a = await toPage(from);
	const b = await toPage(to);
	await page.mouse.move(a.x, a.y);
	await page.mouse.down();
	await page.mouse.move(a.x + 4, a.y + 4);
	for (let i = 1; i <= steps; i++) {
		await page.mouse.move(a.x + ((b.x - a.x) * i) / steps, a.y + ((b.y - a.y) * i) / steps);
		await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
	}
	await page.mouse.up();
}

async function main() {
	const databaseUrl = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start test >&2 && printf %s "$DATABASE_URL"'], { encoding: 'utf8' }).trim();
	const port = await freePort();
	// every run signs up a new bench owner from loopback: the sign-up limit per address must not stop it
	const app = spawn('node', ['build'], { env: { ...process.env, DATABASE_URL: databaseUrl, HOST: '127.0.0.1', PORT: String(port), ORIGIN: `http://127.0.0.1:${port}`, SMTP_HOST: '127.0.0.1', SMTP_PORT: '9', RATE_LIMIT_SIGNUP_ADDRESS: '1000000' }, stdio: ['ignore', 'ignore', 'inherit'] });
	const base = `http://127.0.0.1:${port}`;
	for (let i = 0; i < 150; i++) {
		try {
			if ((await fetch(base)).status < 500) break;
		} catch {
			/* not up yet */
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	const browser = await chromium.launch({
		executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
		args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync']
	});
	try {
		const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
		const page = await context.newPage();
		const id = Date.now().toString(36);
		const su = await page.request.post(`${base}/signup`, {
			form: { name: 'Bench Cutter', email: `bench-${id}@test.example`, password: 'linden-bench-2026', studioName: `Bench ${id}` },
			headers: { origin: base },
			maxRedirects: 0
		});
		if (su.status() >= 400) throw new Error(`sign-up: ${su.status()}`);
		const post = async (url: string, data: unknown) => {
			const r = await page.request.post(`${base}${url}`, { data });
			if (!r.ok()) throw new Error(`${url}: ${r.status()} ${await r.text()}`);
			return r.json();
		};
		// the studio the sign-up made (the free plan includes one studio per owner)
		const studio = ((await (await page.request.get(`${base}/api/studios`)).json()).studios as { id: string }[])[0];
		const style = (await post(`/api/studios/${studio.id}/styles`, { name: `Bench style ${PIECES}×${VERTICES}` })).style;
		const sample = denseBlock(0);
		for (let i = 0; i < PIECES; i++) await post(`/api/studios/${studio.id}/styles/${style.id}/pieces`, { name: `Bench piece ${i + 1}`, geometry: denseBlock(i), origin: { op: 'draft' } });
		const url = `${base}/studios/${studio.id}/styles/${style.id}/edit`;

		const opens: number[] = [];
		for (let i = 0; i < 3; i++) {
			const t0 = Date.now();
			await page.goto(url);
			await page.waitForSelector('[data-testid="editor"][data-loaded="true"]', { timeout: 60_000 });
			await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => r(null)))));
			opens.push(Date.now() - t0);
		}
		const cdp = await context.newCDPSession(page);
		await cdp.send('Performance.enable');
		const keys = await page.evaluate(() => window.dartelierEditor!.pieceKeys());
		const key = keys[Math.floor(keys.length / 2)];

		// drag a whole piece on the table (select tool)
		await page.click('[data-tool="select"]');
		await page.evaluate(() => new Promise((r) => setTimeout(r, 400)));
		await frameRecorderStart(page);
		let s0 = await scriptMs(cdp);
		await drag(page, key, { x: 40, y: 300 }, { x: 340, y: 420 }, 60);
		let s1 = await scriptMs(cdp);
		const dragFrames = await frameRecorderStop(page);
		const dragScript = (s1 - s0) / Math.max(1, dragFrames.length);

		// pivot with live preview: drag the shoulder dart's opening down the side seam
		await page.click('[data-tool="pivot"]');
		await page.evaluate(() => new Promise((r) => setTimeout(r, 400)));
		const d = sample.darts[0];
		const bp = FRONT_BLOCK_BUST_POINT;
		await frameRecorderStart(page);
		s0 = await scriptMs(cdp);
		const t0 = Date.now();
		await drag(page, key, vecLerp(bp, d.leg1End, 0.85), { x: 235 - (10 * 70) / 210, y: 300 }, 60);
		const pivotWall = Date.now() - t0;
		s1 = await scriptMs(cdp);
		const pivotFrames = await frameRecorderStop(page);
		const pivotScript = (s1 - s0) / Math.max(1, pivotFrames.length);
		const recipe = await page.locator('[data-testid="recipe"] li').first().textContent();

		console.log(`Editor benchmark: ${PIECES} pieces × ${sample.outline.segments.length} outline segments, Chromium headless (no GPU), 1440×900`);
		console.log(`  open the editor (navigation → every piece drawn): median ${median(opens)} ms (runs: ${opens.join(', ')})`);
		console.log(`  drag a piece: frame interval median ${f1(median(dragFrames))} ms, p95 ${f1(pct(dragFrames, 0.95))} ms (${dragFrames.length} frames), script ${f1(dragScript)} ms per frame`);
		console.log(`  pivot with live preview: frame interval median ${f1(median(pivotFrames))} ms, p95 ${f1(pct(pivotFrames, 0.95))} ms, script ${f1(pivotScript)} ms per frame, 60 pointer steps in ${pivotWall} ms`);
		console.log(`  recipe after the pivot drag: ${recipe?.replace(/\s+/g, ' ').trim().slice(0, 100)}`);
	} finally {
		await browser.close();
		app.kill('SIGTERM');
	}
}

main().catch((e) => {
	console.error(e);
	process.exit(1);
});
