import { log } from '../log';
import PgBoss from 'pg-boss';
import { databaseUrl, db, poolCreate } from '../db';
import { sizeRunExecute } from './run';

/**
 * The size-run queue: pg-boss (a PostgreSQL-backed job queue; its tables live in its own schema
 * `pgboss`). Every app process sends to it and works on it (the scale story: workers run in any app
 * process); `npm start` and the integration tests' app start it from hooks.server.ts's init. pg-boss talks
 * to the database through a pool made by poolCreate (error listener, connection time limit), so an outage
 * is logged and the queue carries on when the database is back.
 */

export const SIZE_RUN_QUEUE = 'size-run';

let started: Promise<PgBoss> | null = null;
let bossPool: ReturnType<typeof poolCreate> | null = null;
let stopping = false;

function bossCreate(): PgBoss {
	const pool = poolCreate(databaseUrl(), 3, 'queue');
	bossPool = pool;
	const boss = new PgBoss({
		db: { executeSql: async (text: string, values?: unknown[]) => pool.query(text, values as unknown[]) },
		schema: 'pgboss',
		// a finished job is kept a day, for looking back at; the run's own row keeps its results
		deleteAfterDays: 1,
		supervise: true,
		schedule: false
	});
	let lastLogMs = 0;
	boss.on('error', (e) => {
		const now = Date.now();
		if (now - lastLogMs > 5000) log.warn({ err: e }, 'size-run queue error');
		lastLogMs = now;
	});
	return boss;
}

/** The queue, started once per process (a failed start is tried again at the next call). */
export function sizeRunQueue(): Promise<PgBoss> {
	started ??= (async () => {
		const boss = bossCreate();
		await boss.start();
		await boss.createQueue(SIZE_RUN_QUEUE, { name: SIZE_RUN_QUEUE, retryLimit: 0, expireInSeconds: 15 * 60 });
		return boss;
	})().catch((e) => {
		started = null;
		throw e;
	});
	return started;
}

/** Resolves when the queue is started and answers (readiness); rejects otherwise. */
export async function sizeRunQueueCheck(): Promise<void> {
	const boss = await sizeRunQueue();
	await boss.getQueueSize(SIZE_RUN_QUEUE);
}

/**
 * Stops this process's worker and the queue (on shutdown): no new job is taken, a run in progress gets
 * up to `timeoutMs` to finish, then the queue's pool is closed.
 */
export async function sizeRunQueueStop(timeoutMs = 10_000): Promise<void> {
	stopping = true;
	const boss = started ? await started.catch(() => null) : null;
	started = null;
	if (boss) await boss.stop({ graceful: true, wait: true, close: false, timeout: timeoutMs });
	await bossPool?.end().catch(() => undefined);
	bossPool = null;
}

/** Puts a run on the queue; the job's id. */
export async function sizeRunEnqueue(runId: string): Promise<string | null> {
	const boss = await sizeRunQueue();
	return boss.send(SIZE_RUN_QUEUE, { sizeRunId: runId });
}

/** Takes the run's job off the queue if no worker has it yet (a running one stops between sizes). */
export async function sizeRunDequeue(jobId: string | null): Promise<void> {
	if (!jobId) return;
	const boss = await sizeRunQueue();
	await boss.cancel(SIZE_RUN_QUEUE, jobId).catch(() => undefined);
}

let working = false;

/**
 * Starts this process's worker on the size-run queue: one run at a time per process. When the database is
 * not reachable at start, it tries again every 5 s.
 */
export function sizeRunWorkerStart(): void {
	if (working || stopping || process.env.DARTELIER_SIZE_RUN_WORKER === 'off') return;
	working = true;
	const attempt = async () => {
		if (stopping) return;
		try {
			const boss = await sizeRunQueue();
			await boss.work<{ sizeRunId: string }>(SIZE_RUN_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
				for (const job of jobs) await sizeRunExecute(db(), job.data.sizeRunId);
			});
		} catch (e) {
			log.warn({ err: e }, 'the size-run worker could not start; trying again in 5 s');
			setTimeout(attempt, 5000).unref();
		}
	};
	void attempt();
}
