import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { sql } from 'kysely';
import type { Db, DbOrTx } from '../db';
import { storageBucketEnsure, storageGetWithType, storageList, storagePut } from '../storage';

/**
 * Backups of a Dartelier installation: the database and the object store, together.
 * A backup is a folder `dartelier-<UTC date and time>/` holding
 *   database.dump    `pg_dump --format=custom` of the whole database (the app's tables and the queue's)
 *   objects/<sha256> every object of the store's bucket, named by its checksum
 *   manifest.json    when, the dump's checksum, the row count of every table, and every object's key,
 *                    size, type and SHA-256
 * A restore goes into an empty database and an empty bucket only, and checks every checksum first.
 * `pgBin` is the folder of PostgreSQL's client programs (pg_dump, pg_restore) of the server's version.
 */
export interface BackupManifest {
	format: 'dartelier-backup-1';
	createdAt: string;
	database: { file: 'database.dump'; sha256: string; bytes: number; tables: Record<string, number> };
	objectStore: { bucket: string; objects: { key: string; bytes: number; sha256: string; contentType: string }[] };
}

export function sha256(bytes: Uint8Array): string {
	return createHash('sha256').update(bytes).digest('hex');
}

/** The app's and the queue's tables, schema-qualified, in name order. */
export async function tablesList(db: DbOrTx): Promise<string[]> {
	const r = await sql<{ name: string }>`
		select table_schema || '.' || table_name as name from information_schema.tables
		where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema')
		order by 1`.execute(db);
	return r.rows.map((x) => x.name);
}

function quoted(table: string): string {
	return table
		.split('.')
		.map((p) => `"${p.replaceAll('"', '""')}"`)
		.join('.');
}

export async function tableRowCounts(db: DbOrTx): Promise<Record<string, number>> {
	const out: Record<string, number> = {};
	for (const t of await tablesList(db)) {
		const r = await sql<{ n: number }>`select count(*)::int as n from ${sql.raw(quoted(t))}`.execute(db);
		out[t] = r.rows[0].n;
	}
	return out;
}

/** Every table's rows, as one checksum per table (rows as text, in order): equal tables, equal sums. */
export async function tableChecksums(db: DbOrTx): Promise<Record<string, string>> {
	const out: Record<string, string> = {};
	for (const t of await tablesList(db)) {
		const r = await sql<{ sum: string | null }>`
			select md5(coalesce(string_agg(x.row, E'\n' order by x.row), '')) as sum
			from (select t::text as row from ${sql.raw(quoted(t))} t) x`.execute(db);
		out[t] = r.rows[0].sum ?? '';
	}
	return out;
}

export function backupName(now: Date): string {
	return `dartelier-${now.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z')}`;
}

/** Writes a backup folder under `outDir`; its path. */
export async function backupWrite(db: Db, databaseUrl: string, pgBin: string, outDir: string, now = new Date()): Promise<string> {
	const dir = path.resolve(outDir, backupName(now));
	mkdirSync(path.join(dir, 'objects'), { recursive: true });
	const dumpFile = path.join(dir, 'database.dump');
	// The dump and the row counts see the same moment: pg_dump reads the snapshot this transaction exports.
	const tables = await db
		.transaction()
		.setIsolationLevel('repeatable read')
		.execute(async (tx) => {
			const snap = await sql<{ id: string }>`select pg_export_snapshot() as id`.execute(tx);
			execFileSync(
				path.join(pgBin, 'pg_dump'),
				['--format=custom', '--no-owner', `--snapshot=${snap.rows[0].id}`, `--file=${dumpFile}`, `--dbname=${databaseUrl}`],
				{ stdio: ['ignore', 'ignore', 'inherit'] }
			);
			return tableRowCounts(tx);
		});
	const dump = readFileSync(dumpFile);
	const objects: BackupManifest['objectStore']['objects'] = [];
	for (const key of await storageList()) {
		const got = await storageGetWithType(key);
		if (!got) continue; // removed meanwhile
		const sum = sha256(got.bytes);
		writeFileSync(path.join(dir, 'objects', sum), got.bytes);
		objects.push({ key, bytes: got.bytes.byteLength, sha256: sum, contentType: got.contentType });
	}
	const manifest: BackupManifest = {
		format: 'dartelier-backup-1',
		createdAt: now.toISOString(),
		database: { file: 'database.dump', sha256: sha256(dump), bytes: dump.byteLength, tables },
		objectStore: { bucket: process.env.S3_BUCKET || 'dartelier-photos', objects }
	};
	writeFileSync(path.join(dir, 'manifest.json'), JSON.stringify(manifest, null, '\t') + '\n');
	return dir;
}

/** The backup folder of a path given on the command line: the folder itself or its manifest.json. */
export function backupDirOf(given: string): string {
	const p = path.resolve(given);
	return p.endsWith('manifest.json') ? path.dirname(p) : p;
}

export class RestoreRefused extends Error {}

/**
 * Restores a backup into an empty database and an empty bucket: checks the dump's and every object's
 * checksum against the manifest, refuses a database with tables or a bucket with objects, then restores
 * the dump, puts every object under its key and counts the rows against the manifest.
 */
export async function backupRestore(db: Db, databaseUrl: string, pgBin: string, given: string): Promise<BackupManifest> {
	const dir = backupDirOf(given);
	const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as BackupManifest;
	if (manifest.format !== 'dartelier-backup-1') throw new RestoreRefused(`${dir} is not a Dartelier backup`);
	const dumpFile = path.join(dir, manifest.database.file);
	if (sha256(readFileSync(dumpFile)) !== manifest.database.sha256) throw new RestoreRefused('the database dump does not match its checksum');
	const files = new Map<string, Uint8Array>();
	for (const o of manifest.objectStore.objects) {
		const bytes = files.get(o.sha256) ?? readFileSync(path.join(dir, 'objects', o.sha256));
		if (sha256(bytes) !== o.sha256) throw new RestoreRefused(`the object ${o.key} does not match its checksum`);
		files.set(o.sha256, bytes);
	}
	if ((await tablesList(db)).length > 0) throw new RestoreRefused('the database is not empty: restore into a new, empty database');
	await storageBucketEnsure();
	if ((await storageList()).length > 0) throw new RestoreRefused('the bucket is not empty: restore into a new, empty bucket');

	execFileSync(path.join(pgBin, 'pg_restore'), ['--no-owner', '--no-privileges', '--exit-on-error', `--dbname=${databaseUrl}`, dumpFile], {
		stdio: ['ignore', 'ignore', 'inherit']
	});
	for (const o of manifest.objectStore.objects) await storagePut(o.key, files.get(o.sha256)!, o.contentType);

	const counts = await tableRowCounts(db);
	for (const [table, n] of Object.entries(manifest.database.tables)) {
		if (counts[table] !== n) throw new Error(`after the restore ${table} has ${counts[table]} rows, the backup ${n}`);
	}
	const keys = new Set(await storageList());
	for (const o of manifest.objectStore.objects) if (!keys.has(o.key)) throw new Error(`after the restore ${o.key} is missing`);
	return manifest;
}
