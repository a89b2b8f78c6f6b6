// The app survives its database going away: PostgreSQL (the test cluster) is restarted twice, with a
// fast stop and then an immediate stop (a crash), while a client keeps reading and saving versions
// against the BUILT app running as its own process. Checked: the process never exits; while the
// database is away answers are 503 (never 500, never a request hanging past 10 s); once it is back
// every request succeeds; every save acknowledged with 201 is stored and nothing half-written is.
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { appProcessStart, type AppProcess } from './app-process';
import { memberAdd, sessionClient, studioMake, testDbClose, userMake, type Client } from './helpers';
import { pivotSaveBody } from './pivot-save';

const HUNG_MS = 10_000;

interface Answer {
	kind: 'read' | 'save';
	status: number | 'hung' | 'refused';
	phase: 'before' | 'outage' | 'after';
	versionId?: string;
}

let app: AppProcess;
let c: Client;
let studioId: string;
let pieceId: string;

function cluster(action: 'start' | 'stop', mode = 'fast') {
	execFileSync('bash', ['scripts/db.sh', action, 'test', mode], { stdio: ['ignore', 'ignore', 'inherit'] });
}

async function call(method: string, path: string, json?: unknown): Promise<Response | 'hung' | 'refused'> {
	try {
		return await c.api(method, path, json);
	} catch (e) {
		if ((e as Error).name === 'TimeoutError' || (e as Error).name === 'AbortError') return 'hung';
		return 'refused'; // the app process itself did not answer (it would have exited)
	}
}

/** A page as a browser asks for it (a form post when `form` is given). */
async function pageAnswer(path: string, form?: Record<string, string>) {
	const r = form ? await c.post(path, form) : await c.get(path);
	return { status: r.status, type: r.headers.get('content-type') ?? '', text: await r.text() };
}

/** Reads the head and saves the next pivot on it, again and again, until `stop()` says so. */
function clientLoop(answers: Answer[], phase: () => Answer['phase']) {
	let running = true;
	const done = (async () => {
		while (running) {
			const p = phase();
			const read = await call('GET', `/api/studios/${studioId}/pieces/${pieceId}`);
			if (typeof read === 'string') {
				answers.push({ kind: 'read', status: read, phase: p });
				continue;
			}
			answers.push({ kind: 'read', status: read.status, phase: p });
			if (read.status !== 200) {
				await new Promise((r) => setTimeout(r, 100));
				continue;
			}
			const head = (await read.json()).shown as { id: string; geometry: Piece };
			const p2 = phase();
			const save = await call('POST', `/api/studios/${studioId}/pieces/${pieceId}/versions`, pivotSaveBody(head));
			if (typeof save === 'string') {
				answers.push({ kind: 'save', status: save, phase: p2 });
				continue;
			}
			const body = await save.json();
			answers.push({ kind: 'save', status: save.status, phase: p2, versionId: body.version?.id });
		}
	})();
	return {
		async stop() {
			running = false;
			await done;
		}
	};
}

beforeAll(async () => {
	app = await appProcessStart(inject('databaseUrl'));
	const owner = await userMake('outage-owner');
	const studio = await studioMake('Outage');
	studioId = studio.id;
	await memberAdd(studioId, owner.id, 'owner');
	c = await sessionClient(app.baseUrl, owner.id);
	const origRequest = c.request.bind(c);
	// every request of this test gives up after HUNG_MS: a hung request is a failure, not a wait
	c.request = (method, path, o = {}) => origRequest(method, path, { ...o, signal: AbortSignal.timeout(HUNG_MS) });
	const s = await c.api('POST', `/api/studios/${studioId}/styles`, { name: 'Outage bodice', code: 'LR-503', season: 'AW27' });
	const styleId = (await s.json()).style.id;
	const p = await c.api('POST', `/api/studios/${studioId}/styles/${styleId}/pieces`, {
		name: 'Front',
		geometry: frontBodiceBlock(),
		origin: { op: 'draft', params: { note: 'block' } }
	});
	expect(p.status).toBe(201);
	pieceId = (await p.json()).piece.id;
}, 60_000);

