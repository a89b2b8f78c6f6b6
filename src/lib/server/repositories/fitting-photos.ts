import type { DbOrTx } from '../db';

export interface PhotoRow {
	id: string;
	fittingId: string;
	displayKey: string;
	thumbKey: string;
	contentType: string;
	width: number;
	height: number;
	thumbWidth: number;
	thumbHeight: number;
	bytes: number;
	caption: string;
	createdBy: string | null;
	createdAt: Date;
}

const columns = [
	'id',
	'fitting_id as fittingId',
	'display_key as displayKey',
	'thumb_key as thumbKey',
	'content_type as contentType',
	'width',
	'height',
	'thumb_width as thumbWidth',
	'thumb_height as thumbHeight',
	'bytes',
	'caption',
	'created_by as createdBy',
	'created_at as createdAt'
] as const;

export async function photosInsert(db: DbOrTx, p: Omit<PhotoRow, 'id' | 'createdAt'>): Promise<PhotoRow> {
	return db
		.insertInto('fitting_photos')
		.values({
			fitting_id: p.fittingId,
			display_key: p.displayKey,
			thumb_key: p.thumbKey,
			content_type: p.contentType,
			width: p.width,
			height: p.height,
			thumb_width: p.thumbWidth,
			thumb_height: p.thumbHeight,
			bytes: p.bytes,
			caption: p.caption,
			created_by: p.createdBy
		})
		.returning(columns)
		.executeTakeFirstOrThrow();
}

export async function photosOfFitting(db: DbOrTx, fittingId: string): Promise<PhotoRow[]> {
	return db.selectFrom('fitting_photos').select(columns).where('fitting_id', '=', fittingId).orderBy('created_at').orderBy('id').execute();
}

export async function photosCount(db: DbOrTx, fittingId: string): Promise<number> {
	const r = await db
		.selectFrom('fitting_photos')
		.select((eb) => eb.fn.countAll<number>().as('n'))
		.where('fitting_id', '=', fittingId)
		.executeTakeFirstOrThrow();
	return Number(r.n);
}

export async function photosById(db: DbOrTx, fittingId: string, photoId: string): Promise<PhotoRow | undefined> {
	return db.selectFrom('fitting_photos').select(columns).where('fitting_id', '=', fittingId).where('id', '=', photoId).executeTakeFirst();
}

/** Removes the row and answers the object keys it held (for the store), or undefined when there was none. */
export async function photosDelete(db: DbOrTx, fittingId: string, photoId: string): Promise<string[] | undefined> {
	const r = await db
		.deleteFrom('fitting_photos')
		.where('fitting_id', '=', fittingId)
		.where('id', '=', photoId)
		.returning(['display_key', 'thumb_key'])
		.executeTakeFirst();
	return r ? [r.display_key, r.thumb_key] : undefined;
}

/** Every object key of a fitting's photos (before the fitting is deleted). */
export async function photosKeysOfFitting(db: DbOrTx, fittingId: string): Promise<string[]> {
	const rows = await db.selectFrom('fitting_photos').select(['display_key', 'thumb_key']).where('fitting_id', '=', fittingId).execute();
	return rows.flatMap((r) => [r.display_key, r.thumb_key]);
}
