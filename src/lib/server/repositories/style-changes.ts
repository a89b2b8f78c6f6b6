import type { DbOrTx } from '../db';

export interface StyleChangeRow {
	id: string;
	styleId: string;
	authorId: string | null;
	message: string;
	bases: { pieceId: string; versionId: string }[];
	steps: unknown;
	ledger: unknown;
	checks: unknown;
	createdAt: Date;
}

const columns = ['id', 'style_id as styleId', 'author_id as authorId', 'message', 'bases', 'steps', 'ledger', 'checks', 'created_at as createdAt'] as const;

export async function styleChangesInsert(
	db: DbOrTx,
	c: { styleId: string; authorId: string; message: string; bases: { pieceId: string; versionId: string }[]; steps: unknown; ledger: unknown; checks: unknown }
): Promise<{ id: string }> {
	return db
		.insertInto('style_changes')
		.values({
			style_id: c.styleId,
			author_id: c.authorId,
			message: c.message,
			bases: JSON.stringify(c.bases),
			steps: JSON.stringify(c.steps),
			ledger: JSON.stringify(c.ledger),
			checks: JSON.stringify(c.checks)
		})
		.returning(['id'])
		.executeTakeFirstOrThrow();
}

export async function styleChangesOfStyle(db: DbOrTx, styleId: string): Promise<StyleChangeRow[]> {
	return db.selectFrom('style_changes').select(columns).where('style_id', '=', styleId).orderBy('created_at').execute() as Promise<StyleChangeRow[]>;
}

export async function styleChangesById(db: DbOrTx, styleId: string, changeId: string): Promise<StyleChangeRow | undefined> {
	return db.selectFrom('style_changes').select(columns).where('style_id', '=', styleId).where('id', '=', changeId).executeTakeFirst() as Promise<StyleChangeRow | undefined>;
}
