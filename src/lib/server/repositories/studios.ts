import type { DbOrTx } from '../db';

export interface StudioRow {
	id: string;
	name: string;
}

export async function studiosCreate(db: DbOrTx, name: string): Promise<StudioRow> {
	return db.insertInto('studios').values({ name }).returning(['id', 'name']).executeTakeFirstOrThrow();
}

export async function studiosById(db: DbOrTx, id: string): Promise<StudioRow | undefined> {
	return db.selectFrom('studios').select(['id', 'name']).where('id', '=', id).executeTakeFirst();
}

export async function studiosRename(db: DbOrTx, id: string, name: string): Promise<StudioRow | undefined> {
	return db
		.updateTable('studios')
		.set({ name })
		.where('id', '=', id)
		.returning(['id', 'name'])
		.executeTakeFirst();
}

/**
 * Locks the studio's row for the rest of the transaction. Everything that adds a seat or a style takes
 * it before counting, so two such requests of one studio take turns and the second counts the first.
 */
export async function studiosLockForLimits(db: DbOrTx, id: string): Promise<boolean> {
	return (await db.selectFrom('studios').select('id').where('id', '=', id).forUpdate().executeTakeFirst()) !== undefined;
}
