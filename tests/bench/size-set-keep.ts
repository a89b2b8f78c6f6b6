// Benchmark: a size run of the demo style over eight sizes of the studio's ASTM D5585-11e1 chart (curvy
// 2–18 without 10, reference-values row 1, C) made through the database as the worker makes it (the style
// loaded, every size made again and stored with its progress, `sizeRunExecute`), then kept as a size set
// (`sizeSetKeep`: the style cut back to the versions the run replayed, every size made again and compared
// with the run, one transaction storing 8 sizes × every piece). The queue is left out: it only hands the
// run to `sizeRunExecute`.
// Run: npx tsx tests/bench/size-set-keep.ts   (uses the test database; RUNS=5 by default)
import { execFileSync } from 'node:child_process';
import os from 'node:os';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';
import { measurementChartsEnsure } from '../../src/lib/server/measurements/charts';
import { measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { membershipsCreate } from '../../src/lib/server/repositories/memberships';
import { sizeRunsById, sizeRunsInsert } from '../../src/lib/server/repositories/size-runs';
import { studiosCreate } from '../../src/lib/server/repositories/studios';
import { usersCreate } from '../../src/lib/server/repositories/users';
import { demoStyleSeed } from '../../src/lib/server/seed/demo-style';
import { sizeRunExecute } from '../../src/lib/server/size-runs/run';
import { sizeSetKeep } from '../../src/lib/server/size-sets/keep';

const RUNS = Number(process.env.RUNS ?? 5);
const SIZES = ['2', '4', '6', '8', '12', '14', '16', '18'].map((s) => `astm-d5585/curvy/${s}`);

const url = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start test >&2 && printf %s "$DATABASE_URL"'], { encoding: 'utf8' }).trim();
const db = dbCreate(url, 3);
await migrateToLatest(db);

const stamp = Date.now();
const studio = await studiosCreate(db, `Bench keep ${stamp}`);
// the Studio plan, as a handled subscription leaves it (the Sketch plan keeps 3 sizes at most)
await db.insertInto('studio_billing').values({ studio_id: studio.id, subscription_id: `sub_bench_${stamp}`, status: 'active', interval: 'month', seats: 5, provider_updated_at: new Date() }).execute();
const person = async (role: 'patterncutter' | 'designer') => {
	const u = await usersCreate(db, { email: `bench-${role}-${stamp}@example.test`, name: `Bench ${role}`, passwordHash: 'not-a-password' });
	await membershipsCreate(db, { studioId: studio.id, userId: u.id, role });
	return u.id;
};
const patterncutter = await person('patterncutter');
const designer = await person('designer');
await measurementChartsEnsure(db, studio.id);
const styleId = (await demoStyleSeed(db, studio.id, { patterncutter, designer })).styleId;
const sets = (await measurementSetsOfStudio(db, studio.id)).filter((s) => s.chartKey && SIZES.includes(s.chartKey));
if (sets.length !== SIZES.length) throw new Error(`the chart gives ${sets.length} of the ${SIZES.length} sizes`);

const runTimes: number[] = [];
const keepTimes: number[] = [];
const loads: number[] = [];
let kept = 0;
for (let i = 0; i < RUNS; i++) {
	loads.push(os.loadavg()[0]);
	const run = await sizeRunsInsert(db, { studioId: studio.id, styleId, createdBy: patterncutter, sizes: sets.map((s) => ({ measurementSetId: s.id, name: s.name })) });
	const t0 = performance.now();
	await sizeRunExecute(db, run.id);
	const t1 = performance.now();
	const done = (await sizeRunsById(db, studio.id, run.id))!;
	if (done.status !== 'done') throw new Error(`run ${i}: ${done.status}`);
	const t2 = performance.now();
	await sizeSetKeep(db, { studioId: studio.id, run: done, userId: patterncutter, body: {} });
	const t3 = performance.now();
	runTimes.push(t1 - t0);
	keepTimes.push(t3 - t2);
	kept = (await db.selectFrom('size_set_sizes').innerJoin('size_sets', 'size_sets.id', 'size_set_sizes.size_set_id').select('size_set_sizes.id').where('size_sets.size_run_id', '=', run.id).execute()).length;
}
loads.push(os.loadavg()[0]);
await db.destroy();

const stats = (t: readonly number[]) => {
	const s = [...t].sort((a, b) => a - b);
	return `median ${s[Math.floor(s.length / 2)].toFixed(0)} ms (min ${s[0].toFixed(0)}, max ${s.at(-1)!.toFixed(0)} ms)`;
};
console.log(`size run of the demo style, ${SIZES.length} sizes, through the database, ${RUNS} runs: ${stats(runTimes)}`);
console.log(`kept as a size set (${kept} sizes kept), ${RUNS} keeps: ${stats(keepTimes)}`);
console.log(`load average (1 min) while measured: ${Math.min(...loads).toFixed(2)}–${Math.max(...loads).toFixed(2)} on ${os.cpus().length} cores, ${new Date().toISOString()}`);
process.exit(0);
