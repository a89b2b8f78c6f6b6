import { describe, expect, it } from 'vitest';
import { errorIsDatabaseUnavailable } from './unavailable';

// SQLSTATE codes from the PostgreSQL documentation, Appendix A "PostgreSQL Error Codes" (C).
describe('telling a database outage from other errors', () => {
	it('counts connection exceptions and shutdowns as the database being away', () => {
		for (const code of ['08000', '08006', '08001', '57P01', '57P02', '57P03', '53300']) {
			expect(errorIsDatabaseUnavailable(Object.assign(new Error('x'), { code })), code).toBe(true);
		}
	});

	it('counts refused and reset sockets and node-postgres connection messages', () => {
		expect(errorIsDatabaseUnavailable(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' }))).toBe(true);
		expect(errorIsDatabaseUnavailable(new Error('Connection terminated unexpectedly'))).toBe(true);
		expect(errorIsDatabaseUnavailable(new Error('timeout exceeded when trying to connect'))).toBe(true);
		expect(errorIsDatabaseUnavailable(new AggregateError([Object.assign(new Error('a'), { code: 'ECONNREFUSED' })]))).toBe(true);
		expect(errorIsDatabaseUnavailable(new Error('wrapped', { cause: Object.assign(new Error('b'), { code: '57P01' }) }))).toBe(true);
	});

	it('leaves query faults and our own bugs as they are (answered 500 or 4xx elsewhere)', () => {
		expect(errorIsDatabaseUnavailable(Object.assign(new Error('syntax error at or near "where"'), { code: '42601' }))).toBe(false);
		expect(errorIsDatabaseUnavailable(Object.assign(new Error('duplicate key'), { code: '23505' }))).toBe(false);
		expect(errorIsDatabaseUnavailable(new TypeError('row.values.filter is not a function'))).toBe(false);
		expect(errorIsDatabaseUnavailable(null)).toBe(false);
		expect(errorIsDatabaseUnavailable('Connection terminated')).toBe(false);
	});
});
