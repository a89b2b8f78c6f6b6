/**
 * Is this error the database being away (stopped, restarting, unreachable, dropping connections)
 * rather than a fault of the request or of our code? Such errors are answered 503 and the request
 * can be tried again; everything else stays a 500.
 */

/** Node socket errors seen when the server is not there or goes away. */
const SOCKET_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'ENOTFOUND', 'EAI_AGAIN', 'EHOSTUNREACH']);

/**
 * PostgreSQL SQLSTATE codes of an unavailable server (PostgreSQL documentation, Appendix A,
 * "PostgreSQL Error Codes"): class 08 connection exception; 57P01 admin_shutdown, 57P02
 * crash_shutdown, 57P03 cannot_connect_now; 53300 too_many_connections.
 */
function sqlStateUnavailable(code: string): boolean {
	return code.startsWith('08') || code === '57P01' || code === '57P02' || code === '57P03' || code === '53300';
}

/** Messages node-postgres (pg, pg-pool) gives these failures without a code. */
const PG_MESSAGES = [
	'Connection terminated',
	'timeout exceeded when trying to connect',
	'Query read timeout',
	'Client has encountered a connection error and is not queryable',
	'Client was closed and is not queryable',
	'Cannot use a pool after calling end on the pool',
	'connect ECONNREFUSED'
];

export function errorIsDatabaseUnavailable(e: unknown, depth = 0): boolean {
	if (!e || typeof e !== 'object' || depth > 4) return false;
	const err = e as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
	if (typeof err.code === 'string' && (SOCKET_CODES.has(err.code) || sqlStateUnavailable(err.code))) return true;
	if (typeof err.message === 'string' && PG_MESSAGES.some((m) => (err.message as string).includes(m))) return true;
	// AggregateError (connecting to several addresses) and wrapped causes
	if (Array.isArray(err.errors) && err.errors.some((x) => errorIsDatabaseUnavailable(x, depth + 1))) return true;
	return errorIsDatabaseUnavailable(err.cause, depth + 1);
}

/** What a person reads when the database is away. */
export const DATABASE_UNAVAILABLE_MESSAGE =
	"The studio's database cannot be reached right now. Try again in a moment; if you were saving, reload first to see whether your change was stored.";

/** Seconds a client is told to wait before trying again. */
export const DATABASE_RETRY_AFTER_S = 5;
