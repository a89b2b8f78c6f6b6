// Measurement sets, styles, pieces, their immutable versions, and seam pairs.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('measurement_sets')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('chart', 'client')`))
		.addColumn('source', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('client_ref', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('unit', 'text', (c) => c.notNull().defaultTo('cm').check(sql`unit in ('mm', 'cm', 'in')`))
		.addColumn('read_only', 'boolean', (c) => c.notNull().defaultTo(false))
		.addColumn('values', 'jsonb', (c) => c.notNull())
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('measurement_sets_studio').on('measurement_sets').column('studio_id').execute();

	await db.schema
		.createTable('styles')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('code', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('season', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('measurement_set_id', 'uuid', (c) => c.references('measurement_sets.id').onDelete('set null'))
		.addColumn('status', 'text', (c) =>
			c.notNull().defaultTo('in_work').check(sql`status in ('in_work', 'in_review', 'signed_off', 'archived')`)
		)
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('styles_studio').on('styles').column('studio_id').execute();

	await db.schema
		.createTable('pieces')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('style_id', 'uuid', (c) => c.notNull().references('styles.id').onDelete('cascade'))
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('cut', 'text', (c) => c.notNull().check(sql`cut in ('pair', 'single', 'on_fold')`))
		.addColumn('fabric', 'text', (c) => c.notNull().defaultTo('self'))
		.addColumn('sort_order', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('head_version_id', 'uuid')
		.addColumn('head_number', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('pieces_style').on('pieces').column('style_id').execute();

	await db.schema
		.createTable('piece_versions')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('piece_id', 'uuid', (c) => c.notNull().references('pieces.id').onDelete('cascade'))
		.addColumn('number', 'integer', (c) => c.notNull())
		.addColumn('parent_id', 'uuid', (c) => c.references('piece_versions.id'))
		.addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('message', 'text', (c) => c.notNull())
		// Plain json, not jsonb: versions are written once and read whole, never queried inside; json
		// keeps the text as sent and reads back several times faster for large pieces.
		.addColumn('geometry', 'json', (c) => c.notNull())
		.addColumn('recipe', 'json', (c) => c.notNull())
		.addColumn('metrics', 'json', (c) => c.notNull())
		.addColumn('checks', 'json', (c) => c.notNull())
		.addColumn('state', 'text', (c) =>
			c.notNull().defaultTo('draft').check(sql`state in ('draft', 'proposed', 'signed_off', 'superseded')`)
		)
		.addColumn('signed_off_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('signed_off_at', 'timestamptz')
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addUniqueConstraint('piece_versions_number', ['piece_id', 'number'])
		.execute();
	// Large pieces compress several times faster with lz4 than with the default; skip where the server
	// was built without it.
	await sql`do $$ begin
		alter table piece_versions alter column geometry set compression lz4, alter column metrics set compression lz4;
	exception when feature_not_supported or invalid_parameter_value then null; end $$`.execute(db);
	await db.schema
		.alterTable('pieces')
		.addForeignKeyConstraint('pieces_head_version', ['head_version_id'], 'piece_versions', ['id'])
		.execute();

	await db.schema
		.createTable('seam_pairs')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('style_id', 'uuid', (c) => c.notNull().references('styles.id').onDelete('cascade'))
		.addColumn('label', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('a_piece_id', 'uuid', (c) => c.notNull().references('pieces.id').onDelete('cascade'))
		.addColumn('a_edge', 'jsonb', (c) => c.notNull())
		.addColumn('b_piece_id', 'uuid', (c) => c.notNull().references('pieces.id').onDelete('cascade'))
		.addColumn('b_edge', 'jsonb', (c) => c.notNull())
		.addColumn('allowed_ease_mm', 'double precision', (c) => c.notNull().defaultTo(0))
		.addColumn('tolerance_mm', 'double precision', (c) => c.notNull().defaultTo(1.6))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('seam_pairs_style').on('seam_pairs').column('style_id').execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	await db.schema.dropTable('seam_pairs').ifExists().execute();
	await db.schema.alterTable('pieces').dropConstraint('pieces_head_version').ifExists().execute();
	await db.schema.dropTable('piece_versions').ifExists().execute();
	await db.schema.dropTable('pieces').ifExists().execute();
	await db.schema.dropTable('styles').ifExists().execute();
	await db.schema.dropTable('measurement_sets').ifExists().execute();
}
