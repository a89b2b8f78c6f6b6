// The demo style the demo seed adds (real PostgreSQL, built app): seeded once, every version verified
// and stored by the server, the final versions signed off and exportable.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import demo from '../../fixtures/demo-studio.json';
import { DEMO_STYLE, demoPath } from '../../src/lib/pattern/fixtures/demo-path';
import { draftedStyleDiscard } from '../../src/lib/server/repositories/measurement-sets';
import { piecesOfStyle } from '../../src/lib/server/repositories/pieces';
import { seamPairsOfStyle } from '../../src/lib/server/repositories/seam-pairs';
import { styleChangesOfStyle } from '../../src/lib/server/repositories/style-changes';
import { stylesOfStudio } from '../../src/lib/server/repositories/styles';
import { usersByEmail } from '../../src/lib/server/repositories/users';
import { versionsById, versionsGeometryOfStyle, versionsMarkingsSet, versionsOfPiece } from '../../src/lib/server/repositories/versions';
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { startApp, type RunningApp } from './app-server';
import { sessionClient, testDb, testDbClose, throttleAddressReset } from './helpers';

let app: RunningApp;
let studioId: string;

beforeAll(async () => {
	app = await startApp();
	await throttleAddressReset();
	// The test database outlives a run: remove the demo style a previous run seeded, so that this run
	// seeds it afresh through the current code.
	studioId = (await demoStudioSeed(testDb())).studioId;
	for (const s of await demoStyles()) {
		// its fittings first: deleting the versions would otherwise clear a done note's version before the
		// note itself is deleted, which the notes' check refuses (in whichever order PostgreSQL runs the two)
		await testDb().deleteFrom('fittings').where('style_id', '=', s.id).execute();
		await draftedStyleDiscard(testDb(), studioId, s.id);
	}
	await demoStudioSeed(testDb());
}, 60_000);

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

/** Versions of a piece, oldest first. */
async function versionsAsc(pieceId: string) {
	return (await versionsOfPiece(testDb(), pieceId)).sort((a, b) => a.number - b.number);
}

async function demoStyles() {
	return (await stylesOfStudio(testDb(), studioId)).filter((s) => s.code === DEMO_STYLE.code);
}

