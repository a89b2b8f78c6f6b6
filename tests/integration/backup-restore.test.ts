// `npm run db:backup` and `npm run db:restore` round trip (scripts/backup.sh): a database of its own with
// the demo studio seeded (its fitting photos in a bucket of its own) is backed up, restored into a new,
// empty database and a new bucket, and compared: every table's row count and checksum of its rows,
// every object's key and SHA-256. A second restore into the now filled database is refused.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { sql } from 'kysely';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { sha256, tableChecksums, tableRowCounts, type BackupManifest } from '../../src/lib/server/backup/index';
import { dbCreate, type Db } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';
import { demoStudioSeed } from '../../src/lib/server/seed/demo-studio';
import { storageBucketEnsure, storageGet, storageList } from '../../src/lib/server/storage';
import { testDb, testDbClose, uniq } from './helpers';

const tag = uniq();
const names = { src: `dartelier_backup_src_${tag}`, dst: `dartelier_backup_dst_${tag}` };
const buckets = { src: `backup-src-${tag}`, dst: `backup-dst-${tag}` };
const out = mkdtempSync(path.join(tmpdir(), 'dartelier-backup-'));
const opened: Db[] = [];

function urlOf(database: string): string {
	const u = new URL(inject('databaseUrl'));
	u.pathname = `/${database}`;
	return u.toString();
}

function open(database: string): Db {
	const db = dbCreate(urlOf(database), 2);
	opened.push(db);
	return db;
}

function run(action: 'backup' | 'restore', arg: string, database: string, bucket: string) {
	return spawnSync('bash', ['scripts/backup.sh', action, arg], {
		encoding: 'utf8',
		env: { ...process.env, DATABASE_URL: urlOf(database), S3_ENDPOINT: inject('s3Endpoint'), S3_BUCKET: bucket }
	});
}

/** Every object of a bucket: key → SHA-256 of its bytes. */
async function objectSums(bucket: string): Promise<Record<string, string>> {
	process.env.S3_BUCKET = bucket;
	const out: Record<string, string> = {};
	for (const key of await storageList()) out[key] = sha256((await storageGet(key))!);
	return out;
}

afterAll(async () => {
	for (const db of opened) await db.destroy();
	for (const name of Object.values(names)) await sql`drop database if exists ${sql.raw(name)} with (force)`.execute(testDb());
	await testDbClose();
	rmSync(out, { recursive: true, force: true });
});

describe('backup and restore', () => {
	it('restores the seeded demo studio into an empty database and bucket with every table and object the same', async () => {
		for (const name of Object.values(names)) await sql`create database ${sql.raw(name)}`.execute(testDb());
		const src = open(names.src);
		await migrateToLatest(src);
		process.env.S3_ENDPOINT = inject('s3Endpoint');
		process.env.S3_BUCKET = buckets.src;
		await storageBucketEnsure();
		await demoStudioSeed(src);

		const backup = run('backup', out, names.src, buckets.src);
		expect(backup.status, backup.stderr).toBe(0);
		const dir = backup.stdout.match(/backup written: (\S+)/)![1];
		expect(path.basename(dir)).toMatch(/^dartelier-\d{8}T\d{6}Z$/);
		const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as BackupManifest;
		expect(manifest.database.tables['public.piece_versions']).toBeGreaterThan(0);
		expect(manifest.objectStore.objects.length).toBeGreaterThan(0); // the demo fitting's photos

		const restore = run('restore', dir, names.dst, buckets.dst);
		expect(restore.status, restore.stderr).toBe(0);
		expect(restore.stdout).toContain('every checksum verified');

		const dst = open(names.dst);
		const [srcCounts, dstCounts] = [await tableRowCounts(src), await tableRowCounts(dst)];
		expect(Object.keys(dstCounts).length).toBeGreaterThan(10);
		expect(dstCounts).toEqual(srcCounts);
		expect(await tableChecksums(dst)).toEqual(await tableChecksums(src));
		const [srcObjects, dstObjects] = [await objectSums(buckets.src), await objectSums(buckets.dst)];
		expect(Object.keys(dstObjects).length).toBe(manifest.objectStore.objects.length);
		expect(dstObjects).toEqual(srcObjects);

		// never over what is there
		const again = run('restore', dir, names.dst, `backup-other-${tag}`);
		expect(again.status).toBe(1);
		expect(again.stderr).toContain('the database is not empty');
		expect(await tableRowCounts(dst)).toEqual(srcCounts);
	}, 180_000);
});
