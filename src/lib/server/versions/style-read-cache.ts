import { LRUCache } from 'lru-cache';
import type { DbOrTx } from '../db';
import { versionsShownText, type ShownVersionText } from '../repositories/style-overview';

/**
 * The style read's versions as JSON text, kept in this process by version id and stamp (the row's
 * `xmin`, see PieceWithShownStamp): a stored row under one stamp never changes, a changed row has a new
 * stamp and is read again, so no entry can be stale and none has to be forgotten (several app processes
 * each keep their own). The least recently read go first once the texts reach STYLE_READ_CACHE_MB
 * (default 64; 0 turns keeping off).
 */
const limitMb = Number(process.env.STYLE_READ_CACHE_MB ?? 64);
const cache =
	limitMb > 0
		? new LRUCache<string, string>({
				maxSize: Math.max(1, Math.floor(limitMb * 1024 * 1024)),
				sizeCalculation: (text, key) => 2 * (text.length + key.length)
			})
		: undefined;

/** The `shown` object of the style read, as JSON text, from a version row. */
function shownJson(v: ShownVersionText): string {
	return `{"id":${JSON.stringify(v.id)},"number":${v.number},"state":${JSON.stringify(v.state)},"geometry":${v.geometry ?? 'null'},"metrics":${v.metrics ?? 'null'},"checks":${v.checks ?? 'null'}}`;
}

/**
 * The versions asked for (id and the stamp the caller read) as `shown` JSON text, by version id: kept
 * ones, the rest in one query. A version changed since the caller read its stamp comes back as it now
 * stands (and is kept under its new stamp).
 */
export async function versionsShownJson(db: DbOrTx, wanted: readonly { id: string; stamp: string }[]): Promise<Map<string, string>> {
	const out = new Map<string, string>();
	const missing: string[] = [];
	for (const w of wanted) {
		const hit = cache?.get(`${w.id}@${w.stamp}`);
		if (hit === undefined) missing.push(w.id);
		else out.set(w.id, hit);
	}
	for (const v of await versionsShownText(db, missing)) {
		const text = shownJson(v);
		cache?.set(`${v.id}@${v.stamp}`, text);
		out.set(v.id, text);
	}
	return out;
}
