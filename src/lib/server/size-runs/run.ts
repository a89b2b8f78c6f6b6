import { setImmediate as nextTurn } from 'node:timers/promises';
import { sizeResult } from '$lib/pattern/grading/size-result';
import type { MeasurementsMm } from '$lib/pattern/measurements';
import type { Piece } from '$lib/pattern/piece-schema';
import { styleRecipeStepCount } from '$lib/pattern/grading/style-recipe';
import type { DbOrTx } from '../db';
import { log } from '../log';
import { measurementSetsInStudio } from '../repositories/measurement-sets';
import { sizeRunsFinish, sizeRunsForWorker, sizeRunsProgress, sizeRunsStart } from '../repositories/size-runs';
import { measurementsMmOf } from '../measurements/sets';
import { styleRecipeLoad } from './style-recipe-load';

/** What one size of a run gave, as stored and answered by the API. */
export interface SizeRunSizeResult {
	measurementSetId: string;
	name: string;
	/** done: every piece made; failed: at least one step could not be made again (the others were). */
	status: 'done' | 'failed';
	stepsDone: number;
	pieces: unknown[];
	failures: unknown[];
	checks: { passed: number; failed: number; list: unknown[] };
	error?: string;
	/** The measurements the size was made from (mm), as they were when it was made. */
	measurementsMm?: MeasurementsMm;
	/** Each piece's head as made on this size, by piece id: kept for the nest view, not sent by the API. */
	heads?: Record<string, Piece>;
}

/**
 * Runs one size run (the queue's job handler calls this with the run's id): loads the style once, then
 * replays it size by size (pure: $lib/pattern/grading), storing each size's result and the progress as
 * it goes. A size that fails does not stop the others; a run cancelled meanwhile stops after the size in
 * hand. Returns at once for a run that is no longer queued or running.
 */
export async function sizeRunExecute(db: DbOrTx, runId: string): Promise<void> {
	const run = await sizeRunsForWorker(db, runId);
	if (!run || (run.status !== 'queued' && run.status !== 'running')) return;
	let style;
	try {
		style = await styleRecipeLoad(db, run.styleId);
	} catch (e) {
		await sizeRunsFinish(db, runId, 'failed', `The style could not be read: ${(e as Error).message}`);
		throw e;
	}
	const perSize = styleRecipeStepCount(style);
	if (!(await sizeRunsStart(db, runId, perSize * run.sizes.length))) return;
	const results: SizeRunSizeResult[] = [];
	let done = 0;
	for (const size of run.sizes) {
		// let the web server answer between sizes
		await nextTurn();
		const set = await measurementSetsInStudio(db, run.studioId, size.measurementSetId);
		let result: SizeRunSizeResult;
		if (!set) {
			result = { ...size, status: 'failed', stepsDone: 0, pieces: [], failures: [], checks: { passed: 0, failed: 0, list: [] }, error: 'The measurement set was deleted before its size was made.' };
		} else {
			try {
				const mm = measurementsMmOf(set.values);
				const r = sizeResult(style, mm);
				const failed = r.checks.filter((c) => !c.passed).length;
				result = {
					measurementSetId: size.measurementSetId,
					name: set.name,
					status: r.failures.length === 0 ? 'done' : 'failed',
					stepsDone: r.stepsDone,
					pieces: [...r.pieces],
					failures: [...r.failures],
					checks: { passed: r.checks.length - failed, failed, list: [...r.checks] },
					measurementsMm: mm,
					heads: Object.fromEntries(r.heads)
				};
			} catch (e) {
				result = { ...size, status: 'failed', stepsDone: 0, pieces: [], failures: [], checks: { passed: 0, failed: 0, list: [] }, error: `This size could not be made: ${(e as Error).message}` };
			}
		}
		done += perSize;
		results.push(result);
		if (!(await sizeRunsProgress(db, runId, done, results))) return; // cancelled meanwhile
	}
	await sizeRunsFinish(db, runId, 'done', null);
	// one line per run, from the process whose worker made it (any app process may take a queued run)
	log.info({ sizeRunId: runId, studioId: run.studioId, sizes: run.sizes.length }, 'size run done');
}
