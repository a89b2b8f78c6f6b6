import { sql } from 'kysely';
import { jsonArrayFrom } from 'kysely/helpers/postgres';
import type { DbOrTx } from '../db';
import type { VersionState } from '../db/schema';
import type { PieceRow } from './pieces';
import { seamPairColumns, type SeamPairRow } from './seam-pairs';
import { styleColumns, type StyleRow } from './styles';

/**
 * A piece with the version it is shown at, named but not carried: the version's `stamp` is its row's
 * PostgreSQL `xmin` (the transaction that wrote the row as it now stands), so id and stamp together
 * name one content of the row; any change of the row (a new state, a marking set again) gives a new stamp.
 */
export interface PieceWithShownStamp extends PieceRow {
	vId: string | null;
	vStamp: string | null;
}

export interface StyleOverviewRows {
	style: StyleRow;
	pieces: PieceWithShownStamp[];
	seamPairs: SeamPairRow[];
}

/**
 * The style (only if it is the studio's), its pieces in their order each with the id and stamp of the
 * version shown (the head, or with `onlySignedOff` the signed-off version of the highest number), and
 * its seam pairs: one round trip, none of the versions' large columns.
 */
export async function styleOverviewRows(db: DbOrTx, studioId: string, styleId: string, onlySignedOff: boolean): Promise<StyleOverviewRows | undefined> {
	const which = onlySignedOff ? sql`v.state = 'signed_off' order by v.number desc limit 1` : sql`v.id = p.head_version_id`;
	const row = await db
		.selectFrom('styles')
		.select(styleColumns)
		.select((eb) => [
			sql<PieceWithShownStamp[]>`(select coalesce(json_agg(x order by x."sortOrder", x.name), '[]') from (
				select p.id, p.style_id as "styleId", p.name, p.cut, p.fabric, p.sort_order as "sortOrder",
					p.head_version_id as "headVersionId", p.head_number as "headNumber",
					s.id as "vId", s.xmin::text as "vStamp"
				from pieces p
				left join lateral (select v.id, v.xmin from piece_versions v where v.piece_id = p.id and ${which}) s on true
				where p.style_id = styles.id
			) x)`.as('pieces'),
			jsonArrayFrom(eb.selectFrom('seam_pairs').select(seamPairColumns).whereRef('seam_pairs.style_id', '=', 'styles.id').orderBy('seam_pairs.created_at')).as('seamPairs')
		])
		.where('styles.id', '=', styleId)
		.where('styles.studio_id', '=', studioId)
		.executeTakeFirst();
	if (!row) return undefined;
	const { pieces, seamPairs, ...style } = row;
	return { style, pieces, seamPairs: seamPairs as unknown as SeamPairRow[] };
}

/** A version as the style read shows it, its JSON columns as the database writes them (text, not parsed). */
export interface ShownVersionText {
	id: string;
	stamp: string;
	number: number;
	state: VersionState;
	geometry: string | null;
	metrics: string | null;
	checks: string | null;
}

/** The versions named, with their stamps (see PieceWithShownStamp) and JSON columns as text. */
export async function versionsShownText(db: DbOrTx, ids: readonly string[]): Promise<ShownVersionText[]> {
	if (ids.length === 0) return [];
	const r = await sql<ShownVersionText>`
		select v.id, v.xmin::text as stamp, v.number, v.state,
			v.geometry::text as geometry, v.metrics::text as metrics, v.checks::text as checks
		from piece_versions v
		where v.id = any(${ids}::uuid[])`.execute(db);
	return r.rows;
}
