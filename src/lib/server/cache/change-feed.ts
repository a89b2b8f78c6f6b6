import pg from 'pg';
import { databaseUrl } from '../db';
import { log } from '../log';

/**
 * This process's ear on the database's change notices (migration 2026-12-04-0090: `style:<id>` when a
 * style, its pieces, versions or seam pairs change; `user:<id>` when a session, user or membership
 * changes), for the caches in this folder. One connection of its own, LISTENing.
 *
 * The rules every cache here keeps:
 *  - use nothing kept while the feed is not `changeFeedReady()` (not yet connected, or the connection
 *    lost: notices may have been missed); everything kept is forgotten when it connects again;
 *  - keep a value read from the database only if no notice that came in during the read
 *    (`changeFeedSince(epoch before the read)`) concerns it: it may be the value before that change;
 *  - a process that answered a write waits for `changeFeedSync()` first, so its own changes' notices
 *    have arrived before its next answer (other processes hear them a moment after the commit).
 */
export type ChangeKind = 'style' | 'user';
type Hearer = (id: string | '*') => void;

const hearers: Record<ChangeKind, Set<Hearer>> = { style: new Set(), user: new Set() };
let client: pg.Client | undefined;
let ready = false;
let epoch = 0;
let connecting: Promise<void> | undefined;
let retryTimer: NodeJS.Timeout | undefined;
let stopped = false;
/** Whether the listening connection was ever lost (to log its return). */
let everLost = false;
const RETRY_MS = 1000;
/** The latest notices heard, with the epoch each made (`*`: everything was forgotten then). */
const recent: { epoch: number; kind: ChangeKind | '*'; id: string }[] = [];
const RECENT_MAX = 2048;

function heard(kind: ChangeKind | '*', id: string): void {
	epoch++;
	recent.push({ epoch, kind, id });
	if (recent.length > RECENT_MAX) recent.splice(0, recent.length - RECENT_MAX);
}

function forgetAll(): void {
	heard('*', '*');
	for (const set of Object.values(hearers)) for (const h of set) h('*');
}

function lost(c: pg.Client, err?: Error): void {
	if (client !== c) return;
	client = undefined;
	const wasReady = ready;
	if (wasReady) everLost = true;
	ready = false;
	forgetAll();
	// once per outage, not at every try to listen again
	if (wasReady && !stopped) log.warn({ err }, 'change notices lost: nothing is kept until the database answers again');
	c.end().catch(() => undefined);
	if (!stopped && !retryTimer) {
		retryTimer = setTimeout(() => {
			retryTimer = undefined;
			void connect();
		}, RETRY_MS);
		retryTimer.unref();
	}
}

function connect(): Promise<void> {
	if (connecting || client || stopped) return connecting ?? Promise.resolve();
	let url: string;
	try {
		url = databaseUrl();
	} catch {
		return Promise.resolve(); // no database configured (a unit test): nothing is ever kept
	}
	// named, so an operator sees it in pg_stat_activity
	const c = new pg.Client({ connectionString: url, keepAlive: true, application_name: 'dartelier-change-feed' });
	c.on('notification', (n) => {
		const at = n.payload?.indexOf(':') ?? -1;
		if (!n.payload || at < 0) return;
		const kind = n.payload.slice(0, at) as ChangeKind;
		if (!hearers[kind]) return;
		const id = n.payload.slice(at + 1);
		heard(kind, id);
		for (const h of hearers[kind]) h(id);
	});
	c.on('error', (err) => lost(c, err));
	c.on('end', () => lost(c));
	connecting = (async () => {
		try {
			await c.connect();
			await c.query('listen dartelier_change');
			client = c;
			forgetAll();
			ready = !stopped;
			if (everLost && ready) log.info('change notices heard again: reads are kept again');
		} catch (err) {
			client = c;
			lost(c, err as Error);
		} finally {
			connecting = undefined;
		}
	})();
	return connecting;
}

/** DARTELIER_KEPT_READS=off: this process keeps nothing and does not listen (every read asks the database). */
const keptReadsOff = process.env.DARTELIER_KEPT_READS === 'off';

/** Whether kept values may be used now; the first call starts listening (ready a moment later). */
export function changeFeedReady(): boolean {
	if (keptReadsOff) return false;
	if (!ready && !stopped && !retryTimer) void connect(); // after a loss: once a second, not at every request
	return ready;
}

/** Goes up with every notice heard and every connection made or lost. */
export function changeFeedEpoch(): number {
	return epoch;
}

/**
 * The notices heard since the epoch given, or `undefined` when that cannot be said (everything was
 * forgotten since, or too many came in): whoever asks must then assume the worst.
 */
export function changeFeedSince(since: number): readonly { kind: ChangeKind; id: string }[] | undefined {
	if (since === epoch) return [];
	const first = recent.length - (epoch - since);
	if (first < 0) return undefined;
	const out: { kind: ChangeKind; id: string }[] = [];
	for (let i = first; i < recent.length; i++) {
		const n = recent[i];
		if (n.kind === '*') return undefined;
		out.push({ kind: n.kind, id: n.id });
	}
	return out;
}

/** `hear(id)` for each notice of that kind; `hear('*')` when everything kept must go. */
export function changeFeedOn(kind: ChangeKind, hear: Hearer): void {
	hearers[kind].add(hear);
}

/** The sync query that callers arriving now share (sent once the one before it is answered). */
let syncNext: Promise<void> | undefined;
let syncLast: Promise<void> = Promise.resolve();

/**
 * Resolves once every notice of a change committed before the call has been heard: a query on the
 * listening connection, whose answer PostgreSQL sends after the notices pending for it. One such query
 * at a time; callers that come while one is under way share the next.
 */
export function changeFeedSync(): Promise<void> {
	const c = client;
	if (!ready || !c) return Promise.resolve();
	if (!syncNext) {
		syncNext = syncLast.then(async () => {
			syncNext = undefined;
			await c.query('select 1').catch(() => undefined);
		});
		syncLast = syncNext;
	}
	return syncNext;
}

/** On shutdown: stop listening, forget everything. */
export async function changeFeedStop(): Promise<void> {
	stopped = true;
	ready = false;
	if (retryTimer) clearTimeout(retryTimer);
	await connecting;
	const c = client;
	client = undefined;
	forgetAll();
	await c?.end().catch(() => undefined);
}
