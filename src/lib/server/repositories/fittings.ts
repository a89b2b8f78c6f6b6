import { sql } from 'kysely';
import type { DbOrTx } from '../db';
import { authorName } from './former-member';

export interface FittingRow {
	id: string;
	styleId: string;
	studioId: string;
	fittedOn: string;
	title: string;
	measurementSetId: string | null;
	fitModel: string;
	fabric: string;
	notes: string;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: Date;
}

export interface FittingInput {
	styleId: string;
	fittedOn: string;
	title: string;
	measurementSetId: string | null;
	fitModel: string;
	fabric: string;
	notes: string;
	createdBy: string;
}

function selectFittings(db: DbOrTx) {
	return db
		.selectFrom('fittings')
		.innerJoin('styles', 'styles.id', 'fittings.style_id')
		.leftJoin('users', 'users.id', 'fittings.created_by')
		.select([
			'fittings.id',
			'fittings.style_id as styleId',
			'styles.studio_id as studioId',
			sql<string>`to_char(fittings.fitted_on, 'YYYY-MM-DD')`.as('fittedOn'),
			'fittings.title',
			'fittings.measurement_set_id as measurementSetId',
			'fittings.fit_model as fitModel',
			'fittings.fabric',
			'fittings.notes',
			'fittings.created_by as createdBy',
			authorName('users.name', 'createdByName'),
			'fittings.created_at as createdAt'
		]);
}

export async function fittingsCreate(db: DbOrTx, input: FittingInput, versionIds: readonly string[]): Promise<{ id: string }> {
	const row = await db
		.insertInto('fittings')
		.values({
			style_id: input.styleId,
			fitted_on: input.fittedOn,
			title: input.title,
			measurement_set_id: input.measurementSetId,
			fit_model: input.fitModel,
			fabric: input.fabric,
			notes: input.notes,
			created_by: input.createdBy
		})
		.returning('id')
		.executeTakeFirstOrThrow();
	if (versionIds.length > 0) {
		await db
			.insertInto('fitting_versions')
			.values(versionIds.map((versionId) => ({ fitting_id: row.id, version_id: versionId })))
			.execute();
	}
	return row;
}

/** The fitting when it belongs to a style of this studio (undefined for another studio's). */
export async function fittingsInStudio(db: DbOrTx, studioId: string, fittingId: string): Promise<FittingRow | undefined> {
	return selectFittings(db).where('fittings.id', '=', fittingId).where('styles.studio_id', '=', studioId).executeTakeFirst();
}

/** A style's fittings, newest fitting date first, each with its photo and note counts. */
export async function fittingsOfStyle(
	db: DbOrTx,
	styleId: string
): Promise<(FittingRow & { photoCount: number; openNoteCount: number; noteCount: number })[]> {
	return selectFittings(db)
		.select((eb) => [
			eb.selectFrom('fitting_photos').select(eb.fn.countAll<number>().as('n')).whereRef('fitting_photos.fitting_id', '=', 'fittings.id').as('photoCount'),
			eb.selectFrom('fit_notes').select(eb.fn.countAll<number>().as('n')).whereRef('fit_notes.fitting_id', '=', 'fittings.id').as('noteCount'),
			eb
				.selectFrom('fit_notes')
				.select(eb.fn.countAll<number>().as('n'))
				.whereRef('fit_notes.fitting_id', '=', 'fittings.id')
				.where('fit_notes.status', '!=', 'done')
				.as('openNoteCount')
		])
		.where('fittings.style_id', '=', styleId)
		.orderBy('fittings.fitted_on', 'desc')
		.orderBy('fittings.created_at', 'desc')
		.execute() as Promise<(FittingRow & { photoCount: number; openNoteCount: number; noteCount: number })[]>;
}

/** The piece versions the fitting's toile was cut from: piece name and version number beside each. */
export async function fittingVersions(
	db: DbOrTx,
	fittingId: string
): Promise<{ versionId: string; pieceId: string; pieceName: string; number: number; state: string }[]> {
	return db
		.selectFrom('fitting_versions')
		.innerJoin('piece_versions', 'piece_versions.id', 'fitting_versions.version_id')
		.innerJoin('pieces', 'pieces.id', 'piece_versions.piece_id')
		.select([
			'piece_versions.id as versionId',
			'pieces.id as pieceId',
			'pieces.name as pieceName',
			'piece_versions.number',
			'piece_versions.state'
		])
		.where('fitting_versions.fitting_id', '=', fittingId)
		.orderBy('pieces.sort_order')
		.orderBy('pieces.name')
		.execute();
}

export async function fittingsDelete(db: DbOrTx, fittingId: string): Promise<void> {
	await db.deleteFrom('fittings').where('id', '=', fittingId).execute();
}

/** Locks the fitting row for the rest of the transaction (photo counts stay true under concurrent uploads). */
export async function fittingsLock(db: DbOrTx, fittingId: string): Promise<boolean> {
	const r = await db.selectFrom('fittings').select('id').where('id', '=', fittingId).forUpdate().executeTakeFirst();
	return r !== undefined;
}
