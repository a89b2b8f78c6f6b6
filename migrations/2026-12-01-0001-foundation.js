// Foundation: users, sessions, studios, memberships, invitations, password resets, sign-in throttling.
// Migrations are plain ESM JavaScript so Node loads them without a TypeScript step.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await sql`create extension if not exists pgcrypto`.execute(db);

	await db.schema
		.createTable('users')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('email', 'text', (c) => c.notNull().unique())
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('password_hash', 'text', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addCheckConstraint('users_email_lower', sql`email = lower(email)`)
		.execute();

	await db.schema
		.createTable('sessions')
		.addColumn('id_hash', 'text', (c) => c.primaryKey())
		.addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
		.addColumn('expires_at', 'timestamptz', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('sessions_user_id').on('sessions').column('user_id').execute();

	await db.schema
		.createTable('studios')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('name', 'text', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();

	await db.schema
		.createTable('memberships')
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
		.addColumn('role', 'text', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addPrimaryKeyConstraint('memberships_pk', ['studio_id', 'user_id'])
		.addCheckConstraint(
			'memberships_role',
			sql`role in ('owner', 'patterncutter', 'designer', 'sampleroom')`
		)
		.execute();
	await db.schema.createIndex('memberships_user_id').on('memberships').column('user_id').execute();

	await db.schema
		.createTable('invitations')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('studio_id', 'uuid', (c) => c.notNull().references('studios.id').onDelete('cascade'))
		.addColumn('email', 'text', (c) => c.notNull())
		.addColumn('role', 'text', (c) => c.notNull())
		.addColumn('token_hash', 'text', (c) => c.notNull().unique())
		.addColumn('invited_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('expires_at', 'timestamptz', (c) => c.notNull())
		.addColumn('used_at', 'timestamptz')
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addCheckConstraint(
			'invitations_role',
			sql`role in ('owner', 'patterncutter', 'designer', 'sampleroom')`
		)
		.execute();

	await db.schema
		.createTable('password_resets')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
		.addColumn('token_hash', 'text', (c) => c.notNull().unique())
		.addColumn('expires_at', 'timestamptz', (c) => c.notNull())
		.addColumn('used_at', 'timestamptz')
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();

	// Table layout expected by rate-limiter-flexible's RateLimiterPostgres (created here, not by it).
	await db.schema
		.createTable('sign_in_limits')
		.addColumn('key', 'varchar(255)', (c) => c.primaryKey())
		.addColumn('points', 'integer', (c) => c.notNull().defaultTo(0))
		.addColumn('expire', 'bigint')
		.execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	for (const t of ['sign_in_limits', 'password_resets', 'invitations', 'memberships', 'studios', 'sessions', 'users']) {
		await db.schema.dropTable(t).ifExists().execute();
	}
}