afterAll(async () => {
	cluster('start'); // whatever happened, the next tests find their database
	await app?.stop();
	await testDbClose();
});

describe('the database goes away and comes back', () => {
	it('keeps the app running, answers 503 while the database is away, serves again after, and loses nothing acknowledged', async () => {
		const answers: Answer[] = [];
		const pagesWhileAway: { status: number; type: string; text: string }[] = [];
		let phase: Answer['phase'] = 'before';
		const loop = clientLoop(answers, () => phase);
		const settle = (ms: number) => new Promise((r) => setTimeout(r, ms));
		await settle(1500);
		for (const mode of ['fast', 'immediate']) {
			phase = 'outage';
			cluster('stop', mode);
			await settle(500);
			pagesWhileAway.push(await pageAnswer(`/studios/${studioId}`));
			pagesWhileAway.push(await pageAnswer('/signin', { email: 'someone@example.test', password: 'not-the-password' }));
			await settle(2000); // requests keep coming while it is down
			cluster('start');
			// requests already under way when it came back may still have met the outage
			await settle(500);
			phase = 'after';
			await settle(2500);
		}
		await loop.stop();

		// people get a page that says what is happening, with a Retry-After, not an error dump
		expect(pagesWhileAway).toHaveLength(4);
		for (const p of pagesWhileAway) {
			expect(p.status).toBe(503);
			expect(p.type).toContain('text/html');
			expect(p.text).toContain("The studio's database is not reachable right now");
		}

		expect(app.exited(), `the app process exited:\n${app.output()}`).toBeNull();
		const count = (f: (a: Answer) => boolean) => answers.filter(f).length;
		expect(count((a) => a.status === 'hung'), 'requests hung past 10 s').toBe(0);
		expect(count((a) => a.status === 'refused'), 'requests the app did not answer').toBe(0);
		expect(count((a) => a.status === 500), 'answers 500').toBe(0);
		// every answer is a success, 503 while away, or 409 for a save whose base moved under it
		// (a save stored just before the connection dropped, its answer lost)
		const odd = answers.filter((a) => ![200, 201, 409, 503].includes(a.status as number));
		expect(odd, JSON.stringify(odd)).toEqual([]);
		expect(count((a) => a.phase === 'outage' && a.status === 503), 'the outage was seen').toBeGreaterThan(0);
		const after = answers.filter((a) => a.phase === 'after');
		expect(after.length).toBeGreaterThan(4);
		expect(after.filter((a) => a.status !== 200 && a.status !== 201), 'after the restart').toEqual([]);
		expect(count((a) => a.phase === 'before' && a.kind === 'save' && a.status === 201)).toBeGreaterThan(0);

		// nothing acknowledged is lost, nothing half-written is stored
		const overview = await (await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}`)).json();
		const versions = overview.versions as { id: string; number: number }[];
		const stored = new Set(versions.map((v) => v.id));
		const acknowledged = answers.filter((a) => a.status === 201).map((a) => a.versionId!);
		expect(acknowledged.filter((id) => !stored.has(id)), 'acknowledged but not stored').toEqual([]);
		const numbers = versions.map((v) => v.number).sort((a, b) => a - b);
		expect(numbers).toEqual(numbers.map((_, i) => i + 1));
		expect(overview.piece.headNumber).toBe(numbers.length);
		expect(overview.shown.id).toBe(versions.find((v) => v.number === numbers.length)!.id);
		for (const v of versions) {
			const r = await c.api('GET', `/api/studios/${studioId}/pieces/${pieceId}/versions/${v.id}`);
			expect(r.status).toBe(200);
			expect((await r.json()).version.geometry.outline.segments.length).toBeGreaterThan(3);
		}
	}, 120_000);
});
