// Size runs: a style's recipe replayed on other measurement sets (grading by replay). The job itself goes
// through the PostgreSQL-backed queue (pg-boss, its own schema); this table holds what a run was asked
// for, how far it got and what each size gave, so that it can be shown and kept.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('size_runs')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('style_id', 'uuid', (c) => c.notNull().references('styles.id').onDelete('cascade'))
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('status', 'text', (c) => c.notNull().defaultTo('queued').check(sql`status in ('queued', 'running', 'done', 'failed', 'cancelled')`))
		// the measurement sets asked for, in order: [{ measurementSetId, name }]
		.addColumn('sizes', 'jsonb', (c) => c.notNull())
		// per size, once made: [{ measurementSetId, name, status, pieces, failures, checks }]
		.addColumn('results', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
		.addColumn('steps_done', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('steps_total', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('error', 'text')
		.addColumn('job_id', 'text')
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('size_runs_style').on('size_runs').columns(['style_id', 'created_at']).execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	await db.schema.dropTable('size_runs').execute();
}
