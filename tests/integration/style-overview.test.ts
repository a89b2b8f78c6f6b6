// The style read the API sends as text (styleOverviewJsonBytes: the shown versions' JSON passed on from the
// database unparsed) says exactly what the page loads' styleOverview says, for a role that sees drafts
// and for the sample room (signed-off versions only), on the demo style.
import { afterAll, describe, expect, it } from 'vitest';
import { changeFeedSync } from '../../src/lib/server/cache/change-feed';
import { piecesCreate, piecesHeadSet } from '../../src/lib/server/repositories/pieces';
import { stylesCreate } from '../../src/lib/server/repositories/styles';
import { versionsInsert, versionsMarkingsSet, versionsStateSet } from '../../src/lib/server/repositories/versions';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { styleOverview, styleOverviewJsonBytes } from '../../src/lib/server/versions/overview';
import { storageEnvUse } from './fittings-support';
import { studioMake, testDb, testDbClose, userMake } from './helpers';

afterAll(async () => {
	await testDbClose();
});

describe('the style read as JSON text', () => {
	it('is the same answer as the overview the pages load, for every role', async () => {
		storageEnvUse();
		const { studioId } = await demoStudioSeed(testDb());
		const style = await testDb().selectFrom('styles').select('id').where('studio_id', '=', studioId).where('code', '=', 'LR-214').executeTakeFirstOrThrow();
		for (const role of ['owner', 'patterncutter', 'designer', 'sampleroom'] as const) {
			const text = Buffer.from(await styleOverviewJsonBytes(testDb(), studioId, style.id, role)).toString('utf8');
			const object = await styleOverview(testDb(), studioId, style.id, role);
			expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(object)));
			expect(object.pieces.length).toBeGreaterThan(0);
		}
		await expect(styleOverviewJsonBytes(testDb(), studioId, crypto.randomUUID(), 'owner')).rejects.toMatchObject({ status: 404 });
	});

	it('never answers from a version as it stood before its row changed (kept versions are named by their stamp)', async () => {
		// a style of its own, its one piece at version 1 made from a demo piece's head
		storageEnvUse();
		const demo = await demoStudioSeed(testDb());
		const demoStyle = await testDb().selectFrom('styles').select('id').where('studio_id', '=', demo.studioId).where('code', '=', 'LR-214').executeTakeFirstOrThrow();
		const source = (await styleOverview(testDb(), demo.studioId, demoStyle.id, 'owner')).pieces.find((p) => p.shown !== null)!.shown!;
		const user = await userMake('reader');
		const studio = await studioMake('Stamp');
		const style = await stylesCreate(testDb(), { studioId: studio.id, name: 'Stamp test', createdBy: user.id });
		const piece = await piecesCreate(testDb(), { styleId: style.id, name: 'Front', cut: 'pair' });
		const v1 = await versionsInsert(testDb(), { pieceId: piece.id, number: 1, parentId: null, authorId: user.id, message: 'Drafted', geometry: source.geometry, recipe: [{ op: 'draft', params: { note: 'copied from the demo style' } }], metrics: source.metrics, checks: source.checks });
		await piecesHeadSet(testDb(), piece.id, v1.id, 1);
		const read = async (role: 'owner' | 'sampleroom') => JSON.parse(Buffer.from(await styleOverviewJsonBytes(testDb(), studio.id, style.id, role)).toString('utf8'));

		const first = await read('owner');
		expect(first.pieces[0].shown.state).toBe('draft');
		expect((await read('sampleroom')).pieces).toEqual([]);
		// read again: the second answer comes from the kept text and is the same
		expect(await read('owner')).toEqual(first);
		// the version's geometry changed in place (as the demo's refresh of markings does), then signed off
		// the grainline moved, everything else of it as it was (the stored geometry stays a valid piece)
		const grainline = { ...(source.geometry as { grainline: object }).grainline, from: { x: 7.5, y: 11.25 }, to: { x: 7.5, y: 311.25 } };
		expect(first.pieces[0].shown.geometry.grainline).not.toEqual(grainline);
		await versionsMarkingsSet(testDb(), v1.id, { ...(source.geometry as object), grainline });
		// written here, not through a request of the app (which waits for this itself): the notice heard
		await changeFeedSync();
		expect((await read('owner')).pieces[0].shown.geometry.grainline).toEqual(grainline);
		await versionsStateSet(testDb(), v1.id, 'signed_off', user.id);
		await changeFeedSync();
		const after = await read('owner');
		expect(after.pieces[0].shown).toMatchObject({ id: v1.id, state: 'signed_off', geometry: { grainline } });
		// and the page loads' overview agrees, for the sample room too (who now sees that version)
		for (const role of ['owner', 'sampleroom'] as const) {
			expect(await read(role)).toEqual(JSON.parse(JSON.stringify(await styleOverview(testDb(), studio.id, style.id, role))));
		}
		expect((await read('sampleroom')).pieces).toHaveLength(1);
	});
});
