// Expired rate-limit and sign-in counters are deleted by the cleanup the app runs on a timer
// (src/lib/server/rate-limit-cleanup.ts → rateLimitsExpiredDelete); counters still in their window,
// and blocks not yet over, stay and keep counting.
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { poolCreate } from '../../src/lib/server/db/index';
import { rateLimiterCreate } from '../../src/lib/server/rate-limits';
import { rateLimitsExpiredDelete } from '../../src/lib/server/repositories/rate-limits';
import { testDb, testDbClose } from './helpers';

const pool = poolCreate(inject('databaseUrl'), 2, 'rate-limit cleanup test');
afterAll(async () => {
	await pool.end();
	await testDbClose();
});

async function keysOf(table: 'rate_limits' | 'sign_in_limits', keys: string[]): Promise<string[]> {
	const r = await sql<{ key: string }>`select key from ${sql.table(table)} where key = any(${keys}) order by key`.execute(testDb());
	return r.rows.map((x) => x.key);
}

describe('cleaning up expired rate-limit counters', () => {
	it('deletes the counters whose window is over and keeps those still counting', async () => {
		const tag = randomBytes(4).toString('hex');
		const limiter = rateLimiterCreate('photo_user', pool);
		await limiter.consume(`old-${tag}`);
		await limiter.consume(`current-${tag}`, 3);
		const oldKey = `photo_user:old-${tag}`;
		const currentKey = `photo_user:current-${tag}`;
		// the first counter's hour ended a minute ago
		await sql`update rate_limits set expire = ${Date.now() - 60_000} where key = ${oldKey}`.execute(testDb());
		await sql`insert into sign_in_limits (key, points, expire) values (${`signin_email:old-${tag}`}, 5, ${Date.now() - 1000}), (${`signin_email:blocked-${tag}`}, 5, ${Date.now() + 900_000})`.execute(testDb());

		const deleted = await rateLimitsExpiredDelete(testDb());
		expect(deleted.rateLimits).toBeGreaterThanOrEqual(1);
		expect(deleted.signInLimits).toBeGreaterThanOrEqual(1);
		expect(await keysOf('rate_limits', [oldKey, currentKey])).toEqual([currentKey]);
		expect(await keysOf('sign_in_limits', [`signin_email:old-${tag}`, `signin_email:blocked-${tag}`])).toEqual([`signin_email:blocked-${tag}`]);
		// the counter that stayed still counts: 3 taken before, 1 now
		expect((await limiter.consume(`current-${tag}`)).consumedPoints).toBe(4);
		// a key whose counter went starts afresh
		expect((await limiter.consume(`old-${tag}`)).consumedPoints).toBe(1);
	});
});
