import { describe, expect, it } from 'vitest';
import { cookieSecure } from './lucia';

describe('session cookie Secure flag', () => {
	it('is off only on plain-http loopback', () => {
		expect(cookieSecure(new URL('http://127.0.0.1:4173/'))).toBe(false);
		expect(cookieSecure(new URL('http://localhost:5173/'))).toBe(false);
		expect(cookieSecure(new URL('http://[::1]:5173/'))).toBe(false);
		expect(cookieSecure(new URL('https://127.0.0.1/'))).toBe(true);
		expect(cookieSecure(new URL('https://dartelier.example/'))).toBe(true);
		expect(cookieSecure(new URL('http://dartelier.example/'))).toBe(true);
		expect(cookieSecure(new URL('http://192.168.1.5/'))).toBe(true);
	});
});
