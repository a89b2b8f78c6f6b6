// The style read the API sends as text (styleOverviewJson: the shown versions' JSON passed on from the
// database unparsed) says exactly what the page loads' styleOverview says, for a role that sees drafts
// and for the sample room (signed-off versions only), on the demo style.
import { afterAll, describe, expect, it } from 'vitest';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { styleOverview, styleOverviewJson } from '../../src/lib/server/versions/overview';
import { storageEnvUse } from './fittings-support';
import { testDb, testDbClose } from './helpers';

afterAll(async () => {
	await testDbClose();
});

describe('the style read as JSON text', () => {
	it('is the same answer as the overview the pages load, for every role', async () => {
		storageEnvUse();
		const { studioId } = await demoStudioSeed(testDb());
		const style = await testDb().selectFrom('styles').select('id').where('studio_id', '=', studioId).where('code', '=', 'LR-214').executeTakeFirstOrThrow();
		for (const role of ['owner', 'patterncutter', 'designer', 'sampleroom'] as const) {
			const text = await styleOverviewJson(testDb(), studioId, style.id, role);
			const object = await styleOverview(testDb(), studioId, style.id, role);
			expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(object)));
			expect(object.pieces.length).toBeGreaterThan(0);
		}
		await expect(styleOverviewJson(testDb(), studioId, crypto.randomUUID(), 'owner')).rejects.toMatchObject({ status: 404 });
	});
});
