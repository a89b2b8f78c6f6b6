// Measurement sets: a stable key for seeded chart rows (so seeding is idempotent per studio), the
// chart's source as structured data, an order for listing, and the time of the last change.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.alterTable('measurement_sets')
		.addColumn('chart_key', 'text')
		.addColumn('chart_source', 'jsonb')
		.addColumn('sort_order', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema
		.createIndex('measurement_sets_chart_key')
		.on('measurement_sets')
		.columns(['studio_id', 'chart_key'])
		.unique()
		.where(sql.ref('chart_key'), 'is not', null)
		.execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	await db.schema.dropIndex('measurement_sets_chart_key').execute();
	await db.schema
		.alterTable('measurement_sets')
		.dropColumn('chart_key')
		.dropColumn('chart_source')
		.dropColumn('sort_order')
		.dropColumn('updated_at')
		.execute();
}