describe('demo style: Juniper corset bodice', () => {
	it('is seeded once: a second run adds no style, piece or version', async () => {
		const style = (await demoStyles())[0];
		const count = async () => {
			const pieces = await piecesOfStyle(testDb(), style.id);
			let versions = 0;
			for (const p of pieces) versions += (await versionsOfPiece(testDb(), p.id)).length;
			return { pieces: pieces.length, versions };
		};
		const before = await count();
		await demoStudioSeed(testDb());
		expect(await demoStyles()).toHaveLength(1);
		expect(await count()).toEqual(before);
	});

	it('fills in the pressing directions and the centre front mark of a demo style seeded before them, changing nothing else', async () => {
		const [style] = await demoStyles();
		const stored = await versionsGeometryOfStyle(testDb(), style.id);
		const withDarts = stored.filter((v) => (v.geometry as Piece).darts.length > 0);
		expect(withDarts.length).toBeGreaterThan(0);
		// as an earlier seed stored them: no pressing direction, no CF mark on the panels and the upper front
		for (const v of stored) {
			const g = v.geometry as Piece;
			await versionsMarkingsSet(testDb(), v.id, { ...g, darts: g.darts.map(({ pressToward: _, ...d }) => d), labels: g.labels.filter((l) => !(l.id === 'centre' && l.text === 'CF' && !g.foldLine && g.cut === 'pair')) });
		}
		await demoStudioSeed(testDb());
		const after = await versionsGeometryOfStyle(testDb(), style.id);
		expect(after.map((v) => v.id)).toEqual(stored.map((v) => v.id));
		after.forEach((v, i) => expect(v.geometry, `${v.pieceName} v${v.number}`).toEqual(stored[i].geometry));
		for (const v of after) for (const d of (v.geometry as Piece).darts) expect(d.pressToward, `${v.pieceName} v${v.number} ${d.id}`).toBeDefined();
	});

	it('has the expected pieces and versions, in order, drafted from the studio\'s ASTM D5585 curvy 10 chart set', async () => {
		const [style] = await demoStyles();
		expect(style.name).toBe(DEMO_STYLE.name);
		expect(style.season).toBe('AW27');
		const set = await testDb().selectFrom('measurement_sets').select(['chart_key']).where('id', '=', style.measurementSetId!).executeTakeFirstOrThrow();
		expect(set.chart_key).toBe('astm-d5585/curvy/10');
		const pieces = await piecesOfStyle(testDb(), style.id);
		const expected = demoPath().pieces;
		expect(pieces.map((p) => [p.name, p.headNumber])).toEqual(expected.map((p) => [p.name, 1 + p.later.length]));
		const band = pieces.find((p) => p.name === 'Midriff band')!;
		const v1 = await versionsById(testDb(), band.id, (await versionsAsc(band.id))[0].id);
		const origin = (v1!.recipe as { op: string; params: { changeId: string; step: number; result: number } }[])[0];
		expect(origin.op).toBe('change_result');
		// one style change made the band and the upper front: a carry of the panels, then two joins above the line
		const change = (await styleChangesOfStyle(testDb(), style.id)).find((x) => x.id === origin.params.changeId)!;
		expect((change.steps as { op: string }[]).map((s) => s.op)).toEqual(['carry', 'join', 'join']);
		expect(change.bases.map((b) => b.pieceId)).toEqual(pieces.filter((p) => p.name.startsWith('Under-structure')).map((p) => p.id));
	});

	it('stores every version with passing checks, the ledger of each later version from the server\'s replay', async () => {
		const [style] = await demoStyles();
		for (const p of await piecesOfStyle(testDb(), style.id)) {
			for (const s of await versionsOfPiece(testDb(), p.id)) {
				const v = (await versionsById(testDb(), p.id, s.id))!;
				const checks = v.checks as { code: string; passed: boolean }[];
				expect(checks.filter((c) => !c.passed), `${p.name} v${v.number}`).toEqual([]);
				if (v.number > 1) expect(checks.length, `${p.name} v${v.number} was checked`).toBeGreaterThan(0);
				expect((v.recipe as unknown[]).length).toBeGreaterThan(0);
			}
		}
		const upper = (await piecesOfStyle(testDb(), style.id)).find((p) => p.name === 'Upper front')!;
		const ops = [];
		for (const s of await versionsAsc(upper.id)) ops.push(((await versionsById(testDb(), upper.id, s.id))!.recipe as { op: string }[])[0].op);
		expect(ops).toEqual(['change_result', 'pivot', 'pleat', 'grain']);
	});

	it('stores the seam pairs between neighbouring under-structure panels, as drafting a style does', async () => {
		const [style] = await demoStyles();
		const pieces = await piecesOfStyle(testDb(), style.id);
		const name = (id: string) => pieces.find((p) => p.id === id)?.name;
		const pairs = (await seamPairsOfStyle(testDb(), style.id)).map((p) => [p.label, name(p.aPieceId), name(p.bPieceId)]).sort();
		expect(pairs).toEqual([
			['panel seam A', 'Under-structure: Centre front panel', 'Under-structure: Middle front panel'],
			['panel seam B', 'Under-structure: Middle front panel', 'Under-structure: Side front panel']
		]);
	});

	it('has the final band and upper front signed off, the rest in draft', async () => {
		const [style] = await demoStyles();
		for (const p of await piecesOfStyle(testDb(), style.id)) {
			const versions = await versionsOfPiece(testDb(), p.id);
			const head = versions.find((v) => v.id === p.headVersionId)!;
			if (p.name === 'Midriff band' || p.name === 'Upper front') expect(head.state, p.name).toBe('signed_off');
			else expect(versions.every((v) => v.state === 'draft'), p.name).toBe(true);
		}
	});

	it('answers the style page, the compare API and the SVG export of the final upper front', async () => {
		const [style] = await demoStyles();
		const cutter = await usersByEmail(testDb(), demo.users.find((u) => u.role === 'patterncutter')!.email);
		const c = await sessionClient(app.baseUrl, cutter!.id);
		const page = await c.get(`/studios/${studioId}/styles/${style.id}`);
		expect(page.status).toBe(200);
		const html = await page.text();
		for (const name of ['Midriff band', 'Upper front', 'Front block']) expect(html).toContain(name);

		const upper = (await piecesOfStyle(testDb(), style.id)).find((p) => p.name === 'Upper front')!;
		const versions = await versionsAsc(upper.id);
		const cmp = await c.api('GET', `/api/studios/${studioId}/pieces/${upper.id}/compare?a=${versions[1].id}&b=${versions[2].id}`);
		expect(cmp.status).toBe(200);

		const r = await c.api('GET', `/api/studios/${studioId}/pieces/${upper.id}/export.svg?version=${upper.headVersionId}`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toMatch(/image\/svg\+xml/);
		expect(r.headers.get('content-disposition')).toMatch(/lr-214-upper-front-v4\.svg/);
		expect(await r.text()).toMatch(/<svg [^>]*width="[\d.]+mm"/);

		// the sample room sees the signed-off version too
		const sample = await usersByEmail(testDb(), demo.users.find((u) => u.role === 'sampleroom')!.email);
		const s = await sessionClient(app.baseUrl, sample!.id);
		expect((await s.api('GET', `/api/studios/${studioId}/pieces/${upper.id}/export.svg`)).status).toBe(200);
	});
});
