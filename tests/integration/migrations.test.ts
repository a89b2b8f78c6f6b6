// Migrations run up from an empty database, then all the way down, then up again, on a scratch
// database of their own (created and dropped here) so other tests' data is untouched.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { dbCreate, type Db } from '../../src/lib/server/db/index';
import { migrateDownAll, migrateToLatest } from '../../src/lib/server/db/migrator';
import { uniq } from './helpers';

const name = `dartelier_migrations_${uniq()}`;
let admin: Db;
let scratch: Db;

async function tables(db: Db): Promise<string[]> {
	const r = await sql<{ table_name: string }>`
		select table_name from information_schema.tables
		where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not like 'kysely_%'
		order by table_name`.execute(db);
	return r.rows.map((x) => x.table_name);
}

beforeAll(async () => {
	const url = new URL(inject('databaseUrl'));
	admin = dbCreate(url.toString(), 1);
	await sql`create database ${sql.id(name)}`.execute(admin);
	url.pathname = `/${name}`;
	scratch = dbCreate(url.toString(), 2);
});

afterAll(async () => {
	await scratch?.destroy();
	await sql`drop database if exists ${sql.id(name)} with (force)`.execute(admin);
	await admin?.destroy();
});

describe('migrations', () => {
	it('go up from empty, down to nothing, and up again', async () => {
		expect(await tables(scratch)).toEqual([]);
		const up = await migrateToLatest(scratch);
		expect(up.length).toBeGreaterThan(0);
		expect(up.every((l) => l.endsWith('Success'))).toBe(true);
		const after = await tables(scratch);
		for (const t of ['users', 'sessions', 'studios', 'memberships', 'invitations', 'password_resets', 'sign_in_limits', 'rate_limits']) {
			expect(after).toContain(t);
		}

		const down = await migrateDownAll(scratch);
		expect(down).toHaveLength(up.length);
		expect(await tables(scratch)).toEqual([]);

		const again = await migrateToLatest(scratch);
		expect(again).toEqual(up);
		expect(await tables(scratch)).toEqual(after);
		expect(await migrateToLatest(scratch)).toEqual([]); // nothing left to do
	});
});
