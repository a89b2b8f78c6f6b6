import { db } from './db';
import { errorIsDatabaseUnavailable } from './db/unavailable';
import { log } from './log';
import { rateLimitsExpiredDelete } from './repositories/rate-limits';

/**
 * Expired rate-limit and sign-in counters are deleted on a timer in every app process (the limiters are
 * made with `clearExpiredByTimeout: false`, so nothing else removes them). Two processes deleting at once
 * is harmless. The first sweep runs a minute after start, then every RATE_LIMIT_CLEANUP_MINUTES (default 15).
 */
const FIRST_DELAY_MS = 60_000;

let timer: NodeJS.Timeout | null = null;

/** One sweep: deletes the expired counters, logs how many; an outage or error is logged, never thrown. */
export async function rateLimitCleanupRun(nowMs = Date.now()): Promise<void> {
	try {
		const deleted = await rateLimitsExpiredDelete(db(), nowMs);
		if (deleted.rateLimits + deleted.signInLimits > 0) log.info(deleted, 'expired rate-limit counters deleted');
	} catch (e) {
		if (errorIsDatabaseUnavailable(e)) log.warn('expired rate-limit counters not deleted: the database is unavailable');
		else log.warn({ err: e }, 'expired rate-limit counters could not be deleted');
	}
}

export function rateLimitCleanupStart(): void {
	if (timer || process.env.DARTELIER_RATE_LIMIT_CLEANUP === 'off') return;
	const minutes = Number(process.env.RATE_LIMIT_CLEANUP_MINUTES);
	const everyMs = (Number.isFinite(minutes) && minutes > 0 ? minutes : 15) * 60_000;
	const sweep = () => {
		void rateLimitCleanupRun().finally(() => {
			if (timer) timer = setTimeout(sweep, everyMs).unref();
		});
	};
	timer = setTimeout(sweep, FIRST_DELAY_MS).unref();
}

export function rateLimitCleanupStop(): void {
	if (timer) clearTimeout(timer);
	timer = null;
}
