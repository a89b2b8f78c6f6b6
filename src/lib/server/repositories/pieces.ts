import { sql } from 'kysely';
import type { DbOrTx } from '../db';
import type { VersionState } from '../db/schema';

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

/** The version of a piece a reader is shown: its head, or for the sample room its latest signed-off one. */
export interface ShownVersion {
	id: string;
	number: number;
	state: VersionState;
	geometry: unknown;
	metrics: unknown;
	checks: unknown;
}

/**
 * A style's pieces, each with the version shown (null when there is none), in one query: the head
 * version joined, or with `onlySignedOff` the signed-off version of the highest number. The same query
 * as piecesOfStyleWithShownText, its JSON columns parsed.
 */
export async function piecesOfStyleWithShown(db: DbOrTx, styleId: string, onlySignedOff: boolean): Promise<(PieceRow & { shown: ShownVersion | null })[]> {
	const rows = await piecesOfStyleWithShownText(db, styleId, onlySignedOff);
	const parsed = (text: string | null): unknown => (text === null ? null : JSON.parse(text));
	return rows.map(({ vId, vNumber, vState, vGeometry, vMetrics, vChecks, ...piece }) => ({
		...piece,
		shown: vId === null ? null : { id: vId, number: vNumber!, state: vState!, geometry: parsed(vGeometry), metrics: parsed(vMetrics), checks: parsed(vChecks) }
	}));
}

/** A piece with its shown version's JSON columns as the database writes them (text, not parsed). */
export interface PieceWithShownText extends PieceRow {
	vId: string | null;
	vNumber: number | null;
	vState: VersionState | null;
	vGeometry: string | null;
	vMetrics: string | null;
	vChecks: string | null;
}

/**
 * The same rows as piecesOfStyleWithShown, with the shown version's geometry, metrics and checks as JSON
 * text: for an answer that passes them on unchanged, neither parsed here nor written out again.
 */
export async function piecesOfStyleWithShownText(db: DbOrTx, styleId: string, onlySignedOff: boolean): Promise<PieceWithShownText[]> {
	const which = onlySignedOff ? sql`v.state = 'signed_off' order by v.number desc limit 1` : sql`v.id = p.head_version_id`;
	const r = await sql<PieceWithShownText>`
		select p.id, p.style_id as "styleId", p.name, p.cut, p.fabric, p.sort_order as "sortOrder",
			p.head_version_id as "headVersionId", p.head_number as "headNumber",
			s.id as "vId", s.number as "vNumber", s.state as "vState",
			s.geometry::text as "vGeometry", s.metrics::text as "vMetrics", s.checks::text as "vChecks"
		from pieces p
		left join lateral (
			select v.id, v.number, v.state, v.geometry, v.metrics, v.checks from piece_versions v where v.piece_id = p.id and ${which}
		) s on true
		where p.style_id = ${styleId}
		order by p.sort_order, p.name`.execute(db);
	return r.rows;
}
