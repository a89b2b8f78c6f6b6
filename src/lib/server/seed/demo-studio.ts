import demo from '../../../../fixtures/demo-studio.json';
import type { Db } from '../db';
import type { Role } from '../db/schema';
import { passwordHash } from '../auth/password';
import { measurementChartsSeed } from '../measurements/charts';
import { membershipsAddIfAbsent, membershipsForUser } from '../repositories/memberships';
import { studiosCreate } from '../repositories/studios';
import { usersByEmail, usersCreate } from '../repositories/users';
import { demoBillingSeed } from './demo-billing';
import { demoClientSeed } from './demo-client';
import { demoFittingSeed } from './demo-fitting';
import { demoStyleSeed } from './demo-style';

export interface DemoSeedResult {
	studioId: string;
	created: boolean;
	/** the second demo studio, on the free Sketch plan (fixtures/demo-billing.json) */
	sketchStudioId: string;
}

/**
 * Seeds the demo studio of our own scenario (fixtures/demo-studio.json). Idempotent: the studio is
 * found through its owner's membership, users by e-mail; nothing is duplicated on a second run. Then the
 * demo style of the same scenario (demo-style.ts), skipped when the studio already has it, and its first
 * fitting (demo-fitting.ts: photos go to the object store, which must be running).
 */
export async function demoStudioSeed(db: Db): Promise<DemoSeedResult> {
	const seeded = await db.transaction().execute(async (tx) => {
		const ownerSpec = demo.users.find((u) => u.role === 'owner')!;
		const hash = await passwordHash(demo.password);
		const owner = (await usersByEmail(tx, ownerSpec.email)) ?? (await usersCreate(tx, { ...ownerSpec, passwordHash: hash }));
		const existing = (await membershipsForUser(tx, owner.id)).find((m) => m.studioName === demo.studio);
		const studioId = existing?.studioId ?? (await studiosCreate(tx, demo.studio)).id;
		const userIds: Partial<Record<Role, string>> = {};
		for (const spec of demo.users) {
			const user = (await usersByEmail(tx, spec.email)) ?? (await usersCreate(tx, { ...spec, passwordHash: hash }));
			await membershipsAddIfAbsent(tx, { studioId, userId: user.id, role: spec.role as Role });
			userIds[spec.role as Role] = user.id;
		}
		// The published size charts (read-only, idempotent: existing chart rows are kept).
		await measurementChartsSeed(tx, studioId);
		return { studioId, created: !existing, userIds };
	});
	// The demo style (its own idempotence: skipped when the studio has it). Outside the transaction above:
	// every version is verified and saved through versionSave, which opens its own transactions.
	const { patterncutter, designer, sampleroom } = seeded.userIds;
	// one made-to-measure client (invented), so a size run can take chart sizes and a client together
	if (patterncutter) await demoClientSeed(db, seeded.studioId, patterncutter);
	if (patterncutter && designer) {
		const style = await demoStyleSeed(db, seeded.studioId, { patterncutter, designer });
		// its first toile fitting: photos (drawn by us) in the object store, two fit notes (own idempotence)
		if (sampleroom) await demoFittingSeed(db, seeded.studioId, style.styleId, { sampleroom, patterncutter });
	}
	// the demo's plans: this studio on Studio with its seats paid, a second one on Sketch at its limits
	const { sketchStudioId } = await demoBillingSeed(db, seeded.studioId);
	return { studioId: seeded.studioId, created: seeded.created, sketchStudioId };
}
