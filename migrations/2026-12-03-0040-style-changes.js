// Style changes: the multi-piece steps (separate, join, carry) of one save, stored once with the base
// versions of their sources and their parameters, so every new piece they made can be recomputed.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('style_changes')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('style_id', 'uuid', (c) => c.notNull().references('styles.id').onDelete('cascade'))
		.addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('message', 'text', (c) => c.notNull())
		// [{ pieceId, versionId }]: the base version of every stored piece the change read
		.addColumn('bases', 'jsonb', (c) => c.notNull())
		// [{ op, sources, params, declared? }], as the registry's multi-piece steps take them
		.addColumn('steps', 'json', (c) => c.notNull())
		// the ledger entries the steps posted (recomputed by the server) and the checks it ran
		.addColumn('ledger', 'json', (c) => c.notNull())
		.addColumn('checks', 'json', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('style_changes_style').on('style_changes').column('style_id').execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	await db.schema.dropTable('style_changes').execute();
}
