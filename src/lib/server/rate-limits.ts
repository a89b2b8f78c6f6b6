import type pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { databaseUrl, poolCreate } from './db';
import { ApiError } from './http-errors';

/**
 * Rate limits on what sends mail, makes accounts or takes uploads, counted in PostgreSQL (table
 * rate_limits) so that every app process behind a load balancer shares one count. Each limit allows
 * `points` requests per `durationS` seconds for one key (an e-mail address, a client address, a
 * studio, a user); past it the request is answered 429 with Retry-After until the window ends.
 * Sign-in failures are throttled apart, in auth/throttle.ts. The README lists these figures. An
 * operator may change an allowance with `RATE_LIMIT_<NAME>` (e.g. `RATE_LIMIT_SIGNUP_ADDRESS=100` where a
 * whole school signs up from one address); every process on the database should then use the same value.
 */
export const RATE_LIMITS = {
	/** reset links asked for one e-mail address (whether or not it has an account) */
	reset_email: { points: 3, durationS: 3600, what: 'password-reset requests for this e-mail address' },
	/** reset links asked from one client address */
	reset_address: { points: 20, durationS: 3600, what: 'password-reset requests from your network address' },
	/** new accounts (each with its studio) from one client address */
	signup_address: { points: 20, durationS: 3600, what: 'sign-ups from your network address' },
	/** invitations sent (or sent again) by one studio */
	invite_studio: { points: 30, durationS: 3600, what: 'invitations sent from this studio' },
	/** fitting photos uploaded by one person */
	photo_user: { points: 200, durationS: 3600, what: 'photo uploads from your account' },
	/** pattern files imported (or previewed) by one person */
	import_user: { points: 60, durationS: 3600, what: 'file imports from your account' }
} as const satisfies Record<string, { points: number; durationS: number; what: string }>;

export type RateLimitName = keyof typeof RATE_LIMITS;

export interface RateLimited {
	retryAfterSeconds: number;
	message: string;
}

/** The allowance of a limit: `RATE_LIMIT_<NAME>` from the environment when a positive integer, else the table's. */
export function rateLimitPoints(name: RateLimitName): number {
	const set = Number(process.env[`RATE_LIMIT_${name.toUpperCase()}`]);
	return Number.isInteger(set) && set > 0 ? set : RATE_LIMITS[name].points;
}

/** A limiter of the table above on a given pool: the app's own, or a test's on the same database. */
export function rateLimiterCreate(name: RateLimitName, pool: pg.Pool): RateLimiterPostgres {
	const limit = RATE_LIMITS[name];
	return new RateLimiterPostgres({
		storeClient: pool,
		storeType: 'pool',
		tableName: 'rate_limits',
		tableCreated: true,
		clearExpiredByTimeout: false,
		keyPrefix: name,
		points: rateLimitPoints(name),
		duration: limit.durationS
	});
}

let pool: pg.Pool | undefined;
const limiters = new Map<RateLimitName, RateLimiterPostgres>();

function limiterGet(name: RateLimitName): RateLimiterPostgres {
	let l = limiters.get(name);
	if (!l) {
		pool ??= poolCreate(databaseUrl(), 2, 'rate limits');
		l = rateLimiterCreate(name, pool);
		limiters.set(name, l);
	}
	return l;
}

/** The person-readable refusal: what was counted, the allowance, and when to try again (UTC). */
export function rateLimitedMessage(name: RateLimitName, msBeforeNext: number, nowMs = Date.now()): RateLimited {
	const limit = RATE_LIMITS[name];
	const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
	const minutes = Math.ceil(seconds / 60);
	const wait = seconds < 90 ? `${seconds} seconds` : `${minutes} minutes`;
	const at = new Date(nowMs + seconds * 1000).toISOString().slice(11, 16);
	const per = limit.durationS === 3600 ? 'an hour' : `${Math.round(limit.durationS / 60)} minutes`;
	return {
		retryAfterSeconds: seconds,
		message: `Too many ${limit.what}: ${rateLimitPoints(name)} are allowed in ${per}. Try again in ${wait} (after ${at} UTC).`
	};
}

/** Counts one request under the limit; the refusal when the allowance is used up, else null. */
export async function rateLimitTake(name: RateLimitName, key: string): Promise<RateLimited | null> {
	try {
		await limiterGet(name).consume(key.toLowerCase());
		return null;
	} catch (e) {
		if (e instanceof RateLimiterRes) return rateLimitedMessage(name, e.msBeforeNext);
		throw e;
	}
}

/** Counts one request under each limit given; the longest refusal among them, else null. */
export async function rateLimitsTake(takes: readonly [RateLimitName, string][]): Promise<RateLimited | null> {
	let worst: RateLimited | null = null;
	for (const [name, key] of takes) {
		const r = await rateLimitTake(name, key);
		if (r && (!worst || r.retryAfterSeconds > worst.retryAfterSeconds)) worst = r;
	}
	return worst;
}

/** The JSON API's refusal: 429 `rate_limited` with Retry-After. */
export function rateLimitedError(r: RateLimited, headers: Record<string, string> = {}): ApiError {
	return new ApiError(429, 'rate_limited', r.message, undefined, { 'retry-after': String(r.retryAfterSeconds), ...headers });
}

/**
 * For upload routes: counts the upload before its body is read. When refused, the body is read to its
 * end and dropped (adapter-node's BODY_SIZE_LIMIT bounds it) so that the client, still sending, gets
 * the 429 instead of a broken connection; then 429 is thrown.
 */
export async function rateLimitUpload(name: RateLimitName, key: string, request: Request): Promise<void> {
	const r = await rateLimitTake(name, key);
	if (!r) return;
	try {
		const reader = request.body?.getReader();
		if (reader) for (;;) if ((await reader.read()).done) break;
	} catch {
		// a body cut short or over the server's cap: the refusal stands
	}
	throw rateLimitedError(r, { connection: 'close' });
}
