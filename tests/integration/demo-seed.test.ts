import { afterAll, describe, expect, inject, it } from 'vitest';
import demo from '../../fixtures/demo-studio.json';
import { DEMO_STYLE } from '../../src/lib/pattern/fixtures/demo-path';
import { dbCreate } from '../../src/lib/server/db/index';
import { fitNotesOfFitting } from '../../src/lib/server/repositories/fit-notes';
import { photosKeysOfFitting, photosOfFitting } from '../../src/lib/server/repositories/fitting-photos';
import { fittingsOfStyle, fittingVersions } from '../../src/lib/server/repositories/fittings';
import { stylesOfStudio } from '../../src/lib/server/repositories/styles';
import { DEMO_CLIENT_REF } from '../../src/lib/server/seed/demo-client';
import { DEMO_FITTING } from '../../src/lib/server/seed/demo-fitting';
import { measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { measurementSetSchema } from '../../src/lib/pattern/measurements/measurement-set';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { storageDelete, storageExists, storageGet } from '../../src/lib/server/storage';
import { storageEnvUse } from './fittings-support';

describe('demo studio seed', () => {
	const db = dbCreate(inject('databaseUrl'), 2);
	afterAll(() => db.destroy());

	it('is idempotent: a second run adds no studio, user or membership', async () => {
		const first = await demoStudioSeed(db);
		const count = async () => ({
			users: (await db.selectFrom('users').select((e) => e.fn.countAll().as('n')).executeTakeFirstOrThrow()).n,
			studios: (await db.selectFrom('studios').select((e) => e.fn.countAll().as('n')).executeTakeFirstOrThrow()).n,
			members: (await db.selectFrom('memberships').select((e) => e.fn.countAll().as('n')).executeTakeFirstOrThrow()).n
		});
		const before = await count();
		const second = await demoStudioSeed(db);
		expect(second.studioId).toBe(first.studioId);
		expect(second.created).toBe(false);
		expect(await count()).toEqual(before);
	});

	it('gives the demo studio one client set, by reference code, that the client form would accept; once however often it runs', async () => {
		const { studioId } = await demoStudioSeed(db);
		await demoStudioSeed(db);
		const sets = await measurementSetsOfStudio(db, studioId);
		const clients = sets.filter((s) => s.clientRef === DEMO_CLIENT_REF);
		expect(clients).toHaveLength(1);
		const c = clients[0];
		expect(c.kind).toBe('client');
		const chart = sets.find((s) => s.chartKey === 'astm-d5585/curvy/12')!;
		const bust = (set: typeof c) => set.values.find((v) => v.id === 'bust')!.valueMm;
		expect(bust(c) - bust(chart)).toBe(25);
		// the same rules as a set typed into the form (reference code, not a name; no value twice)
		expect(measurementSetSchema.safeParse({ kind: 'client', clientRef: c.clientRef, name: c.name, measurements: c.values }).success).toBe(true);
	});

	it('gives the demo studio one user per role', async () => {
		const { studioId } = await demoStudioSeed(db);
		const roles = await db.selectFrom('memberships').select('role').where('studio_id', '=', studioId).execute();
		expect(roles.map((r) => r.role).sort()).toEqual(demo.users.map((u) => u.role).sort());
	});

	it('gives the demo style one fitting with photos of our drawing in the store and two notes, one done by a later version', async () => {
		storageEnvUse();
		const { studioId } = await demoStudioSeed(db);
		await demoStudioSeed(db); // a second run adds no fitting
		const style = (await stylesOfStudio(db, studioId)).find((s) => s.code === DEMO_STYLE.code)!;
		const fittings = await fittingsOfStyle(db, style.id);
		expect(fittings.map((f) => f.title)).toEqual([DEMO_FITTING.title]);
		const fitting = fittings[0];
		// fitted on a form, not a person; the toile cut from versions of the style
		expect(fitting.fitModel).toBe(DEMO_FITTING.fitModel);
		expect((await fittingVersions(db, fitting.id)).length).toBeGreaterThan(0);

		// the photos: the toile drawings, re-encoded as JPEG, each with its display size and thumbnail in the store
		const photos = await photosOfFitting(db, fitting.id);
		expect(photos).toHaveLength(DEMO_FITTING.photos.length);
		for (const p of photos) {
			expect(p.contentType).toBe('image/jpeg');
			expect(p.width).toBeGreaterThan(p.thumbWidth);
		}
		const keys = await photosKeysOfFitting(db, fitting.id);
		expect(keys).toHaveLength(photos.length * 2);
		for (const key of keys) expect(await storageExists(key), key).toBe(true);
		const jpeg = await storageGet(photos[0].displayKey);
		expect([...jpeg!.subarray(0, 3)]).toEqual([0xff, 0xd8, 0xff]);

		// two notes: one still to do, one done "resolved by version N" with N after the version it was pinned on
		const notes = await fitNotesOfFitting(db, fitting.id);
		expect(notes).toHaveLength(2);
		const done = notes.filter((n) => n.status === 'done');
		expect(done).toHaveLength(1);
		expect(done[0].resolvedVersionNumber).not.toBeNull();
		expect(done[0].resolvedVersionNumber!).toBeGreaterThan(done[0].versionNumber);
		expect(notes.filter((n) => n.status !== 'done')).toHaveLength(1);
		// the version that resolved it is a version of the same piece
		const resolved = await db.selectFrom('piece_versions').select('piece_id').where('id', '=', done[0].resolvedVersionId!).executeTakeFirstOrThrow();
		expect(resolved.piece_id).toBe(done[0].pieceId);
	});

	it('makes the demo fitting again when its photos are gone from the store (the database kept, the store emptied)', async () => {
		storageEnvUse();
		const { studioId } = await demoStudioSeed(db);
		const style = (await stylesOfStudio(db, studioId)).find((s) => s.code === DEMO_STYLE.code)!;
		const before = (await fittingsOfStyle(db, style.id))[0];
		await storageDelete(await photosKeysOfFitting(db, before.id));
		await demoStudioSeed(db);
		const after = await fittingsOfStyle(db, style.id);
		expect(after.map((f) => f.title)).toEqual([DEMO_FITTING.title]);
		expect(after[0].id).not.toBe(before.id);
		for (const key of await photosKeysOfFitting(db, after[0].id)) expect(await storageExists(key), key).toBe(true);
		expect(await fitNotesOfFitting(db, after[0].id)).toHaveLength(2);
	});
});
