import { Kysely, PostgresDialect, type Transaction } from 'kysely';
import pg from 'pg';
import type { Database } from './schema';

export type Db = Kysely<Database>;
export type DbOrTx = Kysely<Database> | Transaction<Database>;

// timestamptz and bigint come back as Date and string by default; counts as numbers are easier.
pg.types.setTypeParser(20, (v) => Number(v));

export function databaseUrl(): string {
	const url = process.env.DATABASE_URL;
	if (!url) throw new Error('DATABASE_URL is not set: start the app through `npm start`.');
	return url;
}

export function dbCreate(url = databaseUrl(), max = 10): Db {
	return new Kysely<Database>({
		dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max }) })
	});
}

let shared: Db | undefined;

/** The app's one pool, created on first use. */
export function db(): Db {
	shared ??= dbCreate();
	return shared;
}
