import type { DbOrTx } from '../db';
import { authorName } from './former-member';
import { piecesInStudio } from './pieces';
import type { VersionState } from '../db/schema';

export interface VersionSummary {
	id: string;
	pieceId: string;
	number: number;
	parentId: string | null;
	authorId: string | null;
	authorName: string | null;
	message: string;
	state: VersionState;
	createdAt: Date;
	signedOffAt: Date | null;
}

export interface VersionRow extends VersionSummary {
	geometry: unknown;
	recipe: unknown;
	metrics: unknown;
	checks: unknown;
}

const summary = [
	'piece_versions.id',
	'piece_versions.piece_id as pieceId',
	'piece_versions.number',
	'piece_versions.parent_id as parentId',
	'piece_versions.author_id as authorId',
	authorName('users.name', 'authorName'),
	'piece_versions.message',
	'piece_versions.state',
	'piece_versions.created_at as createdAt',
	'piece_versions.signed_off_at as signedOffAt'
] as const;
const full = [
	...summary,
	'piece_versions.geometry',
	'piece_versions.recipe',
	'piece_versions.metrics',
	'piece_versions.checks'
] as const;

export async function versionsInsert(
	db: DbOrTx,
	v: {
		pieceId: string;
		number: number;
		parentId: string | null;
		authorId: string;
		message: string;
		geometry: unknown;
		recipe: unknown;
		metrics: unknown;
		checks: unknown;
	}
): Promise<{ id: string; number: number }> {
	return db
		.insertInto('piece_versions')
		.values({
			piece_id: v.pieceId,
			number: v.number,
			parent_id: v.parentId,
			author_id: v.authorId,
			message: v.message,
			geometry: JSON.stringify(v.geometry),
			recipe: JSON.stringify(v.recipe),
			metrics: JSON.stringify(v.metrics),
			checks: JSON.stringify(v.checks)
		})
		.returning(['id', 'number'])
		.executeTakeFirstOrThrow();
}

export async function versionsOfPiece(db: DbOrTx, pieceId: string, onlySignedOff = false): Promise<VersionSummary[]> {
	let q = db
		.selectFrom('piece_versions')
		.leftJoin('users', 'users.id', 'piece_versions.author_id')
		.select(summary)
		.where('piece_versions.piece_id', '=', pieceId);
	if (onlySignedOff) q = q.where('piece_versions.state', '=', 'signed_off');
	return q.orderBy('piece_versions.number', 'desc').execute();
}

/**
 * versionsOfPiece with the piece's style, only when the piece is in the studio's styles: one round trip
 * for the usual answer. An empty list is checked apart (a piece of another studio, or none by that id:
 * `undefined` then).
 */
export async function versionsOfPieceInStudio(
	db: DbOrTx,
	studioId: string,
	pieceId: string,
	onlySignedOff = false
): Promise<{ styleId: string; versions: VersionSummary[] } | undefined> {
	let q = db
		.selectFrom('piece_versions')
		.innerJoin('pieces', 'pieces.id', 'piece_versions.piece_id')
		.innerJoin('styles', 'styles.id', 'pieces.style_id')
		.leftJoin('users', 'users.id', 'piece_versions.author_id')
		.select([...summary, 'pieces.style_id as styleId'])
		.where('piece_versions.piece_id', '=', pieceId)
		.where('styles.studio_id', '=', studioId);
	if (onlySignedOff) q = q.where('piece_versions.state', '=', 'signed_off');
	const rows = await q.orderBy('piece_versions.number', 'desc').execute();
	if (rows.length > 0) return { styleId: rows[0].styleId, versions: rows.map(({ styleId: _style, ...v }) => v) };
	const piece = await piecesInStudio(db, studioId, pieceId);
	return piece ? { styleId: piece.styleId, versions: [] } : undefined;
}

export async function versionsById(db: DbOrTx, pieceId: string, versionId: string): Promise<VersionRow | undefined> {
	return db
		.selectFrom('piece_versions')
		.leftJoin('users', 'users.id', 'piece_versions.author_id')
		.select(full)
		.where('piece_versions.id', '=', versionId)
		.where('piece_versions.piece_id', '=', pieceId)
		.executeTakeFirst();
}

export async function versionsStateSet(
	db: DbOrTx,
	versionId: string,
	state: VersionState,
	signedOffBy?: string
): Promise<void> {
	await db
		.updateTable('piece_versions')
		.set({
			state,
			...(state === 'signed_off' ? { signed_off_by: signedOffBy ?? null, signed_off_at: new Date() } : {})
		})
		.where('id', '=', versionId)
		.execute();
}

/** When a version is signed off, earlier signed-off versions of the piece become superseded. */
export async function versionsSupersedeOthers(db: DbOrTx, pieceId: string, keepId: string): Promise<void> {
	await db
		.updateTable('piece_versions')
		.set({ state: 'superseded' })
		.where('piece_id', '=', pieceId)
		.where('id', '!=', keepId)
		.where('state', '=', 'signed_off')
		.execute();
}

/** Only the geometry of a version (what a save replays on), without the rest of the row. */
export async function versionsGeometry(db: DbOrTx, pieceId: string, versionId: string): Promise<unknown | undefined> {
	const row = await db
		.selectFrom('piece_versions')
		.select('geometry')
		.where('id', '=', versionId)
		.where('piece_id', '=', pieceId)
		.executeTakeFirst();
	return row?.geometry;
}

/** Every version of a style's pieces with its geometry, by piece name and number (the demo seed's refresh). */
export async function versionsGeometryOfStyle(db: DbOrTx, styleId: string): Promise<{ id: string; pieceName: string; number: number; geometry: unknown }[]> {
	return db
		.selectFrom('piece_versions')
		.innerJoin('pieces', 'pieces.id', 'piece_versions.piece_id')
		.select(['piece_versions.id as id', 'pieces.name as pieceName', 'piece_versions.number as number', 'piece_versions.geometry as geometry'])
		.where('pieces.style_id', '=', styleId)
		.orderBy('pieces.name')
		.orderBy('piece_versions.number')
		.execute();
}

/**
 * Replaces a stored version's geometry. Only for markings that no replay or check reads (the demo seed's
 * refresh of pressing directions and centre marks); a change of shape is always a new version.
 */
export async function versionsMarkingsSet(db: DbOrTx, versionId: string, geometry: unknown): Promise<void> {
	await db.updateTable('piece_versions').set({ geometry: JSON.stringify(geometry) }).where('id', '=', versionId).execute();
}
