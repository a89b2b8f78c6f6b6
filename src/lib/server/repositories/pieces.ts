import type { DbOrTx } from '../db';

export interface PieceRow {
	id: string;
	styleId: string;
	name: string;
	cut: 'pair' | 'single' | 'on_fold';
	fabric: string;
	sortOrder: number;
	headVersionId: string | null;
	headNumber: number;
}

const columns = [
	'pieces.id',
	'pieces.style_id as styleId',
	'pieces.name',
	'pieces.cut',
	'pieces.fabric',
	'pieces.sort_order as sortOrder',
	'pieces.head_version_id as headVersionId',
	'pieces.head_number as headNumber'
] as const;

export async function piecesCreate(
	db: DbOrTx,
	input: { styleId: string; name: string; cut: PieceRow['cut']; fabric?: string; sortOrder?: number }
): Promise<PieceRow> {
	return db
		.insertInto('pieces')
		.values({
			style_id: input.styleId,
			name: input.name,
			cut: input.cut,
			fabric: input.fabric ?? 'self',
			sort_order: input.sortOrder ?? 0
		})
		.returning(columns)
		.executeTakeFirstOrThrow();
}

export async function piecesOfStyle(db: DbOrTx, styleId: string): Promise<PieceRow[]> {
	return db.selectFrom('pieces').select(columns).where('style_id', '=', styleId).orderBy('sort_order').orderBy('name').execute();
}

/** The piece, only if it belongs to the style of that studio. */
export async function piecesInStudio(db: DbOrTx, studioId: string, pieceId: string): Promise<PieceRow | undefined> {
	return db
		.selectFrom('pieces')
		.innerJoin('styles', 'styles.id', 'pieces.style_id')
		.select(columns)
		.where('pieces.id', '=', pieceId)
		.where('styles.studio_id', '=', studioId)
		.executeTakeFirst();
}

/** Locks the piece row for the rest of the transaction: saves of one piece queue behind each other. */
export async function piecesLockForSave(db: DbOrTx, pieceId: string): Promise<PieceRow | undefined> {
	return db.selectFrom('pieces').select(columns).where('pieces.id', '=', pieceId).forUpdate().executeTakeFirst();
}

export async function piecesHeadSet(db: DbOrTx, pieceId: string, versionId: string, number: number): Promise<void> {
	await db.updateTable('pieces').set({ head_version_id: versionId, head_number: number }).where('id', '=', pieceId).execute();
}

export async function piecesDelete(db: DbOrTx, pieceId: string): Promise<void> {
	await db.deleteFrom('pieces').where('id', '=', pieceId).execute();
}
