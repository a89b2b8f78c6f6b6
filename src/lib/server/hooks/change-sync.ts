import type { Handle } from '@sveltejs/kit';
import { changeFeedSync } from '../cache/change-feed';

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * After a request that may have written (any method but GET, HEAD, OPTIONS), its answer waits until
 * this process has heard the change notices of what it committed: the next read here, by anyone, sees
 * the change and never a value kept from before it (cache/change-feed.ts).
 */
export const handleChangeSync: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	if (!READS.has(event.request.method)) await changeFeedSync();
	return response;
};
