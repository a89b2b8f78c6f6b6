// Change notices for what app processes keep in memory (src/lib/server/cache): every change of a style,
// its pieces, their versions or its seam pairs says `style:<style id>`, and every change of a session,
// a user or a membership says `user:<user id>`, on the channel dartelier_change (PostgreSQL's
// LISTEN/NOTIFY: sent when the change commits, to every process listening, never for a rollback).
import { sql } from 'kysely';

const STYLE_TABLES = {
	styles: 'id',
	pieces: 'style_id',
	seam_pairs: 'style_id'
};
const USER_TABLES = {
	sessions: 'user_id',
	users: 'id',
	memberships: 'user_id'
};

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	// a row naming its style or user directly: the old and the new value (they differ when a row moves)
	for (const [kind, tables] of [
		['style', STYLE_TABLES],
		['user', USER_TABLES]
	]) {
		for (const [table, column] of Object.entries(tables)) {
			await sql
				.raw(
					`create function dartelier_change_${table}() returns trigger language plpgsql as $$
begin
	if tg_op <> 'INSERT' then perform pg_notify('dartelier_change', '${kind}:' || old.${column}); end if;
	if tg_op <> 'DELETE' then perform pg_notify('dartelier_change', '${kind}:' || new.${column}); end if;
	return null;
end $$`
				)
				.execute(db);
			await sql
				.raw(`create trigger dartelier_change after insert or update or delete on ${table} for each row execute function dartelier_change_${table}()`)
				.execute(db);
		}
	}
	// a version names its piece: the style is the piece's (gone already when the piece is being deleted,
	// whose own notice then says it)
	await sql
		.raw(
			`create function dartelier_change_piece_versions() returns trigger language plpgsql as $$
declare
	sid uuid;
begin
	select style_id into sid from pieces where id = coalesce(new.piece_id, old.piece_id);
	if sid is not null then perform pg_notify('dartelier_change', 'style:' || sid); end if;
	return null;
end $$`
		)
		.execute(db);
	await sql
		.raw(`create trigger dartelier_change after insert or update or delete on piece_versions for each row execute function dartelier_change_piece_versions()`)
		.execute(db);
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	for (const table of [...Object.keys(STYLE_TABLES), ...Object.keys(USER_TABLES), 'piece_versions']) {
		await sql.raw(`drop trigger if exists dartelier_change on ${table}`).execute(db);
		await sql.raw(`drop function if exists dartelier_change_${table}()`).execute(db);
	}
}
