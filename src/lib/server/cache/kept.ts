import { LRUCache } from 'lru-cache';
import { changeFeedEpoch, changeFeedOn, changeFeedReady, changeFeedSince, type ChangeKind } from './change-feed';

/**
 * A cache of database reads that follows the change notices (change-feed.ts): used only while the feed
 * is ready, filled only when no notice that came in during the read concerns the value, emptied of
 * what a notice names.
 * `names(value, kind, id)` says whether a notice of that kind and id may concern a kept value.
 */
export interface KeptReads<V extends object> {
	/** The kept value for the key, or `read()`'s (kept when allowed). `undefined` is never kept. */
	get(key: string, read: () => Promise<V | undefined>): Promise<V | undefined>;
	/** How many values are kept now (for tests). */
	readonly size: number;
}

export function keptReads<V extends object>(opts: {
	max: number;
	ttlMs: number;
	kinds: readonly ChangeKind[];
	names: (value: V, kind: ChangeKind, id: string) => boolean;
}): KeptReads<V> {
	const cache = new LRUCache<string, V>({ max: opts.max, ttl: opts.ttlMs });
	for (const kind of opts.kinds) {
		changeFeedOn(kind, (id) => {
			if (id === '*') return cache.clear();
			for (const [key, value] of cache.entries()) if (opts.names(value, kind, id)) cache.delete(key);
		});
	}
	return {
		async get(key, read) {
			if (!changeFeedReady()) return read();
			const hit = cache.get(key);
			if (hit !== undefined) return hit;
			const epoch = changeFeedEpoch();
			const value = await read();
			if (value === undefined || !changeFeedReady()) return value;
			const since = changeFeedSince(epoch);
			if (since && !since.some((n) => opts.kinds.includes(n.kind) && opts.names(value, n.kind, n.id))) cache.set(key, value);
			return value;
		},
		get size() {
			return cache.size;
		}
	};
}
