import { afterAll, describe, expect, inject, it } from 'vitest';
import demo from '../../fixtures/demo-studio.json';
import { dbCreate } from '../../src/lib/server/db/index';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';

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

	it('gives the demo studio one user per role', async () => {
		const { studioId } = await demoStudioSeed(db);
		const roles = await db.selectFrom('memberships').select('role').where('studio_id', '=', studioId).execute();
		expect(roles.map((r) => r.role).sort()).toEqual(demo.users.map((u) => u.role).sort());
	});
});
