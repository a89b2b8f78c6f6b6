import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { databaseUrl, poolCreate } from '../db';

/**
 * Sign-in throttling, shared by every app instance through PostgreSQL (table sign_in_limits, created
 * by the foundation migration). Failures are counted per e-mail and per client address; when either
 * runs out, sign-in answers 429 until the block ends. A successful sign-in clears the e-mail's count.
 */
export const EMAIL_FAILURES = 5;
export const ADDRESS_FAILURES = 30;
const WINDOW_S = 15 * 60;
const BLOCK_S = 15 * 60;

let limiters: { email: RateLimiterPostgres; address: RateLimiterPostgres } | undefined;

function limitersGet() {
	if (!limiters) {
		const pool = poolCreate(databaseUrl(), 2, 'sign-in limits');
		const common = {
			storeClient: pool,
			storeType: 'pool',
			tableName: 'sign_in_limits',
			tableCreated: true,
			clearExpiredByTimeout: false,
			duration: WINDOW_S,
			blockDuration: BLOCK_S
		};
		limiters = {
			email: new RateLimiterPostgres({ ...common, keyPrefix: 'signin_email', points: EMAIL_FAILURES }),
			address: new RateLimiterPostgres({ ...common, keyPrefix: 'signin_addr', points: ADDRESS_FAILURES })
		};
	}
	return limiters;
}

export interface Throttled {
	retryAfterSeconds: number;
	message: string;
}

function throttled(msBeforeNext: number): Throttled {
	const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
	const minutes = Math.ceil(seconds / 60);
	const at = new Date(Date.now() + seconds * 1000).toISOString().slice(11, 16);
	const wait = seconds < 90 ? `${seconds} seconds` : `${minutes} minutes`;
	return {
		retryAfterSeconds: seconds,
		message: `Too many failed sign-ins. Try again in ${wait} (after ${at} UTC).`
	};
}

function blockedBy(res: RateLimiterRes | null, points: number): number | null {
	if (!res) return null;
	return res.consumedPoints >= points && res.msBeforeNext > 0 ? res.msBeforeNext : null;
}

/** Is sign-in blocked for this e-mail or address right now? */
export async function signInBlocked(email: string, address: string): Promise<Throttled | null> {
	const l = limitersGet();
	const [e, a] = await Promise.all([l.email.get(email), l.address.get(address)]);
	const ms = Math.max(blockedBy(e, EMAIL_FAILURES) ?? 0, blockedBy(a, ADDRESS_FAILURES) ?? 0);
	return ms > 0 ? throttled(ms) : null;
}

/** Counts a failed sign-in; returns the block when this failure used up the allowance. */
export async function signInFailed(email: string, address: string): Promise<Throttled | null> {
	const l = limitersGet();
	let ms = 0;
	for (const [limiter, key] of [
		[l.email, email],
		[l.address, address]
	] as const) {
		try {
			await limiter.consume(key);
		} catch (e) {
			if (e instanceof RateLimiterRes) ms = Math.max(ms, e.msBeforeNext);
			else throw e;
		}
	}
	return ms > 0 ? throttled(ms) : null;
}

export async function signInSucceeded(email: string): Promise<void> {
	await limitersGet().email.delete(email);
}
