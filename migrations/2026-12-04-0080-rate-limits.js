// Rate limits on password-reset requests, sign-ups, invitations and uploads, shared by every app process
// through this table (the layout rate-limiter-flexible's RateLimiterPostgres expects; created here, not by it).
// Sign-in failures keep their own table, sign_in_limits.

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('rate_limits')
		.addColumn('key', 'varchar(255)', (c) => c.primaryKey())
		.addColumn('points', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('expire', 'bigint')
		.execute();
	await db.schema.createIndex('rate_limits_expire').on('rate_limits').column('expire').execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	await db.schema.dropTable('rate_limits').ifExists().execute();
}
