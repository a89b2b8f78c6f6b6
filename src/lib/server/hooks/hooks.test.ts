import { describe, expect, it } from 'vitest';
import { requestIdFrom } from './request-log';
import { cspImageOriginsAdd } from './security-headers';

describe('request id', () => {
	it('keeps a plain id a proxy sent and makes a new one for anything else', () => {
		expect(requestIdFrom('lb-7f3a9c21.0042')).toBe('lb-7f3a9c21.0042');
		for (const bad of [null, '', 'short', 'a b c d e f', '<script>alert(1)</script>', 'x'.repeat(129)]) {
			expect(requestIdFrom(bad)).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
		}
	});
});

describe('content security policy', () => {
	it('adds the object store origin to img-src only, once', () => {
		const policy = "default-src 'self'; img-src 'self' data: blob:; frame-ancestors 'none'";
		const out = cspImageOriginsAdd(policy, ['https://photos.example.org']);
		expect(out).toBe("default-src 'self'; img-src 'self' data: blob: https://photos.example.org; frame-ancestors 'none'");
		expect(cspImageOriginsAdd(out, ['https://photos.example.org'])).toBe(out);
		expect(cspImageOriginsAdd("default-src 'none'", ['https://photos.example.org'])).toBe("default-src 'none'");
	});
});
