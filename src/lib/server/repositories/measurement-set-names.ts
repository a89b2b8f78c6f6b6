import type { DbOrTx } from '../db';

export async function measurementSetName(db: DbOrTx, id: string): Promise<string | undefined> {
	const row = await db.selectFrom('measurement_sets').select('name').where('id', '=', id).executeTakeFirst();
	return row?.name;
}
