import { setImmediate as nextTurn } from 'node:timers/promises';
import { sizeRunCheck } from '$lib/billing/plans';
import { sizeResult, type SizePieceResult } from '$lib/pattern/grading/size-result';
import { styleRecipeAt } from '$lib/pattern/grading/style-recipe-at';
import { studioPlan } from '../billing/plan';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { measurementsMmOf } from '../measurements/sets';
import { measurementSetsInStudio } from '../repositories/measurement-sets';
import { piecesOfStyle } from '../repositories/pieces';
import type { SizeRunRow } from '../repositories/size-runs';
import { sizeSetsInsert, sizeSetsOfRun, type SizeSetSizeInsert } from '../repositories/size-sets';
import { isUniqueViolation } from '../repositories/users';
import type { SizeRunSizeResult } from '../size-runs/run';
import { styleRecipeLoad } from '../size-runs/style-recipe-load';
import type { SizeSetKeep } from './schemas';
import { sizeSetName } from '$lib/pattern/grading/size-set-name';

/** How far a size's piece made again may be from the run's stored figures (mm², mm, degrees). */
const AREA_TOLERANCE_MM2 = 0.01;
const LENGTH_TOLERANCE_MM = 0.001;
const ANGLE_TOLERANCE_DEG = 1e-6;

type Metrics = NonNullable<SizePieceResult['metrics']>;

/** Does the piece made again measure what the run stored? The first difference, in words, or null. */
export function metricsDifference(stored: Metrics, made: Metrics): string | null {
	if (Math.abs(stored.areaMm2 - made.areaMm2) > AREA_TOLERANCE_MM2) return `its area is ${made.areaMm2.toFixed(1)} mm², the run gave ${stored.areaMm2.toFixed(1)} mm²`;
	if (Math.abs(stored.seamLengthMm - made.seamLengthMm) > LENGTH_TOLERANCE_MM) return `its seams measure ${made.seamLengthMm.toFixed(2)} mm, the run gave ${stored.seamLengthMm.toFixed(2)} mm`;
	for (const s of stored.seams) {
		const m = made.seams.find((x) => x.name === s.name);
		if (!m || Math.abs(m.lengthMm - s.lengthMm) > LENGTH_TOLERANCE_MM) return `its ${s.name} seam is not the length the run gave`;
	}
	for (const a of stored.apexes) {
		const m = made.apexes.find((x) => x.apexId === a.apexId);
		if (!m || Math.abs(m.totalAngleDeg - a.totalAngleDeg) > ANGLE_TOLERANCE_DEG) return `its shaping at ${a.label} is not what the run gave`;
	}
	return null;
}

const START_AGAIN = 'Start a new size run and keep that one.';

/** The sizes of a done run to keep: those asked for (each must have been made whole), else every size made whole. */
function sizesToKeep(run: SizeRunRow, body: SizeSetKeep): SizeRunSizeResult[] {
	const results = run.results as SizeRunSizeResult[];
	if (!body.measurementSetIds) {
		const made = results.filter((r) => r.status === 'done');
		if (made.length === 0) throw new ApiError(422, 'nothing_to_keep', 'No size of this run was made whole: there is nothing to keep.');
		return made;
	}
	const out: SizeRunSizeResult[] = [];
	const problems: string[] = [];
	for (const id of body.measurementSetIds) {
		const r = results.find((x) => x.measurementSetId === id);
		if (!r) problems.push(`${id} is not a size of this run.`);
		else if (r.status !== 'done') problems.push(`${r.name} could not be made whole${r.error ? ` (${r.error})` : r.failures.length ? ` (${r.failures.length} ${r.failures.length === 1 ? 'step' : 'steps'} could not be made again)` : ''}: only sizes made whole are kept.`);
		else out.push(r);
	}
	if (problems.length) throw new ApiError(422, 'size_not_kept', problems[0], { measurementSetIds: problems });
	return out;
}

/**
 * Keeps a done size run as a size set of its style. The server makes every kept size again from the
 * style as it stood at the run (its pieces up to the versions the run replayed), checks that each piece
 * measures what the run reported, and stores each size's pieces as versions of their own, linked to the
 * base piece and version. Nothing the client sends is taken for geometry. 409 when the run is not done,
 * is kept already, or the style or a measurement set has changed since; 402 past the plan's sizes.
 */
