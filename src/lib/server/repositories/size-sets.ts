import { sql } from 'kysely';
import type { DbOrTx } from '../db';
import type { SizeSetSizeState } from '../db/schema';

export interface SizeSetRow {
	id: string;
	studioId: string;
	styleId: string;
	sizeRunId: string | null;
	name: string;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: Date;
}

export interface SizeSetSizeRow {
	id: string;
	sizeSetId: string;
	measurementSetId: string | null;
	name: string;
	position: number;
	checks: unknown;
	state: SizeSetSizeState;
	signedOffBy: string | null;
	signedOffByName: string | null;
	signedOffAt: Date | null;
	signOffComment: string;
}

export interface SizeSetVersionSummary {
	id: string;
	sizeId: string;
	basePieceId: string | null;
	baseVersionId: string | null;
	baseVersionNumber: number;
	name: string;
	cut: 'pair' | 'single' | 'on_fold';
	fabric: string;
	position: number;
	metrics: unknown;
	checks: unknown;
}

export interface SizeSetVersionRow extends SizeSetVersionSummary {
	geometry: unknown;
}

/** What is stored of one size of a set: the size, then its pieces as versions. */
export interface SizeSetSizeInsert {
	measurementSetId: string | null;
	name: string;
	checks: unknown;
	versions: {
		basePieceId: string;
		baseVersionId: string;
		baseVersionNumber: number;
		name: string;
		cut: SizeSetVersionRow['cut'];
		fabric: string;
		geometry: unknown;
		metrics: unknown;
		checks: unknown;
	}[];
}

const setColumns = [
	'size_sets.id',
	'size_sets.studio_id as studioId',
	'size_sets.style_id as styleId',
	'size_sets.size_run_id as sizeRunId',
	'size_sets.name',
	'size_sets.created_by as createdBy',
	'users.name as createdByName',
	'size_sets.created_at as createdAt'
] as const;

const sizeColumns = [
	'size_set_sizes.id',
	'size_set_sizes.size_set_id as sizeSetId',
	'size_set_sizes.measurement_set_id as measurementSetId',
	'size_set_sizes.name',
	'size_set_sizes.position',
	'size_set_sizes.checks',
	'size_set_sizes.state',
	'size_set_sizes.signed_off_by as signedOffBy',
	'users.name as signedOffByName',
	'size_set_sizes.signed_off_at as signedOffAt',
	'size_set_sizes.sign_off_comment as signOffComment'
] as const;

const versionSummary = [
	'size_set_versions.id',
	'size_set_versions.size_id as sizeId',
	'size_set_versions.base_piece_id as basePieceId',
	'size_set_versions.base_version_id as baseVersionId',
	'size_set_versions.base_version_number as baseVersionNumber',
	'size_set_versions.name',
	'size_set_versions.cut',
	'size_set_versions.fabric',
	'size_set_versions.position',
	'size_set_versions.metrics',
	'size_set_versions.checks'
] as const;

/** Stores a size set with its sizes and their pieces (call inside a transaction). */
export async function sizeSetsInsert(
	tx: DbOrTx,
	s: { studioId: string; styleId: string; sizeRunId: string; name: string; createdBy: string; sizes: readonly SizeSetSizeInsert[] }
): Promise<string> {
	const { id } = await tx
		.insertInto('size_sets')
		.values({ studio_id: s.studioId, style_id: s.styleId, size_run_id: s.sizeRunId, name: s.name, created_by: s.createdBy })
		.returning('id')
		.executeTakeFirstOrThrow();
	for (const [position, size] of s.sizes.entries()) {
		const row = await tx
			.insertInto('size_set_sizes')
			.values({ size_set_id: id, measurement_set_id: size.measurementSetId, name: size.name, position, checks: JSON.stringify(size.checks) })
			.returning('id')
			.executeTakeFirstOrThrow();
		if (size.versions.length === 0) continue;
		await tx
			.insertInto('size_set_versions')
			.values(
				size.versions.map((v, k) => ({
					size_id: row.id,
					base_piece_id: v.basePieceId,
					base_version_id: v.baseVersionId,
					base_version_number: v.baseVersionNumber,
					name: v.name,
					cut: v.cut,
					fabric: v.fabric,
					position: k,
					geometry: JSON.stringify(v.geometry),
					metrics: JSON.stringify(v.metrics),
					checks: JSON.stringify(v.checks)
				}))
			)
			.execute();
	}
	return id;
}

