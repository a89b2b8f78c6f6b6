// Studio billing: each studio's state at the payment provider (customer, subscription, seats, the
// provider's own timestamps), the provider's events already handled (by id, so each is handled once),
// and the studio's invoices as last seen.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('studio_billing')
		.addColumn('studio_id', 'uuid', (c) => c.primaryKey().references('studios.id').onDelete('cascade'))
		.addColumn('customer_id', 'text', (c) => c.unique())
		.addColumn('subscription_id', 'text')
		// the provider's subscription status (active, trialing, past_due, canceled, unpaid, incomplete…)
		.addColumn('status', 'text')
		.addColumn('price_id', 'text')
		.addColumn('interval', 'text', (c) => c.check(sql`interval in ('month', 'year')`))
		.addColumn('seats', 'integer', (c) => c.notNull().defaultTo(0).check(sql`seats >= 0`))
		.addColumn('cancel_at_period_end', 'boolean', (c) => c.notNull().defaultTo(false))
		.addColumn('current_period_end', 'timestamptz')
		.addColumn('canceled_at', 'timestamptz')
		.addColumn('ended_at', 'timestamptz')
		// when the provider made the state stored here (its event's time): older events never overwrite it
		.addColumn('provider_updated_at', 'timestamptz')
		.addColumn('payment_failed_at', 'timestamptz')
		.addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema
		.createTable('billing_events')
		.addColumn('id', 'text', (c) => c.primaryKey())
		.addColumn('type', 'text', (c) => c.notNull())
		.addColumn('studio_id', 'uuid', (c) => c.references('studios.id').onDelete('set null'))
		.addColumn('provider_created_at', 'timestamptz', (c) => c.notNull())
		// what handling it did: applied, stale (an older state than the one stored), unknown_studio, ignored
		.addColumn('outcome', 'text', (c) => c.notNull())
		.addColumn('received_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema
		.createTable('billing_invoices')
		.addColumn('id', 'text', (c) => c.primaryKey())
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('number', 'text')
		.addColumn('status', 'text', (c) => c.notNull())
		.addColumn('amount_due', 'integer', (c) => c.notNull())
		.addColumn('amount_paid', 'integer', (c) => c.notNull())
		.addColumn('currency', 'text', (c) => c.notNull())
		.addColumn('hosted_url', 'text')
		.addColumn('provider_created_at', 'timestamptz', (c) => c.notNull())
		.addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('billing_invoices_studio').on('billing_invoices').columns(['studio_id', 'provider_created_at']).execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	await db.schema.dropTable('billing_invoices').execute();
	await db.schema.dropTable('billing_events').execute();
	await db.schema.dropTable('studio_billing').execute();
}
