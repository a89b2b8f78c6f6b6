import { z } from 'zod';
import { sizeRunCheck } from '$lib/billing/plans';
import { studioPlan } from '../billing/plan';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { measurementSetsInStudio } from '../repositories/measurement-sets';
import { sizeRunsCancel, sizeRunsInsert, sizeRunsJobSet, type SizeRunRow } from '../repositories/size-runs';
import { styleOr404 } from '../versions/access';
import { sizeRunDequeue, sizeRunEnqueue } from './queue';
import type { SizeRunSizeResult } from './run';

/** The most sizes one run may hold on any plan (the whole ASTM D5585 misses chart, both waists). */
export const SIZE_RUN_MAX_SIZES = 24;

export const sizeRunStartSchema = z.object({
	measurementSetIds: z
		.array(z.uuid('Not a valid measurement set id.'), { message: 'List the measurement sets to make the style in.' })
		.min(1, 'Pick at least one measurement set.')
		.max(SIZE_RUN_MAX_SIZES, `A size run holds at most ${SIZE_RUN_MAX_SIZES} sizes.`)
		.refine((ids) => new Set(ids).size === ids.length, { message: 'A measurement set is listed twice.' })
});
export type SizeRunStart = z.output<typeof sizeRunStartSchema>;

/**
 * Starts a size run of a style over measurement sets of the studio: checks the plan's limit of sizes
 * per run (402), stores the run as queued and puts it on the queue. Answered at once; the worker does the
 * rest.
 */
export async function sizeRunStart(db: Db, a: { studioId: string; styleId: string; userId: string; body: SizeRunStart }): Promise<SizeRunRow> {
	await styleOr404(db, a.studioId, a.styleId);
	const { state } = await studioPlan(db, a.studioId);
	const check = sizeRunCheck(state, a.body.measurementSetIds.length);
	if (!check.ok) throw new ApiError(402, 'plan_limit', check.message);
	const sizes: { measurementSetId: string; name: string }[] = [];
	for (const id of a.body.measurementSetIds) {
		const set = await measurementSetsInStudio(db, a.studioId, id);
		if (!set) throw new ApiError(404, 'not_found', 'No such measurement set in this studio.', { measurementSetIds: [`${id} is not a measurement set of this studio.`] });
		sizes.push({ measurementSetId: set.id, name: set.name });
	}
	const run = await sizeRunsInsert(db, { studioId: a.studioId, styleId: a.styleId, createdBy: a.userId, sizes });
	const jobId = await sizeRunEnqueue(run.id);
	if (jobId) await sizeRunsJobSet(db, run.id, jobId);
	return run;
}

/** Cancels a queued or running run (409 when it has finished). */
export async function sizeRunCancel(db: Db, studioId: string, run: SizeRunRow): Promise<void> {
	if (!(await sizeRunsCancel(db, studioId, run.id))) throw new ApiError(409, 'finished', `This size run is ${run.status}: there is nothing to cancel.`);
	await sizeRunDequeue(run.jobId);
}

/** A run as the API answers it: status, progress (steps done of steps total) and each size. */
export function sizeRunView(run: SizeRunRow) {
	const results = run.results as SizeRunSizeResult[];
	return {
		id: run.id,
		styleId: run.styleId,
		status: run.status,
		progress: { stepsDone: run.stepsDone, stepsTotal: run.stepsTotal },
		sizes: run.sizes.map((s) => {
			const r = results.find((x) => x.measurementSetId === s.measurementSetId);
			if (r) {
				// the outlines are kept for the run's page (nest view), not sent with every read of the run
				const { heads: _heads, ...rest } = r;
				return rest;
			}
			return { measurementSetId: s.measurementSetId, name: s.name, status: run.status === 'cancelled' ? 'cancelled' : 'pending' };
		}),
		error: run.error,
		createdAt: run.createdAt,
		updatedAt: run.updatedAt
	};
}