/** A set of the studio (another studio's sets are not found). */
export async function sizeSetsById(db: DbOrTx, studioId: string, id: string): Promise<SizeSetRow | undefined> {
	return db
		.selectFrom('size_sets')
		.leftJoin('users', 'users.id', 'size_sets.created_by')
		.select(setColumns)
		.where('size_sets.id', '=', id)
		.where('size_sets.studio_id', '=', studioId)
		.executeTakeFirst();
}

/** The set a run was kept as, if it was. */
export async function sizeSetsOfRun(db: DbOrTx, sizeRunId: string): Promise<{ id: string } | undefined> {
	return db.selectFrom('size_sets').select('id').where('size_run_id', '=', sizeRunId).executeTakeFirst();
}

export async function sizeSetsOfStyle(db: DbOrTx, studioId: string, styleId: string): Promise<SizeSetRow[]> {
	return db
		.selectFrom('size_sets')
		.leftJoin('users', 'users.id', 'size_sets.created_by')
		.select(setColumns)
		.where('size_sets.studio_id', '=', studioId)
		.where('size_sets.style_id', '=', styleId)
		.orderBy('size_sets.created_at', 'desc')
		.limit(100)
		.execute();
}

/** The sizes of some sets, in each set's order. */
export async function sizeSetSizesOf(db: DbOrTx, sizeSetIds: readonly string[]): Promise<SizeSetSizeRow[]> {
	if (sizeSetIds.length === 0) return [];
	return db
		.selectFrom('size_set_sizes')
		.leftJoin('users', 'users.id', 'size_set_sizes.signed_off_by')
		.select(sizeColumns)
		.where('size_set_sizes.size_set_id', 'in', sizeSetIds)
		.orderBy('size_set_sizes.size_set_id')
		.orderBy('size_set_sizes.position')
		.execute() as Promise<SizeSetSizeRow[]>;
}

/** The pieces of some sizes (without geometry), in each size's order. */
export async function sizeSetVersionsOf(db: DbOrTx, sizeIds: readonly string[]): Promise<SizeSetVersionSummary[]> {
	if (sizeIds.length === 0) return [];
	return db
		.selectFrom('size_set_versions')
		.select(versionSummary)
		.where('size_id', 'in', sizeIds)
		.orderBy('size_id')
		.orderBy('position')
		.execute();
}

/** The pieces of some sizes with their geometry (exports), in each size's order. */
export async function sizeSetVersionsWithGeometry(db: DbOrTx, sizeIds: readonly string[]): Promise<SizeSetVersionRow[]> {
	if (sizeIds.length === 0) return [];
	return db
		.selectFrom('size_set_versions')
		.select([...versionSummary, 'size_set_versions.geometry'])
		.where('size_id', 'in', sizeIds)
		.orderBy('size_id')
		.orderBy('position')
		.execute();
}

/** Locks the set's sizes for the rest of the transaction (sign-offs of one set queue behind each other). */
export async function sizeSetSizesLock(tx: DbOrTx, sizeSetId: string): Promise<{ id: string; state: SizeSetSizeState }[]> {
	return tx.selectFrom('size_set_sizes').select(['id', 'state']).where('size_set_id', '=', sizeSetId).orderBy('position').forUpdate().execute();
}

/** Signs sizes off that are still drafts; the ids of those it signed. */
export async function sizeSetSizesSignOff(tx: DbOrTx, sizeIds: readonly string[], userId: string, comment: string): Promise<string[]> {
	if (sizeIds.length === 0) return [];
	const rows = await tx
		.updateTable('size_set_sizes')
		.set({ state: 'signed_off', signed_off_by: userId, signed_off_at: sql<Date>`now()`, sign_off_comment: comment })
		.where('id', 'in', sizeIds)
		.where('state', '=', 'draft')
		.returning('id')
		.execute();
	return rows.map((r) => r.id);
}
