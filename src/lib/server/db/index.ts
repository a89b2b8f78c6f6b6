import { log } from '../log';
import { Kysely, PostgresDialect, type Transaction } from 'kysely';
import pg from 'pg';
import type { Database } from './schema';

export type Db = Kysely<Database>;
export type DbOrTx = Kysely<Database> | Transaction<Database>;

// timestamptz and bigint come back as Date and string by default; counts as numbers are easier.
pg.types.setTypeParser(20, (v) => Number(v));

/**
 * How long a request waits for a connection (a free one from the pool, or a new one) before it is
 * answered 503: while the database is away, requests fail fast instead of hanging. A restarting or
 * stopped server closes its connections, so statements in flight fail at once too.
 */
export const DB_CONNECT_TIMEOUT_MS = 3000;

export function databaseUrl(): string {
	const url = process.env.DATABASE_URL;
	if (!url) throw new Error('DATABASE_URL is not set: start the app through `npm start`.');
	return url;
}

/**
 * A pool that survives its database going away: an idle client whose connection drops is removed by
 * pg-pool and reported through the pool's 'error' event, which would end the process when nobody
 * listens. We listen, log once per outage and let the pool open new connections when asked again.
 * A client in use (a transaction open, a statement under way) reports a dropped connection through
 * its own 'error' event, which pg-pool listens to only while the client is idle: every client gets a
 * listener of ours when it connects, or a server crash in the middle of a save would end the process.
 * The statement under way fails all the same (answered 503), and the pool drops the client when it is
 * given back (it is no longer queryable).
 */
export function poolCreate(url: string, max: number, name = 'app'): pg.Pool {
	const pool = new pg.Pool({
		connectionString: url,
		max,
		connectionTimeoutMillis: DB_CONNECT_TIMEOUT_MS,
		keepAlive: true
	});
	let lastLogMs = 0;
	const dropped = (err: Error, what: string) => {
		const now = Date.now();
		if (now - lastLogMs > 5000) log.warn({ pool: name, err }, what);
		lastLogMs = now;
	};
	pool.on('error', (err) => dropped(err, 'an idle database connection was dropped'));
	pool.on('connect', (client) => client.on('error', (err) => dropped(err, 'a database connection in use was dropped')));
	return pool;
}

export function dbCreate(url = databaseUrl(), max = 10): Db {
	return new Kysely<Database>({ dialect: new PostgresDialect({ pool: poolCreate(url, max) }) });
}

let shared: Db | undefined;

/** The app's one pool, created on first use. */
export function db(): Db {
	shared ??= dbCreate();
	return shared;
}

/** Closes the app's pool (on shutdown): waits for the connections in use to be given back. */
export async function dbClose(): Promise<void> {
	const closing = shared;
	shared = undefined;
	await closing?.destroy();
}
