import { sql } from 'kysely';
import type { DbOrTx } from '../db';

export type SizeRunStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

export interface SizeRunSize {
	measurementSetId: string;
	name: string;
}

export interface SizeRunRow {
	id: string;
	studioId: string;
	styleId: string;
	createdBy: string | null;
	status: SizeRunStatus;
	sizes: SizeRunSize[];
	results: unknown[];
	stepsDone: number;
	stepsTotal: number;
	error: string | null;
	jobId: string | null;
	createdAt: Date;
	updatedAt: Date;
}

const columns = [
	'id',
	'studio_id as studioId',
	'style_id as styleId',
	'created_by as createdBy',
	'status',
	'sizes',
	'results',
	'steps_done as stepsDone',
	'steps_total as stepsTotal',
	'error',
	'job_id as jobId',
	'created_at as createdAt',
	'updated_at as updatedAt'
] as const;

export async function sizeRunsInsert(db: DbOrTx, r: { studioId: string; styleId: string; createdBy: string; sizes: SizeRunSize[] }): Promise<SizeRunRow> {
	return (await db
		.insertInto('size_runs')
		.values({ studio_id: r.studioId, style_id: r.styleId, created_by: r.createdBy, sizes: JSON.stringify(r.sizes) })
		.returning(columns)
		.executeTakeFirstOrThrow()) as SizeRunRow;
}

/** A run of the studio (another studio's runs are not found). */
export async function sizeRunsById(db: DbOrTx, studioId: string, id: string): Promise<SizeRunRow | undefined> {
	return (await db.selectFrom('size_runs').select(columns).where('id', '=', id).where('studio_id', '=', studioId).executeTakeFirst()) as SizeRunRow | undefined;
}

/** A run by id alone: for the worker, which is given the id by the queue. */
export async function sizeRunsForWorker(db: DbOrTx, id: string): Promise<SizeRunRow | undefined> {
	return (await db.selectFrom('size_runs').select(columns).where('id', '=', id).executeTakeFirst()) as SizeRunRow | undefined;
}

export async function sizeRunsOfStyle(db: DbOrTx, studioId: string, styleId: string): Promise<SizeRunRow[]> {
	return (await db.selectFrom('size_runs').select(columns).where('studio_id', '=', studioId).where('style_id', '=', styleId).orderBy('created_at', 'desc').limit(50).execute()) as SizeRunRow[];
}

export async function sizeRunsJobSet(db: DbOrTx, id: string, jobId: string): Promise<void> {
	await db.updateTable('size_runs').set({ job_id: jobId }).where('id', '=', id).execute();
}

/** Moves a run to running (only from queued: a cancelled run stays cancelled); true when it moved. */
export async function sizeRunsStart(db: DbOrTx, id: string, stepsTotal: number): Promise<boolean> {
	const r = await db
		.updateTable('size_runs')
		.set({ status: 'running', steps_total: stepsTotal, steps_done: 0, updated_at: sql<Date>`now()` })
		.where('id', '=', id)
		.where('status', 'in', ['queued', 'running'])
		.executeTakeFirst();
	return Number(r.numUpdatedRows) > 0;
}

/** Records progress and the sizes made so far; false when the run was cancelled meanwhile. */
export async function sizeRunsProgress(db: DbOrTx, id: string, stepsDone: number, results: unknown[]): Promise<boolean> {
	const r = await db
		.updateTable('size_runs')
		.set({ steps_done: stepsDone, results: JSON.stringify(results), updated_at: sql<Date>`now()` })
		.where('id', '=', id)
		.where('status', '=', 'running')
		.executeTakeFirst();
	return Number(r.numUpdatedRows) > 0;
}

export async function sizeRunsFinish(db: DbOrTx, id: string, status: 'done' | 'failed', error: string | null): Promise<void> {
	await db
		.updateTable('size_runs')
		.set({ status, error, updated_at: sql<Date>`now()` })
		.where('id', '=', id)
		.where('status', 'in', ['queued', 'running'])
		.execute();
}

/** Cancels a run that has not finished; true when it was cancelled. */
export async function sizeRunsCancel(db: DbOrTx, studioId: string, id: string): Promise<boolean> {
	const r = await db
		.updateTable('size_runs')
		.set({ status: 'cancelled', updated_at: sql<Date>`now()` })
		.where('id', '=', id)
		.where('studio_id', '=', studioId)
		.where('status', 'in', ['queued', 'running'])
		.executeTakeFirst();
	return Number(r.numUpdatedRows) > 0;
}
