import demo from '../../../../fixtures/demo-studio.json';
import type { Db } from '../db';
import type { Role } from '../db/schema';
import { passwordHash } from '../auth/password';
import { measurementChartsSeed } from '../measurements/charts';
import { membershipsAddIfAbsent, membershipsForUser } from '../repositories/memberships';
import { studiosCreate } from '../repositories/studios';
import { usersByEmail, usersCreate } from '../repositories/users';

export interface DemoSeedResult {
	studioId: string;
	created: boolean;
}

/**
 * Seeds the demo studio of our own scenario (fixtures/demo-studio.json). Idempotent: the studio is
 * found through its owner's membership, users by e-mail; nothing is duplicated on a second run.
 */
export async function demoStudioSeed(db: Db): Promise<DemoSeedResult> {
	return db.transaction().execute(async (tx) => {
		const ownerSpec = demo.users.find((u) => u.role === 'owner')!;
		const hash = await passwordHash(demo.password);
		const owner = (await usersByEmail(tx, ownerSpec.email)) ?? (await usersCreate(tx, { ...ownerSpec, passwordHash: hash }));
		const existing = (await membershipsForUser(tx, owner.id)).find((m) => m.studioName === demo.studio);
		const studioId = existing?.studioId ?? (await studiosCreate(tx, demo.studio)).id;
		for (const spec of demo.users) {
			const user = (await usersByEmail(tx, spec.email)) ?? (await usersCreate(tx, { ...spec, passwordHash: hash }));
			await membershipsAddIfAbsent(tx, { studioId, userId: user.id, role: spec.role as Role });
		}
		// The published size charts (read-only, idempotent: existing chart rows are kept).
		await measurementChartsSeed(tx, studioId);
		return { studioId, created: !existing };
	});
}
