import { sql } from 'kysely';
import { db } from './db';
import { log } from './log';
import { sizeRunQueueCheck } from './size-runs/queue';
import { storageReachable } from './storage';

/** How long each part of the readiness check may take before it counts as failed. */
export const READY_CHECK_TIMEOUT_MS = 3000;

export type ReadinessPart = 'database' | 'objectStore' | 'queue';

export interface Readiness {
	ready: boolean;
	checks: Record<ReadinessPart, 'ok' | 'failed'>;
	/** the parts that failed, in the order checked */
	failed: ReadinessPart[];
}

function withinTime<T>(p: Promise<T>, ms: number): Promise<T> {
	let timer: ReturnType<typeof setTimeout> | undefined;
	const late = new Promise<never>((_, reject) => {
		timer = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms);
	});
	return Promise.race([p, late]).finally(() => clearTimeout(timer));
}

/**
 * Whether this process can serve: the database answers a query, the object store answers for its
 * bucket, and the size-run queue (pg-boss, in the database) is started and answers. All three are
 * checked at once, each within READY_CHECK_TIMEOUT_MS; a failure is logged (why) but only named in the answer.
 */
export async function readinessCheck(timeoutMs = READY_CHECK_TIMEOUT_MS): Promise<Readiness> {
	const parts: [ReadinessPart, () => Promise<unknown>][] = [
		['database', () => sql`select 1`.execute(db())],
		['objectStore', () => storageReachable(AbortSignal.timeout(timeoutMs))],
		['queue', () => sizeRunQueueCheck()]
	];
	const results = await Promise.allSettled(parts.map(([, check]) => withinTime(check(), timeoutMs)));
	const checks = {} as Readiness['checks'];
	const failed: ReadinessPart[] = [];
	results.forEach((r, i) => {
		const part = parts[i][0];
		checks[part] = r.status === 'fulfilled' ? 'ok' : 'failed';
		if (r.status === 'rejected') {
			failed.push(part);
			log.warn({ part, err: r.reason }, 'readiness check failed');
		}
	});
	return { ready: failed.length === 0, checks, failed };
}
