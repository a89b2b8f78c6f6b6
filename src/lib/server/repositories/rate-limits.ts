import { sql } from 'kysely';
import type { DbOrTx } from '../db';

/**
 * The counters of rate limits (`rate_limits`) and of failed sign-ins (`sign_in_limits`) are rows of
 * rate-limiter-flexible's layout: `expire` is when the window (or a block) ends, in milliseconds since
 * the epoch; NULL never expires. A row past its `expire` counts for nothing (the limiter starts afresh
 * when the key comes again), so deleting it changes no answer. Returns how many rows went, per table.
 */
export async function rateLimitsExpiredDelete(db: DbOrTx, nowMs = Date.now()): Promise<{ rateLimits: number; signInLimits: number }> {
	const limits = await sql`delete from rate_limits where expire is not null and expire < ${nowMs}`.execute(db);
	const signIns = await sql`delete from sign_in_limits where expire is not null and expire < ${nowMs}`.execute(db);
	return { rateLimits: Number(limits.numAffectedRows ?? 0), signInLimits: Number(signIns.numAffectedRows ?? 0) };
}
