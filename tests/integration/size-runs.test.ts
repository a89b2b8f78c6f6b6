// Size runs against the real PostgreSQL and the built app: the demo style replayed on other sets of
// the studio's ASTM D5585-11e1 chart (reference-values row 1, C) through the pg-boss queue, whose worker
// runs in the app process; who may start and read a run; the Sketch plan's limit of 3 sizes; cancelling.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoStyleSeed } from '../../src/lib/server/seed/demo-style';
import { measurementChartsEnsure } from '../../src/lib/server/measurements/charts';
import { measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { sizeRunsInsert } from '../../src/lib/server/repositories/size-runs';
import { stylesCreate } from '../../src/lib/server/repositories/styles';
import { startApp, type RunningApp } from './app-server';
import { memberAdd, sessionClient, studioMake, testDb, testDbClose, userMake, type Client } from './helpers';
import { sizeRunWorld } from './size-run-support';

let app: RunningApp;
let studioId: string;
let styleId: string;
let sets: Map<string, string>;
let c: Record<'owner' | 'patterncutter' | 'designer' | 'sampleroom', Client>;

beforeAll(async () => {
	app = await startApp();
	const world = await sizeRunWorld(app.baseUrl, 'Grading', ['owner', 'patterncutter', 'designer', 'sampleroom']);
	({ studioId, as: c, sets } = world);
	styleId = (await demoStyleSeed(testDb(), studioId, { patterncutter: world.users.patterncutter, designer: world.users.designer })).styleId;
}, 120_000);

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const runsPath = () => `/api/studios/${studioId}/styles/${styleId}/size-runs`;

/** Reads the run until it has finished (the worker polls the queue every half second). */
async function finished(client: Client, id: string) {
	for (let i = 0; i < 240; i++) {
		const r = await client.api('GET', `/api/studios/${studioId}/size-runs/${id}`);
		expect(r.status).toBe(200);
		const body = (await r.json()) as { sizeRun: { status: string } & Record<string, unknown> };
		if (!['queued', 'running'].includes(body.sizeRun.status)) return body.sizeRun;
		await new Promise((resolve) => setTimeout(resolve, 250));
	}
	throw new Error('the size run did not finish');
}

describe('size runs of the demo style', () => {
	it('a pattern cutter starts a run over three sizes: 202, then the worker makes every size with every check passing', async () => {
		const ids = ['astm-d5585/curvy/8', 'astm-d5585/curvy/10', 'astm-d5585/curvy/12'].map((k) => sets.get(k)!);
		const r = await c.patterncutter.api('POST', runsPath(), { measurementSetIds: ids });
		expect(r.status).toBe(202);
		const { sizeRun } = (await r.json()) as { sizeRun: { id: string; status: string } };
		expect(sizeRun.status).toBe('queued');
		const run = (await finished(c.patterncutter, sizeRun.id)) as unknown as {
			status: string;
			progress: { stepsDone: number; stepsTotal: number };
			sizes: { measurementSetId: string; status: string; pieces: { name: string; made: boolean; metrics: { areaMm2: number } }[]; failures: unknown[]; checks: { passed: number; failed: number } }[];
		};
		expect(run.status).toBe('done');
		expect(run.progress.stepsTotal).toBeGreaterThan(0);
		expect(run.progress.stepsDone).toBe(run.progress.stepsTotal);
		expect(run.sizes.map((s) => s.measurementSetId)).toEqual(ids);
		for (const s of run.sizes) {
			expect(s.status).toBe('done');
			expect(s.failures).toEqual([]);
			expect(s.checks.failed).toBe(0);
			expect(s.checks.passed).toBeGreaterThan(0);
			expect(s.pieces.every((p) => p.made)).toBe(true);
		}
		// a larger size makes a larger band
		const band = (k: number) => run.sizes[k].pieces.find((p) => p.name === 'Midriff band')!.metrics.areaMm2;
		expect(band(0)).toBeLessThan(band(1));
		expect(band(1)).toBeLessThan(band(2));
		// the designer reads it too; the sample room does not see drafts
		expect((await c.designer.api('GET', `/api/studios/${studioId}/size-runs/${sizeRun.id}`)).status).toBe(200);
		expect((await c.sampleroom.api('GET', `/api/studios/${studioId}/size-runs/${sizeRun.id}`)).status).toBe(403);
		const list = (await (await c.owner.api('GET', runsPath())).json()) as { sizeRuns: { id: string }[] };
		expect(list.sizeRuns.map((x) => x.id)).toContain(sizeRun.id);
	}, 120_000);

	it('a size that cannot be made is reported with its piece, step and reason, and does not stop the others', async () => {
		// the straight-waist size 6 leaves a segment shorter than the outline checks allow at the carry
		const ids = [sets.get('astm-d5585/straight/6')!, sets.get('astm-d5585/curvy/14')!];
		const r = await c.owner.api('POST', runsPath(), { measurementSetIds: ids });
		expect(r.status).toBe(202);
		const { sizeRun } = (await r.json()) as { sizeRun: { id: string } };
		const run = (await finished(c.owner, sizeRun.id)) as unknown as { status: string; sizes: { status: string; failures: { pieceName: string; op: string; step: number; message: string }[] }[] };
		expect(run.status).toBe('done');
		expect(run.sizes[0].status).toBe('failed');
		expect(run.sizes[0].failures[0]).toMatchObject({ pieceName: 'Midriff band', op: 'carry', step: 1 });
		expect(run.sizes[0].failures[0].message).toMatch(/^the shaping carried into the style seam cannot be made on this size: /);
		expect(run.sizes[1].status).toBe('done');
	}, 120_000);

	it('only pattern cutters and owners start a run', async () => {
		const body = { measurementSetIds: [sets.get('astm-d5585/curvy/10')!] };
		expect((await c.designer.api('POST', runsPath(), body)).status).toBe(403);
		expect((await c.sampleroom.api('POST', runsPath(), body)).status).toBe(403);
	});

	it('refuses bodies that name no set, a set twice, or another studio’s set', async () => {
		const empty = await c.patterncutter.api('POST', runsPath(), { measurementSetIds: [] });
		expect(empty.status).toBe(400);
		const id = sets.get('astm-d5585/curvy/10')!;
		const twice = await c.patterncutter.api('POST', runsPath(), { measurementSetIds: [id, id] });
		expect(twice.status).toBe(400);
		const other = await studioMake('Elsewhere');
		await measurementChartsEnsure(testDb(), other.id);
		const foreign = (await measurementSetsOfStudio(testDb(), other.id))[0].id;
		const r = await c.patterncutter.api('POST', runsPath(), { measurementSetIds: [foreign] });
		expect(r.status).toBe(404);
	});

	it('cancels a queued run, and answers 409 for one that has finished', async () => {
		const u = await userMake('canceller');
		const run = await sizeRunsInsert(testDb(), { studioId, styleId, createdBy: u.id, sizes: [{ measurementSetId: sets.get('astm-d5585/curvy/10')!, name: 'size 10' }] });
		const r = await c.patterncutter.api('DELETE', `/api/studios/${studioId}/size-runs/${run.id}`);
		expect(r.status).toBe(200);
		const body = (await r.json()) as { sizeRun: { status: string; sizes: { status: string }[] } };
		expect(body.sizeRun.status).toBe('cancelled');
		expect(body.sizeRun.sizes[0].status).toBe('cancelled');
		expect((await c.patterncutter.api('DELETE', `/api/studios/${studioId}/size-runs/${run.id}`)).status).toBe(409);
	});
});

describe('the Sketch plan', () => {
	it('allows size runs of up to 3 sizes: a fourth is refused with 402 plan_limit', async () => {
		const studio = await studioMake('Sketchbook');
		const owner = await userMake('sketch-owner');
		await memberAdd(studio.id, owner.id, 'owner');
		const client = await sessionClient(app.baseUrl, owner.id);
		await measurementChartsEnsure(testDb(), studio.id);
		const style = await stylesCreate(testDb(), { studioId: studio.id, name: 'Plain bodice', createdBy: owner.id });
		const ids = (await measurementSetsOfStudio(testDb(), studio.id)).slice(0, 4).map((s) => s.id);
		const r = await client.api('POST', `/api/studios/${studio.id}/styles/${style.id}/size-runs`, { measurementSetIds: ids });
		expect(r.status).toBe(402);
		const body = (await r.json()) as { error: { code: string; message: string } };
		expect(body.error.code).toBe('plan_limit');
		expect(body.error.message).toMatch(/3 sizes/);
	});
});
