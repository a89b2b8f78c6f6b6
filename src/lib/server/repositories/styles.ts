import type { DbOrTx } from '../db';
import type { StyleStatus } from '../db/schema';

export interface StyleRow {
	id: string;
	studioId: string;
	name: string;
	code: string;
	season: string;
	notes: string;
	measurementSetId: string | null;
	status: StyleStatus;
	createdAt: Date;
}

/** The columns of a style as this repository returns it (camelCase), for queries that read it elsewhere. */
export const styleColumns = [
	'id',
	'studio_id as studioId',
	'name',
	'code',
	'season',
	'notes',
	'measurement_set_id as measurementSetId',
	'status',
	'created_at as createdAt'
] as const;

export async function stylesCreate(
	db: DbOrTx,
	input: { studioId: string; name: string; code?: string; season?: string; notes?: string; measurementSetId?: string | null; createdBy: string }
): Promise<StyleRow> {
	return db
		.insertInto('styles')
		.values({
			studio_id: input.studioId,
			name: input.name,
			code: input.code ?? '',
			season: input.season ?? '',
			notes: input.notes ?? '',
			measurement_set_id: input.measurementSetId ?? null,
			created_by: input.createdBy
		})
		.returning(styleColumns)
		.executeTakeFirstOrThrow();
}

export async function stylesOfStudio(db: DbOrTx, studioId: string): Promise<(StyleRow & { pieceCount: number })[]> {
	return db
		.selectFrom('styles')
		.select(styleColumns)
		.select((eb) =>
			eb
				.selectFrom('pieces')
				.whereRef('pieces.style_id', '=', 'styles.id')
				.select(eb.fn.countAll<number>().as('n'))
				.as('pieceCount')
		)
		.where('studio_id', '=', studioId)
		.orderBy('created_at', 'desc')
		.execute() as Promise<(StyleRow & { pieceCount: number })[]>;
}

/** The style, only if it belongs to the studio (another studio's style is "not found"). */
export async function stylesInStudio(db: DbOrTx, studioId: string, styleId: string): Promise<StyleRow | undefined> {
	return db.selectFrom('styles').select(styleColumns).where('id', '=', styleId).where('studio_id', '=', studioId).executeTakeFirst();
}

export async function stylesUpdate(
	db: DbOrTx,
	styleId: string,
	patch: Partial<Pick<StyleRow, 'name' | 'code' | 'season' | 'notes' | 'status'>>
): Promise<StyleRow | undefined> {
	return db.updateTable('styles').set(patch).where('id', '=', styleId).returning(styleColumns).executeTakeFirst();
}
