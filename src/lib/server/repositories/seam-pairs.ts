import type { DbOrTx } from '../db';

/** One side of a seam: the stretch of a piece's stitching line from `from` to `to` (outline order). */
export interface SeamEdge {
	from: { x: number; y: number };
	to: { x: number; y: number };
}

export interface SeamPairRow {
	id: string;
	styleId: string;
	label: string;
	aPieceId: string;
	aEdge: SeamEdge;
	bPieceId: string;
	bEdge: SeamEdge;
	allowedEaseMm: number;
	toleranceMm: number;
}

/** The columns of a seam pair as this repository returns it (camelCase), for queries that read it elsewhere. */
export const seamPairColumns = [
	'id',
	'style_id as styleId',
	'label',
	'a_piece_id as aPieceId',
	'a_edge as aEdge',
	'b_piece_id as bPieceId',
	'b_edge as bEdge',
	'allowed_ease_mm as allowedEaseMm',
	'tolerance_mm as toleranceMm'
] as const;

export async function seamPairsCreate(db: DbOrTx, p: Omit<SeamPairRow, 'id'>): Promise<SeamPairRow> {
	return db
		.insertInto('seam_pairs')
		.values({
			style_id: p.styleId,
			label: p.label,
			a_piece_id: p.aPieceId,
			a_edge: JSON.stringify(p.aEdge),
			b_piece_id: p.bPieceId,
			b_edge: JSON.stringify(p.bEdge),
			allowed_ease_mm: p.allowedEaseMm,
			tolerance_mm: p.toleranceMm
		})
		.returning(seamPairColumns)
		.executeTakeFirstOrThrow() as Promise<SeamPairRow>;
}

export async function seamPairsOfStyle(db: DbOrTx, styleId: string): Promise<SeamPairRow[]> {
	return db.selectFrom('seam_pairs').select(seamPairColumns).where('style_id', '=', styleId).orderBy('created_at').execute() as Promise<
		SeamPairRow[]
	>;
}

export async function seamPairsInStyle(db: DbOrTx, styleId: string, seamPairId: string): Promise<SeamPairRow | undefined> {
	return db.selectFrom('seam_pairs').select(seamPairColumns).where('style_id', '=', styleId).where('id', '=', seamPairId).executeTakeFirst() as Promise<
		SeamPairRow | undefined
	>;
}

export async function seamPairsUpdate(
	db: DbOrTx,
	seamPairId: string,
	patch: { label?: string; aEdge?: SeamEdge; bEdge?: SeamEdge; allowedEaseMm?: number; toleranceMm?: number }
): Promise<SeamPairRow | undefined> {
	return db
		.updateTable('seam_pairs')
		.set({
			...(patch.label !== undefined ? { label: patch.label } : {}),
			...(patch.aEdge ? { a_edge: JSON.stringify(patch.aEdge) } : {}),
			...(patch.bEdge ? { b_edge: JSON.stringify(patch.bEdge) } : {}),
			...(patch.allowedEaseMm !== undefined ? { allowed_ease_mm: patch.allowedEaseMm } : {}),
			...(patch.toleranceMm !== undefined ? { tolerance_mm: patch.toleranceMm } : {})
		})
		.where('id', '=', seamPairId)
		.returning(seamPairColumns)
		.executeTakeFirst() as Promise<SeamPairRow | undefined>;
}

/** Unpair: remove a seam pair of the style (the pieces themselves stay as they are). */
export async function seamPairsDelete(db: DbOrTx, styleId: string, seamPairId: string): Promise<boolean> {
	const r = await db.deleteFrom('seam_pairs').where('style_id', '=', styleId).where('id', '=', seamPairId).executeTakeFirst();
	return Number(r.numDeletedRows) > 0;
}
