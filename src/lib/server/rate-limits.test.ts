import { afterEach, describe, expect, it } from 'vitest';
import { rateLimitedMessage, rateLimitPoints } from './rate-limits';

describe('rate-limit refusals', () => {
	afterEach(() => {
		delete process.env.RATE_LIMIT_INVITE_STUDIO;
	});

	it('say what was counted, the allowance, the wait in minutes and the time to try again (UTC)', () => {
		const r = rateLimitedMessage('invite_studio', 41 * 60 * 1000 - 500, Date.UTC(2026, 11, 4, 13, 24, 0));
		expect(r.retryAfterSeconds).toBe(41 * 60);
		expect(r.message).toBe('Too many invitations sent from this studio: 30 are allowed in an hour. Try again in 41 minutes (after 14:05 UTC).');
	});

	it('give a short wait in seconds, never less than one', () => {
		expect(rateLimitedMessage('photo_user', 45_000, 0).message).toContain('Try again in 45 seconds (after 00:00 UTC)');
		expect(rateLimitedMessage('photo_user', 0, 0).retryAfterSeconds).toBe(1);
	});

	it('take an allowance from RATE_LIMIT_<NAME> when it is a positive whole number, else the table', () => {
		expect(rateLimitPoints('invite_studio')).toBe(30);
		process.env.RATE_LIMIT_INVITE_STUDIO = '80';
		expect(rateLimitPoints('invite_studio')).toBe(80);
		expect(rateLimitedMessage('invite_studio', 60_000, 0).message).toContain('80 are allowed in an hour');
		for (const bad of ['0', '-3', '2.5', 'many', '']) {
			process.env.RATE_LIMIT_INVITE_STUDIO = bad;
			expect(rateLimitPoints('invite_studio')).toBe(30);
		}
	});
});
