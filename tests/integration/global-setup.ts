// Integration tests run against the project's own test PostgreSQL cluster (never one already
// running elsewhere): start it (idempotent), migrate, and hand the URL to the test workers.
import { execFileSync } from 'node:child_process';
import { sql } from 'kysely';
import type { TestProject } from 'vitest/node';
import { dbCreate } from '../../src/lib/server/db/index';
import { migrateToLatest } from '../../src/lib/server/db/migrator';
import { s3FakeStart } from '../s3-fake';

export default async function setup(project: TestProject) {
	const out = execFileSync('bash', ['-c', 'source scripts/lib.sh && pg_start test >&2 && printf %s "$DATABASE_URL"'], {
		encoding: 'utf8'
	});
	const url = out.trim();
	process.env.DATABASE_URL = url;
	project.provide('databaseUrl', url);
	// the local object store for photos, as `npm start` runs it (scripts/s3-dev.ts), in this process
	const s3 = await s3FakeStart('test-integration');
	process.env.S3_ENDPOINT = s3.endpoint;
	process.env.S3_BUCKET = s3.bucket;
	project.provide('s3Endpoint', s3.endpoint);
	const db = dbCreate(url, 1);
	try {
		await migrateToLatest(db);
		// every run starts with fresh rate-limit counts (all its requests come from 127.0.0.1)
		await sql`delete from rate_limits`.execute(db);
	} finally {
		await db.destroy();
	}
	return () => s3.close();
}

declare module 'vitest' {
	export interface ProvidedContext {
		databaseUrl: string;
		s3Endpoint: string;
	}
}
