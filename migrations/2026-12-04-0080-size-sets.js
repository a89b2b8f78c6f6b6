// Size sets: a size run's results kept as part of the style. Each size of the set holds its pieces as
// versions of their own (geometry, metrics and checks as the server made them again), each linked to the
// base piece and the base version it was graded from; a size is signed off on its own, recording who and
// when. A run is kept at most once.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('size_sets')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('style_id', 'uuid', (c) => c.notNull().references('styles.id').onDelete('cascade'))
		.addColumn('size_run_id', 'uuid', (c) => c.unique().references('size_runs.id').onDelete('set null'))
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('size_sets_style').on('size_sets').columns(['style_id', 'created_at']).execute();

	await db.schema
		.createTable('size_set_sizes')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('size_set_id', 'uuid', (c) => c.notNull().references('size_sets.id').onDelete('cascade'))
		.addColumn('measurement_set_id', 'uuid', (c) => c.references('measurement_sets.id').onDelete('set null'))
		// the size's name as it was when kept (the measurement set may be renamed or deleted later)
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('position', 'integer', (c) => c.notNull())
		// every check of the size as the server made it: { passed, failed, list }
		.addColumn('checks', 'json', (c) => c.notNull())
		.addColumn('state', 'text', (c) => c.notNull().defaultTo('draft').check(sql`state in ('draft', 'signed_off')`))
		.addColumn('signed_off_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('signed_off_at', 'timestamptz')
		.addColumn('sign_off_comment', 'text', (c) => c.notNull().defaultTo(''))
		.addCheckConstraint('size_set_sizes_signed_has_time', sql`(state = 'signed_off') = (signed_off_at is not null)`)
		.addUniqueConstraint('size_set_sizes_position', ['size_set_id', 'position'])
		.execute();

	await db.schema
		.createTable('size_set_versions')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('size_id', 'uuid', (c) => c.notNull().references('size_set_sizes.id').onDelete('cascade'))
		// the piece and version this size's piece was graded from
		.addColumn('base_piece_id', 'uuid', (c) => c.references('pieces.id').onDelete('set null'))
		.addColumn('base_version_id', 'uuid', (c) => c.references('piece_versions.id').onDelete('set null'))
		.addColumn('base_version_number', 'integer', (c) => c.notNull())
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('cut', 'text', (c) => c.notNull().check(sql`cut in ('pair', 'single', 'on_fold')`))
		.addColumn('fabric', 'text', (c) => c.notNull().defaultTo('self'))
		.addColumn('position', 'integer', (c) => c.notNull())
		// as piece_versions: written once, read whole
		.addColumn('geometry', 'json', (c) => c.notNull())
		.addColumn('metrics', 'json', (c) => c.notNull())
		.addColumn('checks', 'json', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addUniqueConstraint('size_set_versions_position', ['size_id', 'position'])
		.execute();
	await db.schema.createIndex('size_set_versions_base').on('size_set_versions').column('base_version_id').execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	for (const t of ['size_set_versions', 'size_set_sizes', 'size_sets']) await db.schema.dropTable(t).execute();
}
