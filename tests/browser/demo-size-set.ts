// A size set of the demo style for the browser tests: a run over two sizes of the studio's ASTM D5585
// chart (its own size among them), made in this process, kept, and its first size signed off by the designer. Made once (the test
// database outlives runs).
import demo from '../../fixtures/demo-studio.json';
import type { Db } from '../../src/lib/server/db/index';
import { measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { sizeRunsById, sizeRunsInsert } from '../../src/lib/server/repositories/size-runs';
import { sizeSetsById } from '../../src/lib/server/repositories/size-sets';
import { usersByEmail } from '../../src/lib/server/repositories/users';
import { sizeRunExecute } from '../../src/lib/server/size-runs/run';
import { sizeSetKeep } from '../../src/lib/server/size-sets/keep';
import { sizeSetSignOff } from '../../src/lib/server/size-sets/sign-off';

export async function demoSizeSet(db: Db, studioId: string, styleId: string): Promise<string> {
	const kept = await db.selectFrom('size_sets').select('id').where('style_id', '=', styleId).orderBy('created_at').executeTakeFirst();
	if (kept) return kept.id;
	const person = async (role: string) => (await usersByEmail(db, demo.users.find((u) => u.role === role)!.email))!.id;
	const cutter = await person('patterncutter');
	// the demo style's own set (curvy 10: its replay gives the heads again) and the next size; the demo
	// fitting's later version may not replay on another size, so only the sizes made whole are kept
	const keys = ['astm-d5585/curvy/10', 'astm-d5585/curvy/12'];
	const sets = (await measurementSetsOfStudio(db, studioId)).filter((s) => s.chartKey && keys.includes(s.chartKey));
	const run = await sizeRunsInsert(db, { studioId, styleId, createdBy: cutter, sizes: sets.map((s) => ({ measurementSetId: s.id, name: s.name })) });
	await sizeRunExecute(db, run.id);
	const id = await sizeSetKeep(db, { studioId, run: (await sizeRunsById(db, studioId, run.id))!, userId: cutter, body: {} });
	const first = await db.selectFrom('size_set_sizes').select('id').where('size_set_id', '=', id).orderBy('position').executeTakeFirstOrThrow();
	await sizeSetSignOff(db, { set: (await sizeSetsById(db, studioId, id))!, userId: await person('designer'), body: { sizes: [first.id], comment: '', acknowledgeChecks: false } });
	return id;
}