export async function sizeSetKeep(db: Db, a: { studioId: string; run: SizeRunRow; userId: string; body: SizeSetKeep }): Promise<string> {
	const { run } = a;
	if (run.status !== 'done') {
		const why = run.status === 'queued' || run.status === 'running' ? 'is still being made: keep it when it is done' : `is ${run.status}: only a done run can be kept`;
		throw new ApiError(409, 'run_not_done', `This size run ${why}.`);
	}
	const kept = await sizeSetsOfRun(db, run.id);
	if (kept) throw new ApiError(409, 'already_kept', 'This size run is kept already.', { sizeSetId: [kept.id] });
	const sizes = sizesToKeep(run, a.body);
	const { state } = await studioPlan(db, a.studioId);
	const limit = sizeRunCheck(state, sizes.length);
	if (!limit.ok) throw new ApiError(402, 'plan_limit', limit.message);

	const versionOf = new Map((sizes[0].pieces as SizePieceResult[]).map((p) => [p.pieceId, p.versionNumber]));
	const at = styleRecipeAt(await styleRecipeLoad(db, run.styleId), versionOf);
	if (!at.ok) throw new ApiError(409, 'style_changed', `${at.message} ${START_AGAIN}`);
	const rows = new Map((await piecesOfStyle(db, run.styleId)).map((p) => [p.id, p]));

	const inserts: SizeSetSizeInsert[] = [];
	for (const size of sizes) {
		await nextTurn(); // let the server answer others between sizes
		const set = await measurementSetsInStudio(db, a.studioId, size.measurementSetId);
		if (!set) throw new ApiError(409, 'size_changed', `The measurement set of ${size.name} was deleted since the run. ${START_AGAIN}`);
		const r = sizeResult(at.style, measurementsMmOf(set.values));
		if (r.failures.length > 0) throw new ApiError(409, 'results_differ', `${size.name} no longer replays whole (${r.failures[0].pieceName}: ${r.failures[0].message}). ${START_AGAIN}`);
		const versions: SizeSetSizeInsert['versions'] = [];
		for (const p of at.style.pieces) {
			const stored = (size.pieces as SizePieceResult[]).find((x) => x.pieceId === p.id);
			const made = r.pieces.find((x) => x.pieceId === p.id);
			const geometry = r.heads.get(p.id);
			const row = rows.get(p.id);
			if (!stored?.metrics || !made?.metrics || !geometry || !row) throw new ApiError(409, 'results_differ', `${p.name} of ${size.name} is not made the way the run made it. ${START_AGAIN}`);
			const diff = metricsDifference(stored.metrics, made.metrics);
			if (diff) throw new ApiError(409, 'results_differ', `${p.name} of ${size.name} made again differs from the run: ${diff} (the style or the measurement set changed since). ${START_AGAIN}`);
			const head = p.versions[p.versions.length - 1];
			versions.push({
				basePieceId: p.id,
				baseVersionId: head.id,
				baseVersionNumber: head.number,
				name: row.name,
				cut: row.cut,
				fabric: row.fabric,
				geometry: { ...geometry, name: row.name, cut: row.cut },
				metrics: made.metrics,
				checks: r.checks.filter((c) => c.pieceId === p.id)
			});
		}
		const failed = r.checks.filter((c) => !c.passed).length;
		inserts.push({ measurementSetId: set.id, name: size.name, checks: { passed: r.checks.length - failed, failed, list: r.checks }, versions });
	}
	const name = a.body.name ?? sizeSetName(sizes.map((s) => s.name));
	try {
		return await db.transaction().execute((tx) => sizeSetsInsert(tx, { studioId: a.studioId, styleId: run.styleId, sizeRunId: run.id, name, createdBy: a.userId, sizes: inserts }));
	} catch (e) {
		// two keeps of one run at once: the run's unique key lets one through
		if (isUniqueViolation(e)) throw new ApiError(409, 'already_kept', 'This size run is kept already.');
		throw e;
	}
}
