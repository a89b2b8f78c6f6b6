// One style change through POST /api/studios/{studioId}/styles/{styleId}/changes (real PostgreSQL, built
// app): recomputed on the server, stored in one transaction or not at all.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { styleChangesOfStyle } from '../../src/lib/server/repositories/style-changes';
import { piecesOfStyle } from '../../src/lib/server/repositories/pieces';
import { seamPairsOfStyle } from '../../src/lib/server/repositories/seam-pairs';
import { changeSave } from '../../src/lib/server/changes/save';
import { changeSaveSchema } from '../../src/lib/server/changes/schemas';
import { startApp, type RunningApp } from './app-server';
import { carryBody, panelStyle } from './change-fixtures';
import { Client, memberAdd, sessionClient, studioMake, studioOnStudioPlan, testDb, testDbClose, userMake, type TestUser } from './helpers';

let app: RunningApp;
let studioId: string;
let cutter: TestUser;
let c: Client;

beforeAll(async () => {
	app = await startApp();
	studioId = (await studioMake('Changes')).id;
	await studioOnStudioPlan(studioId); // these tests make many styles: past the free plan's five
	cutter = await userMake('cutter');
	await memberAdd(studioId, cutter.id, 'patterncutter');
	c = await sessionClient(app.baseUrl, cutter.id);
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const url = (styleId: string) => `/api/studios/${studioId}/styles/${styleId}/changes`;

/** Everything a change could write, to compare before and after a refused one. */
async function snapshot(styleId: string) {
	const pieces = await piecesOfStyle(testDb(), styleId);
	return {
		pieces: pieces.map((p) => [p.id, p.headVersionId, p.headNumber]),
		changes: (await styleChangesOfStyle(testDb(), styleId)).length,
		seamPairs: (await seamPairsOfStyle(testDb(), styleId)).map((p) => [p.id, p.aEdge, p.bEdge])
	};
}

describe('saving a style change', () => {
	it('stores a carry as one change: new pieces recomputed from the panels, their first versions naming it, the seam pair between them (201)', async () => {
		const st = await panelStyle(c, studioId);
		const r = await c.api('POST', url(st.styleId), carryBody(st));
		expect(r.status).toBe(201);
		const body = await r.json();
		expect(body.pieces.map((p: { name: string }) => p.name)).toEqual(['Waist band', 'Left upper panel', 'Right upper panel']);
		expect(body.checks.every((x: { passed: boolean }) => x.passed)).toBe(true);
		const [change] = await styleChangesOfStyle(testDb(), st.styleId);
		expect(change.id).toBe(body.change.id);
		expect(change.bases).toEqual([{ pieceId: st.left.id, versionId: st.left.v1 }, { pieceId: st.right.id, versionId: st.right.v1 }]);
		const v1 = await c.api('GET', `/api/studios/${studioId}/pieces/${body.pieces[0].id}/versions/${body.pieces[0].versions[0].id}`);
		const version = (await v1.json()).version;
		expect(version.recipe).toEqual([{ op: 'change_result', params: { changeId: change.id, step: 0, result: 0 } }]);
		expect(version.geometry.name).toBe('Waist band');
		const pairs = await seamPairsOfStyle(testDb(), st.styleId);
		expect(pairs.find((p) => p.label === 'waist band seam')?.aPieceId).toBe(body.pieces[0].id);
		// the panels themselves are untouched
		expect((await piecesOfStyle(testDb(), st.styleId)).find((p) => p.id === st.left.id)?.headNumber).toBe(1);
	});

	it('answers 409 listing each base that is no longer its piece\'s head, and stores nothing', async () => {
		const st = await panelStyle(c, studioId);
		const body = carryBody(st);
		// someone saves version 2 of the right panel (a notch) after the change was started
		const notch = await c.api('POST', `/api/studios/${studioId}/pieces/${st.right.id}/versions`, {
			baseVersionId: st.right.v1,
			message: 'Balance notch',
			geometry: { ...st.right.geometry, notches: [{ id: 'n1', at: { x: 200, y: 200 }, count: 1 }] },
			recipe: [{ op: 'notch', params: { id: 'n1', at: { x: 200, y: 200 } } }]
		});
		expect(notch.status).toBe(201);
		const before = await snapshot(st.styleId);
		const r = await c.api('POST', url(st.styleId), body);
		expect(r.status).toBe(409);
		const e = (await r.json()).error;
		expect(e.code).toBe('stale_base');
		expect(e.fields.bases).toEqual([st.right.id]);
		expect(e.message).toMatch(/Right panel \(now version 2\)/);
		expect(await snapshot(st.styleId)).toEqual(before);
	});

	it('answers 422 saying which new piece differs from the server\'s recomputation and by how much, and stores nothing', async () => {
		const st = await panelStyle(c, studioId);
		const body = JSON.parse(JSON.stringify(carryBody(st)));
		body.pieces[1].geometry.outline.segments[0].p0.y += 0.3;
		const before = await snapshot(st.styleId);
		const r = await c.api('POST', url(st.styleId), body);
		expect(r.status).toBe(422);
		const e = (await r.json()).error;
		expect(e.code).toBe('replay_mismatch');
		expect(e.fields.piece).toEqual(['1']);
		expect(e.fields.distanceMm).toEqual(['0.300']);
		expect(e.message).toMatch(/"Left upper panel"/);
		expect(await snapshot(st.styleId)).toEqual(before);
	});

	it('answers 422 when a seam the change sews is not true by the style\'s seam pair, and stores nothing', async () => {
		const st = await panelStyle(c, studioId);
		// the stored pair's left edge now ends 10 mm short of the waist
		const spread = 250 * Math.tan((6 * Math.PI) / 180);
		const patch = await c.api('PATCH', `/api/studios/${studioId}/styles/${st.styleId}/seam-pairs/${st.seamPairId}`, { a: { from: { x: 100, y: 0 }, to: { x: 100 - spread * 0.96, y: 390 } } });
		expect(patch.status).toBe(200);
		const before = await snapshot(st.styleId);
		const r = await c.api('POST', url(st.styleId), carryBody(st));
		expect(r.status).toBe(422);
		const e = (await r.json()).error;
		expect(e.code).toBe('seam_lengths_differ');
		expect(e.message).toMatch(/panel seam: .*mm too short/);
		expect(await snapshot(st.styleId)).toEqual(before);
	});

	it('leaves the style as it was when the transaction fails after writing', async () => {
		const st = await panelStyle(c, studioId);
		const before = await snapshot(st.styleId);
		const body = changeSaveSchema.parse(JSON.parse(JSON.stringify(carryBody(st))));
		await expect(
			changeSave(testDb(), { studioId, styleId: st.styleId, authorId: cutter.id, body }, { afterInsert: () => { throw new Error('disk full'); } })
		).rejects.toThrow('disk full');
		expect(await snapshot(st.styleId)).toEqual(before);
	});

	it('lets only editors of the studio save a change', async () => {
		const st = await panelStyle(c, studioId);
		const designer = await userMake('designer');
		await memberAdd(studioId, designer.id, 'designer');
		const d = await sessionClient(app.baseUrl, designer.id);
		expect((await d.api('POST', url(st.styleId), carryBody(st))).status).toBe(403);
		const outsider = await userMake('outsider');
		const otherStudio = (await studioMake('Elsewhere')).id;
		await memberAdd(otherStudio, outsider.id, 'owner');
		const o = await sessionClient(app.baseUrl, outsider.id);
		expect((await o.api('POST', url(st.styleId), carryBody(st))).status).toBe(404);
		expect((await new Client(app.baseUrl).api('POST', url(st.styleId), carryBody(st))).status).toBe(401);
		expect((await styleChangesOfStyle(testDb(), st.styleId)).length).toBe(0);
	});
});
