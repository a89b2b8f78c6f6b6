import { changeFeedStop } from './cache/change-feed';
import { dbClose } from './db';
import { log } from './log';
import { rateLimitCleanupStop } from './rate-limit-cleanup';
import { sizeRunQueueStop } from './size-runs/queue';

/** After the last request in flight: the size-run worker stops (a run in progress may finish), the pools close. */
export async function shutdownClose(reason: string): Promise<void> {
	log.info({ reason }, 'shutting down: no new requests, the ones in flight are done');
	rateLimitCleanupStop();
	try {
		await sizeRunQueueStop();
	} catch (e) {
		log.warn({ err: e }, 'the size-run queue did not stop cleanly');
	}
	await changeFeedStop();
	try {
		await dbClose();
	} catch (e) {
		log.warn({ err: e }, 'the database pool did not close cleanly');
	}
	log.info('stopped');
}

let listening = false;

/**
 * adapter-node's graceful shutdown (SIGTERM, SIGINT): it closes the listening socket at once, waits for
 * the requests in flight, then emits `sveltekit:shutdown`; we close what we opened and exit 0.
 */
export function shutdownOnSignal(): void {
	if (listening) return;
	listening = true;
	process.once('sveltekit:shutdown' as 'beforeExit', (reason: unknown) => {
		void shutdownClose(String(reason)).finally(() => process.exit(0));
	});
}
