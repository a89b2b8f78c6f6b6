// Beyond one machine (README): two processes of the BUILT app (`node build`) on two ports against one
// database, as behind a load balancer. Checked: a session made by signing in on one is good on the other
// (and signing out on the other ends it on both, once the change notice is heard); the same save sent to
// both at once on one base is stored once and refused 409 once, and the style read and version list both
// processes kept show it; a size run queued through the first, whose queue worker is turned off
// (DARTELIER_SIZE_RUN_WORKER=off), is done by the second's worker (its log names the run).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { frontBodiceBlock } from '../../src/lib/pattern/fixtures/front-bodice-block';
import { measurementChartsEnsure } from '../../src/lib/server/measurements/charts';
import { measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { demoStyleSeed } from '../../src/lib/server/seed/demo-style';
import { appProcessStart, type AppProcess } from './app-process';
import { Client, memberAdd, sessionClient, signedInClient, studioMake, studioOnStudioPlan, testDb, testDbClose, throttleAddressReset, userMake } from './helpers';
import { pivotSaveBody } from './pivot-save';

let first: AppProcess;
let second: AppProcess;

beforeAll(async () => {
	await throttleAddressReset();
	// the first takes requests and queues runs but works on no job; the second runs a worker as usual
	[first, second] = await Promise.all([
		appProcessStart(inject('databaseUrl'), { DARTELIER_SIZE_RUN_WORKER: 'off', LOG_LEVEL: 'info' }),
		appProcessStart(inject('databaseUrl'), { LOG_LEVEL: 'info' })
	]);
}, 120_000);

afterAll(async () => {
	await Promise.all([first?.stop(), second?.stop()]);
	await testDbClose();
});

/** The same client's cookie, sent to another process. */
function sameSession(c: Client, app: AppProcess): Client {
	const other = new Client(app.baseUrl);
	other.session = c.session;
	return other;
}

describe('two app processes on one database', () => {
	it('share sessions: signed in on one, signed in on the other; signed out on the other, out on both', async () => {
		const u = await userMake('two-procs');
		const onFirst = await signedInClient(first.baseUrl, u);
		const onSecond = sameSession(onFirst, second);
		const me = await onSecond.api('GET', '/api/me');
		expect(me.status).toBe(200);
		expect((await me.json()).user.email).toBe(u.email);
		expect((await onSecond.post('/signout', {})).status).toBe(303);
		// the first kept the session it checked: the database's change notice makes it forget it, heard a
		// moment after the sign-out committed (the second, which signed out, has heard it before answering)
		expect((await onSecond.api('GET', '/api/me')).status).toBe(401);
		await expect.poll(async () => (await onFirst.api('GET', '/api/me')).status, { timeout: 2000, interval: 20 }).toBe(401);
	});

	it('store one of two saves on the same base sent to both at once, and refuse the other 409', async () => {
		const owner = await userMake('two-procs-owner');
		const studio = await studioMake('Two processes');
		await memberAdd(studio.id, owner.id, 'owner');
		const a = await sessionClient(first.baseUrl, owner.id);
		const b = sameSession(a, second);
		const style = await (await a.api('POST', `/api/studios/${studio.id}/styles`, { name: 'Shared bodice', code: 'TP-2', season: 'AW27' })).json();
		const made = await a.api('POST', `/api/studios/${studio.id}/styles/${style.style.id}/pieces`, {
			name: 'Front',
			geometry: frontBodiceBlock(),
			origin: { op: 'draft', params: { note: 'block' } }
		});
		expect(made.status).toBe(201);
		const pieceId = (await made.json()).piece.id as string;
		const path = `/api/studios/${studio.id}/pieces/${pieceId}`;
		const head = (await (await b.api('GET', path)).json()).shown;
		for (const c of [a, b]) {
			expect((await c.api('GET', `/api/studios/${studio.id}/styles/${style.style.id}`)).status).toBe(200);
			expect((await c.api('GET', `${path}/versions`)).status).toBe(200);
		}
		const body = pivotSaveBody(head);
		const answers = await Promise.all([a.api('POST', `${path}/versions`, body), b.api('POST', `${path}/versions`, body)]);
		expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
		const saved = (await answers.find((r) => r.status === 201)!.json()).version.id;
		const refused = await answers.find((r) => r.status === 409)!.json();
		expect(refused.error.code).toBe('stale_base');
		// both processes now read the one stored save as the head
		for (const c of [a, b]) {
			const now = (await (await c.api('GET', path)).json()) as { shown: { id: string }; versions: unknown[] };
			expect(now.shown.id).toBe(saved);
			expect(now.versions).toHaveLength(2);
		}
		// the style read and the version list, kept by each process since they were read before the save,
		// are read anew on both: at once on the one that stored it, a moment after on the other
		const savedBy = answers[0].status === 201 ? a : b;
		const other = savedBy === a ? b : a;
		const headOf = async (c: Client) => {
			const read = (await (await c.api('GET', `/api/studios/${studio.id}/styles/${style.style.id}`)).json()) as { pieces: { shown: { id: string } }[] };
			const list = (await (await c.api('GET', `${path}/versions`)).json()) as { versions: { id: string }[] };
			return `${read.pieces[0].shown.id} ${list.versions[0].id}`;
		};
		expect(await headOf(savedBy)).toBe(`${saved} ${saved}`);
		await expect.poll(() => headOf(other), { timeout: 2000, interval: 20 }).toBe(`${saved} ${saved}`);
	});

	it('do a size run queued through the process without a worker on the other process', async () => {
		const studio = await studioMake('Two processes grading');
		await studioOnStudioPlan(studio.id);
		const cutter = await userMake('two-procs-cutter');
		const designer = await userMake('two-procs-designer');
		await memberAdd(studio.id, cutter.id, 'patterncutter');
		await memberAdd(studio.id, designer.id, 'designer');
		await measurementChartsEnsure(testDb(), studio.id);
		const sets = new Map((await measurementSetsOfStudio(testDb(), studio.id)).map((s) => [s.chartKey, s.id]));
		const { styleId } = await demoStyleSeed(testDb(), studio.id, { patterncutter: cutter.id, designer: designer.id });
		const c = await sessionClient(first.baseUrl, cutter.id);
		const queued = await c.api('POST', `/api/studios/${studio.id}/styles/${styleId}/size-runs`, {
			measurementSetIds: ['astm-d5585/curvy/8', 'astm-d5585/curvy/12'].map((k) => sets.get(k)!)
		});
		expect(queued.status).toBe(202);
		const runId = (await queued.json()).sizeRun.id as string;
		const status = async () => (await (await c.api('GET', `/api/studios/${studio.id}/size-runs/${runId}`)).json()).sizeRun.status as string;
		await expect.poll(status, { timeout: 120_000, interval: 250 }).toBe('done');
		const doneBy = (app: AppProcess) => app.output().split('\n').some((l) => l.includes('"msg":"size run done"') && l.includes(runId));
		expect(doneBy(second)).toBe(true);
		expect(doneBy(first)).toBe(false);
	}, 180_000);
});
