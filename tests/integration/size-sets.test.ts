// Size sets against the real PostgreSQL and the built app: a done size run of the demo style (sizes of the
// studio's ASTM D5585-11e1 chart, reference-values row 1, C) kept as a size set; the server makes every
// kept size again and stores each piece as a version of its own, linked to the base piece and version;
// sizes are signed off one by one or all at once; who may keep, sign off and read; the refusals.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pieceSchema } from '../../src/lib/pattern/piece-schema';
import { sizeResult } from '../../src/lib/pattern/grading/size-result';
import { pieceGeometryDifference } from '../../src/lib/pattern/verify/piece-compare';
import { measurementChartsEnsure } from '../../src/lib/server/measurements/charts';
import { measurementsMmOf } from '../../src/lib/server/measurements/sets';
import { measurementSetsInStudio, measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { piecesOfStyle } from '../../src/lib/server/repositories/pieces';
import { sizeRunsInsert } from '../../src/lib/server/repositories/size-runs';
import { stylesCreate } from '../../src/lib/server/repositories/styles';
import { demoStyleSeed } from '../../src/lib/server/seed/demo-style';
import { sizeRunExecute } from '../../src/lib/server/size-runs/run';
import { styleRecipeLoad } from '../../src/lib/server/size-runs/style-recipe-load';
import { startApp, type RunningApp } from './app-server';
import { memberAdd, sessionClient, studioMake, testDb, testDbClose, userMake, type Client } from './helpers';
import { sizeRunWorld } from './size-run-support';

type RoleName = 'owner' | 'patterncutter' | 'designer' | 'sampleroom';
let app: RunningApp;
let studioId: string;
let styleId: string;
let sets: Map<string, string>;
let users: Record<RoleName, string>;
let c: Record<RoleName, Client>;

interface PieceOut { id: string; name: string; basePieceId: string; baseVersionId: string; baseVersionNumber: number; metrics: unknown }
interface SizeOut { id: string; measurementSetId: string; name: string; state: string; signedOffBy: { id: string; name: string } | null; signedOffAt: string | null; checks: { passed: number; failed: number }; pieces?: PieceOut[] }
interface SetOut { id: string; sizeRunId: string; name: string; signedOff: number; sizes: SizeOut[] }

beforeAll(async () => {
	app = await startApp();
	({ studioId, users, as: c, sets } = await sizeRunWorld(app.baseUrl, 'Size sets', ['owner', 'patterncutter', 'designer', 'sampleroom']));
	styleId = (await demoStyleSeed(testDb(), studioId, { patterncutter: users.patterncutter, designer: users.designer })).styleId;
}, 120_000);

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

/** A run of the demo style over these chart sizes, made in this process (the queue is not needed to make it). */
async function runMade(keys: string[]) {
	const sizes = keys.map((k) => ({ measurementSetId: sets.get(k)!, name: k }));
	const run = await sizeRunsInsert(testDb(), { studioId, styleId, createdBy: users.patterncutter, sizes });
	await sizeRunExecute(testDb(), run.id);
	return run.id;
}

const keep = (client: Client, runId: string, body: unknown = {}) => client.api('POST', `/api/studios/${studioId}/size-runs/${runId}/keep`, body);
const signOff = (client: Client, setId: string, body: unknown) => client.api('POST', `/api/studios/${studioId}/size-sets/${setId}/sign-off`, body);
const setGet = (client: Client, setId: string) => client.api('GET', `/api/studios/${studioId}/size-sets/${setId}`);
const errorOf = async (r: Response) => ((await r.json()) as { error: { code: string; message: string; fields?: Record<string, string[]> } }).error;

describe('keeping a size run', () => {
	let runId: string;
	let set: SetOut;

	beforeAll(async () => {
		runId = await runMade(['astm-d5585/curvy/8', 'astm-d5585/curvy/12', 'astm-d5585/curvy/16']);
	}, 60_000);

	it('a pattern cutter keeps a done run: 201, one size per size of the run, each piece a version linked to its base piece and version', async () => {
		const r = await keep(c.patterncutter, runId, { name: 'Spring range' });
		expect(r.status).toBe(201);
		set = ((await r.json()) as { sizeSet: SetOut }).sizeSet;
		expect(set.name).toBe('Spring range');
		expect(set.sizeRunId).toBe(runId);
		expect(set.sizes.map((s) => s.measurementSetId)).toEqual(['8', '12', '16'].map((n) => sets.get(`astm-d5585/curvy/${n}`)));
		const base = await piecesOfStyle(testDb(), styleId);
		for (const s of set.sizes) {
			expect(s.state).toBe('draft');
			expect(s.signedOffBy).toBeNull();
			expect(s.pieces!.map((p) => p.basePieceId).sort()).toEqual(base.filter((p) => p.headVersionId).map((p) => p.id).sort());
			for (const p of s.pieces!) {
				const b = base.find((x) => x.id === p.basePieceId)!;
				expect(p.baseVersionId).toBe(b.headVersionId);
				expect(p.baseVersionNumber).toBe(b.headNumber);
				expect(p.name).toBe(b.name);
			}
		}
	});

	it('stores for each size the pieces the run reported, measuring the same, with the geometry the style replays to', async () => {
		const run = (await (await c.owner.api('GET', `/api/studios/${studioId}/size-runs/${runId}`)).json()) as {
			sizeRun: { sizes: { measurementSetId: string; pieces: { pieceId: string; metrics: unknown }[] }[] };
		};
		const style = await styleRecipeLoad(testDb(), styleId);
		for (const s of set.sizes) {
			const reported = run.sizeRun.sizes.find((x) => x.measurementSetId === s.measurementSetId)!;
			for (const p of s.pieces!) expect(p.metrics, `${s.name} ${p.name}`).toEqual(reported.pieces.find((x) => x.pieceId === p.basePieceId)!.metrics);
			const ms = await measurementSetsInStudio(testDb(), studioId, s.measurementSetId);
			const again = sizeResult(style, measurementsMmOf(ms!.values));
			const rows = await testDb().selectFrom('size_set_versions').select(['base_piece_id', 'geometry']).where('size_id', '=', s.id).execute();
			expect(rows).toHaveLength(s.pieces!.length);
			for (const row of rows) {
				const made = again.heads.get(row.base_piece_id!)!;
				expect(pieceGeometryDifference(made, pieceSchema.parse(row.geometry), 1e-9)).toBeNull();
			}
		}
		// a larger size keeps a larger band
		const band = (k: number) => (set.sizes[k].pieces!.find((p) => p.name === 'Midriff band')!.metrics as { areaMm2: number }).areaMm2;
		expect(band(0)).toBeLessThan(band(1));
		expect(band(1)).toBeLessThan(band(2));
	});

	it('answers 409 already_kept for a run kept before', async () => {
		const r = await keep(c.owner, runId);
		expect(r.status).toBe(409);
		const e = await errorOf(r);
		expect(e.code).toBe('already_kept');
		expect(e.fields?.sizeSetId).toEqual([set.id]);
	});

	it('lists the style’s sets for whoever reads drafts', async () => {
		const r = await c.designer.api('GET', `/api/studios/${studioId}/styles/${styleId}/size-sets`);
		expect(r.status).toBe(200);
		const { sizeSets } = (await r.json()) as { sizeSets: SetOut[] };
		expect(sizeSets.find((s) => s.id === set.id)!.sizes.map((s) => s.state)).toEqual(['draft', 'draft', 'draft']);
	});

	it('signs one size off, recording who and when, then the rest with all; signing again is 409', async () => {
		const one = await signOff(c.designer, set.id, { sizes: [set.sizes[1].id], comment: 'Graded as drawn.' });
		expect(one.status).toBe(200);
		const after = ((await one.json()) as { signed: string[]; sizeSet: SetOut });
		expect(after.signed).toEqual([set.sizes[1].id]);
		expect(after.sizeSet.sizes.map((s) => s.state)).toEqual(['draft', 'signed_off', 'draft']);
		expect(after.sizeSet.sizes[1].signedOffBy?.id).toBe(users.designer);
		expect(Date.now() - Date.parse(after.sizeSet.sizes[1].signedOffAt!)).toBeLessThan(10 * 60_000);
		expect(after.sizeSet.signedOff).toBe(1);

		const again = await signOff(c.owner, set.id, { sizes: [set.sizes[1].id] });
		expect(again.status).toBe(409);
		expect((await errorOf(again)).code).toBe('already_signed_off');

		const all = await signOff(c.owner, set.id, { sizes: 'all' });
		expect(all.status).toBe(200);
		const whole = (await all.json()) as { signed: string[]; sizeSet: SetOut };
		expect(whole.signed.sort()).toEqual([set.sizes[0].id, set.sizes[2].id].sort());
		expect(whole.sizeSet.sizes.map((s) => s.signedOffBy?.id)).toEqual([users.owner, users.designer, users.owner]);
		expect((await signOff(c.owner, set.id, { sizes: 'all' })).status).toBe(409);
	});

	it('refuses sign-off bodies that are not valid (400) or name a size of no set (422)', async () => {
		expect((await signOff(c.owner, set.id, { sizes: 'some' })).status).toBe(400);
		expect((await signOff(c.owner, set.id, { sizes: [] })).status).toBe(400);
		expect((await signOff(c.owner, set.id, {})).status).toBe(400);
		const r = await signOff(c.owner, set.id, { sizes: ['00000000-0000-4000-8000-000000000000'] });
		expect(r.status).toBe(422);
		expect((await errorOf(r)).code).toBe('unknown_size');
	});
});

describe('who may keep, sign off and read', () => {
	let runId: string;
	let setId: string;
	let sizeIds: string[];

	beforeAll(async () => {
		runId = await runMade(['astm-d5585/curvy/10', 'astm-d5585/curvy/14']);
	}, 60_000);

	it('designers and the sample room may not keep a run (403)', async () => {
		expect((await keep(c.designer, runId)).status).toBe(403);
		expect((await keep(c.sampleroom, runId)).status).toBe(403);
		const r = await keep(c.owner, runId);
		expect(r.status).toBe(201);
		const set = ((await r.json()) as { sizeSet: SetOut }).sizeSet;
		setId = set.id;
		sizeIds = set.sizes.map((s) => s.id);
	});

	it('pattern cutters and the sample room may not sign sizes off (403): the signers of versions do', async () => {
		expect((await signOff(c.patterncutter, setId, { sizes: 'all' })).status).toBe(403);
		expect((await signOff(c.sampleroom, setId, { sizes: 'all' })).status).toBe(403);
	});

	it('the sample room sees a set only once a size is signed off, and only the signed-off sizes', async () => {
		expect((await setGet(c.sampleroom, setId)).status).toBe(404);
		const list = async () => ((await (await c.sampleroom.api('GET', `/api/studios/${studioId}/styles/${styleId}/size-sets`)).json()) as { sizeSets: SetOut[] }).sizeSets;
		expect((await list()).some((s) => s.id === setId)).toBe(false);
		expect((await signOff(c.designer, setId, { sizes: [sizeIds[0]] })).status).toBe(200);
		const seen = ((await (await setGet(c.sampleroom, setId)).json()) as { sizeSet: SetOut }).sizeSet;
		expect(seen.sizes.map((s) => s.id)).toEqual([sizeIds[0]]);
		expect((await list()).find((s) => s.id === setId)!.sizes.map((s) => s.id)).toEqual([sizeIds[0]]);
	});

	it('a size whose checks did not all pass is signed off only when they are acknowledged (422 otherwise)', async () => {
		const checks = { passed: 3, failed: 1, list: [{ code: 'seam_pair_measured', passed: false, message: 'Side seam: 2.1 mm apart, more than the 1.6 mm allowed.' }] };
		await testDb().updateTable('size_set_sizes').set({ checks: JSON.stringify(checks) }).where('id', '=', sizeIds[1]).execute();
		const r = await signOff(c.designer, setId, { sizes: [sizeIds[1]] });
		expect(r.status).toBe(422);
		const e = await errorOf(r);
		expect(e.code).toBe('checks_not_acknowledged');
		expect(e.fields?.sizes?.[0]).toContain('Side seam: 2.1 mm apart');
		expect((await signOff(c.designer, setId, { sizes: [sizeIds[1]], acknowledgeChecks: true })).status).toBe(200);
	});
});

describe('refusals when keeping', () => {
	it('answers 409 run_not_done for a run still queued', async () => {
		const run = await sizeRunsInsert(testDb(), { studioId, styleId, createdBy: users.owner, sizes: [{ measurementSetId: sets.get('astm-d5585/curvy/10')!, name: '10' }] });
		const r = await keep(c.owner, run.id);
		expect(r.status).toBe(409);
		expect((await errorOf(r)).code).toBe('run_not_done');
	});

	it('keeps only the sizes made whole: a size that failed is refused by name (422), the rest is kept', async () => {
		// the straight-waist size 6 cannot carry the midriff band's shaping (size-runs.test.ts)
		const runId = await runMade(['astm-d5585/straight/6', 'astm-d5585/curvy/18']);
		const failed = await keep(c.patterncutter, runId, { measurementSetIds: [sets.get('astm-d5585/straight/6')] });
		expect(failed.status).toBe(422);
		expect((await errorOf(failed)).code).toBe('size_not_kept');
		const r = await keep(c.patterncutter, runId, {});
		expect(r.status).toBe(201);
		expect(((await r.json()) as { sizeSet: SetOut }).sizeSet.sizes.map((s) => s.measurementSetId)).toEqual([sets.get('astm-d5585/curvy/18')]);
	});

	it('answers 409 when what the run stored is not what the style makes now (results_differ, style_changed)', async () => {
		const runId = await runMade(['astm-d5585/curvy/20']);
		const row = await testDb().selectFrom('size_runs').select('results').where('id', '=', runId).executeTakeFirstOrThrow();
		const results = row.results as { pieces: { versionNumber: number; metrics: { areaMm2: number } }[] }[];
		results[0].pieces[0].metrics.areaMm2 += 5;
		await testDb().updateTable('size_runs').set({ results: JSON.stringify(results) }).where('id', '=', runId).execute();
		const differ = await keep(c.owner, runId);
		expect(differ.status).toBe(409);
		expect((await errorOf(differ)).message).toMatch(/differs from the run: its area is/);
		results[0].pieces[0].versionNumber += 50;
		await testDb().updateTable('size_runs').set({ results: JSON.stringify(results) }).where('id', '=', runId).execute();
		const changed = await keep(c.owner, runId);
		expect(changed.status).toBe(409);
		expect((await errorOf(changed)).code).toBe('style_changed');
	});

	it('refuses a body that is not valid (400) and a run of no studio (404)', async () => {
		const runId = await runMade(['astm-d5585/curvy/10']);
		expect((await keep(c.owner, runId, { name: '' })).status).toBe(400);
		expect((await keep(c.owner, runId, { measurementSetIds: 'all' })).status).toBe(400);
		expect((await keep(c.owner, '00000000-0000-4000-8000-000000000000')).status).toBe(404);
	});

	it('on the Sketch plan keeps at most 3 sizes (402 plan_limit)', async () => {
		const sketch = await studioMake('Sketch sizes');
		const owner = await userMake('sketch-keeper');
		await memberAdd(sketch.id, owner.id, 'owner');
		const client = await sessionClient(app.baseUrl, owner.id);
		await measurementChartsEnsure(testDb(), sketch.id);
		const style = await stylesCreate(testDb(), { studioId: sketch.id, name: 'Plain bodice', createdBy: owner.id });
		const sizes = (await measurementSetsOfStudio(testDb(), sketch.id)).slice(0, 4).map((s) => ({ measurementSetId: s.id, name: s.name }));
		// a run of four sizes made while the studio was on the Studio plan
		const run = await sizeRunsInsert(testDb(), { studioId: sketch.id, styleId: style.id, createdBy: owner.id, sizes });
		const results = sizes.map((s) => ({ ...s, status: 'done', stepsDone: 0, pieces: [], failures: [], checks: { passed: 0, failed: 0, list: [] } }));
		await testDb().updateTable('size_runs').set({ status: 'done', results: JSON.stringify(results) }).where('id', '=', run.id).execute();
		const r = await client.api('POST', `/api/studios/${sketch.id}/size-runs/${run.id}/keep`, {});
		expect(r.status).toBe(402);
		const e = await errorOf(r);
		expect(e.code).toBe('plan_limit');
		expect(e.message).toMatch(/3 sizes/);
	});
});

describe('the size set pages', () => {
	let setId: string;
	let names: string[];
	let runId: string;

	beforeAll(async () => {
		runId = await runMade(['astm-d5585/curvy/6', 'astm-d5585/curvy/10']);
		const r = await keep(c.patterncutter, runId, { name: 'Pages check' });
		const set = ((await r.json()) as { sizeSet: SetOut }).sizeSet;
		setId = set.id;
		names = set.sizes.map((s) => s.name);
		expect((await signOff(c.designer, setId, { sizes: [set.sizes[0].id] })).status).toBe(200);
	}, 60_000);

	const html = async (client: Client, path: string) => {
		const r = await client.request('GET', path);
		expect(r.status, path).toBe(200);
		return r.text();
	};

	it('the style page lists the set with how many sizes are signed off', async () => {
		const page = await html(c.designer, `/studios/${studioId}/styles/${styleId}`);
		expect(page).toContain(`href="/studios/${studioId}/size-sets/${setId}"`);
		expect(page).toContain('2 sizes · 1 signed off');
	});

	it('a designer sees every size, the sign-off buttons of the drafts and the export links', async () => {
		const page = await html(c.designer, `/studios/${studioId}/size-sets/${setId}`);
		for (const n of names) expect(page).toContain(n);
		expect(page).toContain(`Sign off ${names[1]}`);
		expect(page).not.toContain(`Sign off ${names[0]}`);
		expect(page).toContain('Sign off all 1 size');
		for (const f of ['export.pdf?paper=a4', 'export.svg', 'export.dxf']) expect(page).toContain(`/api/studios/${studioId}/size-sets/${setId}/${f}`);
	});

	it('a pattern cutter sees the sizes without sign-off buttons; the sample room sees only the signed-off size', async () => {
		const cutter = await html(c.patterncutter, `/studios/${studioId}/size-sets/${setId}`);
		expect(cutter).not.toContain('Sign off');
		const room = await html(c.sampleroom, `/studios/${studioId}/size-sets/${setId}`);
		expect(room).toContain(names[0]);
		expect(room).not.toContain(names[1]);
	});

	it('a done run’s page offers Keep as size set to pattern cutters, and links the set once kept', async () => {
		const fresh = await runMade(['astm-d5585/curvy/10']);
		expect(await html(c.patterncutter, `/studios/${studioId}/size-runs/${fresh}`)).toContain('Keep as size set');
		expect(await html(c.designer, `/studios/${studioId}/size-runs/${fresh}`)).not.toContain('Keep as size set');
		const kept = await html(c.designer, `/studios/${studioId}/size-runs/${runId}`);
		expect(kept).toContain(`href="/studios/${studioId}/size-sets/${setId}"`);
		expect(kept).not.toContain('Keep as size set');
	});
});
