// The scratch PostgreSQL cluster (scripts/lib.sh's `scratch`, port DARTELIER_SCRATCH_PG_PORT) with a
// database of a test's own: for tests that stop PostgreSQL as a crash would (`pg_ctl stop -m immediate`)
// without touching the test cluster every other test uses.
import { execFile, execFileSync } from 'node:child_process';
import { promisify } from 'node:util';
import pg from 'pg';
import { dbCreate, type Db } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';

/**
 * Starts or stops the scratch cluster through scripts/db.sh (a start after a crash runs recovery first),
 * without blocking this process: the tests' clients keep going meanwhile.
 */
export async function scratchCluster(action: 'start' | 'stop', mode: 'fast' | 'immediate' = 'fast'): Promise<void> {
	await promisify(execFile)('bash', ['scripts/db.sh', action, 'scratch', mode]);
}

export interface ScratchDatabase {
	url: string;
	db: Db;
	close(): Promise<void>;
}

/** Starts the scratch cluster and makes `name` afresh in it (dropped first if a run left it), migrated. */
export async function scratchDatabaseCreate(name: string): Promise<ScratchDatabase> {
	if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`not a plain database name: ${name}`);
	const clusterUrl = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start scratch >&2 && printf %s "$DATABASE_URL"'], {
		encoding: 'utf8',
		stdio: ['ignore', 'pipe', 'inherit']
	}).trim();
	const at = (database: string) => Object.assign(new URL(clusterUrl), { pathname: `/${database}` }).href;
	const admin = new pg.Client({ connectionString: at('postgres') });
	await admin.connect();
	try {
		await admin.query(`drop database if exists ${name} with (force)`);
		await admin.query(`create database ${name}`);
	} finally {
		await admin.end();
	}
	const url = at(name);
	const db = dbCreate(url, 3);
	await migrateToLatest(db);
	return { url, db, close: () => db.destroy() };
}
