import { sql } from 'kysely';
import type { MeasurementValue } from '../../pattern/measurements';
import type { Db, DbOrTx } from '../db';

/** Units a set is shown and typed in (values are always stored in mm). */
export type SetUnit = 'mm' | 'cm' | 'in';

export interface ChartSourceData {
	standard: string;
	table: string;
	size: string;
	variant?: string;
}

export interface MeasurementSetRow {
	id: string;
	studioId: string;
	name: string;
	kind: 'chart' | 'client';
	/** Where the values come from, in words (a chart's standard and table, or what a copy was made from). */
	source: string;
	/** A client reference code of the studio ('' for a custom set not tied to a client). */
	clientRef: string;
	notes: string;
	unit: SetUnit;
	readOnly: boolean;
	/** Measured or chart values only (derived values are never stored). */
	values: MeasurementValue[];
	chartKey: string | null;
	chartSource: ChartSourceData | null;
	sortOrder: number;
	createdBy: string | null;
	createdAt: Date;
	updatedAt: Date;
}

const columns = [
	'id',
	'studio_id as studioId',
	'name',
	'kind',
	'source',
	'client_ref as clientRef',
	'notes',
	'unit',
	'read_only as readOnly',
	'values',
	'chart_key as chartKey',
	'chart_source as chartSource',
	'sort_order as sortOrder',
	'created_by as createdBy',
	'created_at as createdAt',
	'updated_at as updatedAt'
] as const;

type Raw = Omit<MeasurementSetRow, 'values' | 'chartSource'> & { values: unknown; chartSource: unknown };
const row = (r: Raw): MeasurementSetRow => ({
	...r,
	values: r.values as MeasurementValue[],
	chartSource: (r.chartSource as ChartSourceData | null) ?? null
});

export interface MeasurementSetInsert {
	studioId: string;
	name: string;
	kind: 'chart' | 'client';
	source?: string;
	clientRef?: string;
	notes?: string;
	unit: SetUnit;
	readOnly?: boolean;
	values: MeasurementValue[];
	chartKey?: string | null;
	chartSource?: ChartSourceData | null;
	sortOrder?: number;
	createdBy: string | null;
}

function insertValues(s: MeasurementSetInsert) {
	return {
		studio_id: s.studioId,
		name: s.name,
		kind: s.kind,
		source: s.source ?? '',
		client_ref: s.clientRef ?? '',
		notes: s.notes ?? '',
		unit: s.unit,
		read_only: s.readOnly ?? false,
		values: JSON.stringify(s.values),
		chart_key: s.chartKey ?? null,
		chart_source: s.chartSource ? JSON.stringify(s.chartSource) : null,
		sort_order: s.sortOrder ?? 0,
		created_by: s.createdBy
	};
}

export async function measurementSetsCreate(db: DbOrTx, s: MeasurementSetInsert): Promise<MeasurementSetRow> {
	return row(await db.insertInto('measurement_sets').values(insertValues(s)).returning(columns).executeTakeFirstOrThrow());
}

/** Inserts chart rows; a row whose (studio, chart key) is already there is left as it is. */
export async function measurementSetsInsertCharts(db: DbOrTx, sets: MeasurementSetInsert[]): Promise<number> {
	if (sets.length === 0) return 0;
	const r = await db
		.insertInto('measurement_sets')
		.values(sets.map(insertValues))
		.onConflict((oc) => oc.columns(['studio_id', 'chart_key']).where('chart_key', 'is not', null).doNothing())
		.executeTakeFirst();
	return Number(r.numInsertedOrUpdatedRows ?? 0);
}

export async function measurementSetsChartCount(db: DbOrTx, studioId: string): Promise<number> {
	const r = await db
		.selectFrom('measurement_sets')
		.select((eb) => eb.fn.countAll<number>().as('n'))
		.where('studio_id', '=', studioId)
		.where('chart_key', 'is not', null)
		.executeTakeFirstOrThrow();
	return Number(r.n);
}

/** Charts first (in chart order), then the studio's own sets, newest first. */
export async function measurementSetsOfStudio(db: DbOrTx, studioId: string): Promise<MeasurementSetRow[]> {
	const rows = await db
		.selectFrom('measurement_sets')
		.select(columns)
		.where('studio_id', '=', studioId)
		.orderBy(sql`case when kind = 'chart' then 0 else 1 end`)
		.orderBy('sort_order')
		.orderBy('created_at', 'desc')
		.execute();
	return rows.map(row);
}

/** The set, only if it belongs to the studio (another studio's set is "not found"). */
export async function measurementSetsInStudio(db: DbOrTx, studioId: string, id: string): Promise<MeasurementSetRow | undefined> {
	const r = await db.selectFrom('measurement_sets').select(columns).where('id', '=', id).where('studio_id', '=', studioId).executeTakeFirst();
	return r ? row(r) : undefined;
}

export async function measurementSetsUpdate(
	db: DbOrTx,
	studioId: string,
	id: string,
	patch: Partial<Pick<MeasurementSetRow, 'name' | 'clientRef' | 'notes' | 'unit' | 'values'>>
): Promise<MeasurementSetRow | undefined> {
	const r = await db
		.updateTable('measurement_sets')
		.set({
			...(patch.name !== undefined ? { name: patch.name } : {}),
			...(patch.clientRef !== undefined ? { client_ref: patch.clientRef } : {}),
			...(patch.notes !== undefined ? { notes: patch.notes } : {}),
			...(patch.unit !== undefined ? { unit: patch.unit } : {}),
			...(patch.values !== undefined ? { values: JSON.stringify(patch.values) } : {}),
			updated_at: sql<Date>`now()`
		})
		.where('id', '=', id)
		.where('studio_id', '=', studioId)
		.where('read_only', '=', false)
		.returning(columns)
		.executeTakeFirst();
	return r ? row(r) : undefined;
}

export async function measurementSetsDelete(db: DbOrTx, studioId: string, id: string): Promise<boolean> {
	const r = await db
		.deleteFrom('measurement_sets')
		.where('id', '=', id)
		.where('studio_id', '=', studioId)
		.where('read_only', '=', false)
		.executeTakeFirst();
	return Number(r.numDeletedRows) > 0;
}

/**
 * Removes a style that a block draft has just created, with its pieces and versions, when one of its
 * first versions was refused (the draft is all or nothing). Only for that clean-up.
 */
export async function draftedStyleDiscard(db: Db, studioId: string, styleId: string): Promise<void> {
	await db.transaction().execute(async (tx) => {
		const pieces = tx.selectFrom('pieces').select('id').where('style_id', '=', styleId);
		await tx.updateTable('pieces').set({ head_version_id: null }).where('style_id', '=', styleId).execute();
		// fit notes first: a done note pinned to one version and resolved by another would otherwise meet
		// the resolved one's SET NULL before its own cascade, which its check refuses
		await tx.deleteFrom('fit_notes').where('piece_id', 'in', pieces).execute();
		await tx.deleteFrom('piece_versions').where('piece_id', 'in', pieces).execute();
		await tx.deleteFrom('styles').where('id', '=', styleId).where('studio_id', '=', studioId).execute();
	});
}
