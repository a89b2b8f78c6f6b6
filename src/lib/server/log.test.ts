import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { logCreate, requestContext } from './log';

function captured() {
	const lines: Record<string, unknown>[] = [];
	const stream = new Writable({
		write(chunk, _enc, done) {
			for (const l of String(chunk).split('\n').filter(Boolean)) lines.push(JSON.parse(l));
			done();
		}
	});
	return { log: logCreate(stream), lines };
}

describe('log', () => {
	it('censors passwords, tokens, sessions and cookies wherever an object holds them', () => {
		const { log, lines } = captured();
		log.info({ password: 'hunter22-secret', body: { newPassword: 'x2', token: 't0k' }, headers: { cookie: 'dartelier_session=abc', 'set-cookie': 's' } }, 'm');
		const text = JSON.stringify(lines);
		for (const secret of ['hunter22-secret', 'x2', 't0k', 'dartelier_session=abc', '"s"']) expect(text).not.toContain(secret);
		expect(lines[0].password).toBe('[redacted]');
	});

	it('writes an error as its kind, message, code and stack only, never the objects it holds', () => {
		const { log, lines } = captured();
		const e = Object.assign(new Error('connection lost'), { code: '57P01', client: { secretKey: 12345, password: 'pw-in-client' } });
		log.error({ err: e }, 'dropped');
		const err = lines[0].err as Record<string, unknown>;
		expect(err).toMatchObject({ type: 'Error', message: 'connection lost', code: '57P01' });
		expect(JSON.stringify(lines)).not.toContain('pw-in-client');
		expect(JSON.stringify(lines)).not.toContain('12345');
	});

	it('gives every line written while a request is answered that request id', () => {
		const { log, lines } = captured();
		requestContext.run({ requestId: 'req-0001-abcd' }, () => log.warn('inside'));
		log.warn('outside');
		expect(lines[0].requestId).toBe('req-0001-abcd');
		expect(lines[1].requestId).toBeUndefined();
	});
});
