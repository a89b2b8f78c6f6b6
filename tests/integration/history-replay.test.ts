// Replaying a style's history from its first versions reproduces every current head exactly: the demo
// style (its band and upper front made by one style change) and the styles the tests make.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_STYLE } from '../../src/lib/pattern/fixtures/demo-path';
import { styleHistoryReplay } from '../../src/lib/server/changes/history';
import { stylesOfStudio } from '../../src/lib/server/repositories/styles';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { startApp, type RunningApp } from './app-server';
import { carryBody, panelStyle } from './change-fixtures';
import { memberAdd, sessionClient, studioMake, testDb, testDbClose, userMake } from './helpers';

let app: RunningApp;

beforeAll(async () => {
	app = await startApp();
}, 60_000);

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

describe('replaying a style\'s history', () => {
	it('reproduces every head of the demo style from the drafted first versions, through its style change', async () => {
		const { studioId } = await demoStudioSeed(testDb());
		const style = (await stylesOfStudio(testDb(), studioId)).find((s) => s.code === DEMO_STYLE.code)!;
		const replay = await styleHistoryReplay(testDb(), style.id);
		expect(replay.map((p) => p.name)).toContain('Upper front');
		for (const p of replay) expect(p.problems, p.name).toEqual([]);
		expect(replay.find((p) => p.name === 'Upper front')?.versions).toBe(4);
	});

	it('reproduces the heads of a style whose new pieces came from a carry and were then edited', async () => {
		const studioId = (await studioMake('Replay')).id;
		const cutter = await userMake('cutter');
		await memberAdd(studioId, cutter.id, 'patterncutter');
		const c = await sessionClient(app.baseUrl, cutter.id);
		const st = await panelStyle(c, studioId);
		const r = await c.api('POST', `/api/studios/${studioId}/styles/${st.styleId}/changes`, carryBody(st));
		expect(r.status).toBe(201);
		const band = (await r.json()).pieces[0];
		const head = await c.api('GET', `/api/studios/${studioId}/pieces/${band.id}/versions/${band.versions[0].id}`);
		const g = (await head.json()).version.geometry;
		const v2 = await c.api('POST', `/api/studios/${studioId}/pieces/${band.id}/versions`, { baseVersionId: band.versions[0].id, message: 'Allowance', geometry: g, recipe: [{ op: 'allowance', params: { defaultWidthMm: 10 } }] });
		// the server computes the cut line itself; what was sent only has to match the stitching line
		expect(v2.status).toBe(201);
		const replay = await styleHistoryReplay(testDb(), st.styleId);
		expect(replay).toHaveLength(5);
		for (const p of replay) expect(p.problems, p.name).toEqual([]);
		expect(replay.find((p) => p.pieceId === band.id)?.versions).toBe(2);
	});

	it('reproduces the heads of the styles the tests made last (the database outlives runs: the 25 newest)', async () => {
		const styles = await testDb().selectFrom('styles').select('id').orderBy('created_at', 'desc').limit(25).execute();
		let pieces = 0;
		for (const s of styles) {
			for (const p of await styleHistoryReplay(testDb(), s.id)) {
				expect(p.problems, `${s.id} ${p.name}`).toEqual([]);
				pieces++;
			}
		}
		expect(pieces).toBeGreaterThan(0);
	}, 120_000);
});
