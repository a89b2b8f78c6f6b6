import { AsyncLocalStorage } from 'node:async_hooks';
import pino from 'pino';

/**
 * The app's one logger: JSON lines on stdout (pino), one object per line, for a log collector to read.
 *   LOG_LEVEL   default info (one line per request); warn keeps only trouble; debug is chattier.
 * Every line written while a request is answered carries its `requestId` (the same id the response's
 * `x-request-id` header gives), through `requestContext`. Nothing that opens a door is logged: request
 * lines carry the route's id (never the path, which may hold a reset or invitation token), and the
 * fields below are censored should any code log an object that holds them.
 */
export const LOG_REDACT_PATHS = [
	'password',
	'*.password',
	'newPassword',
	'*.newPassword',
	'token',
	'*.token',
	'secret',
	'*.secret',
	'sessionId',
	'*.sessionId',
	'session',
	'*.session',
	'cookie',
	'*.cookie',
	'cookies',
	'*.cookies',
	'authorization',
	'*.authorization',
	'headers["set-cookie"]',
	'*.headers["set-cookie"]',
	'headers.cookie',
	'*.headers.cookie',
	'headers.authorization',
	'*.headers.authorization'
];

/**
 * An error as logged: its kind, message, code and stack, nothing else. A driver's error object may
 * carry its connection (parameters, keys): none of that is written.
 */
export function errorSerialize(e: unknown): Record<string, unknown> {
	if (!(e instanceof Error)) return { message: String(e) };
	const code = (e as { code?: unknown }).code;
	const cause = (e as { cause?: unknown }).cause;
	return {
		type: e.name,
		message: e.message,
		...(typeof code === 'string' || typeof code === 'number' ? { code } : {}),
		stack: e.stack,
		...(cause !== undefined ? { cause: errorSerialize(cause) } : {})
	};
}

export interface RequestContext {
	requestId: string;
}

/** The request being answered, for every log line written on its behalf. */
export const requestContext = new AsyncLocalStorage<RequestContext>();

export function logCreate(destination: pino.DestinationStream = pino.destination({ fd: 1, sync: true })): pino.Logger {
	return pino(
		{
			level: process.env.LOG_LEVEL || 'info',
			base: { pid: process.pid },
			timestamp: pino.stdTimeFunctions.isoTime,
			redact: { paths: LOG_REDACT_PATHS, censor: '[redacted]' },
			serializers: { err: errorSerialize },
			formatters: { level: (label) => ({ level: label }) },
			mixin: () => {
				const ctx = requestContext.getStore();
				return ctx ? { requestId: ctx.requestId } : {};
			}
		},
		destination
	);
}

export const log = logCreate();
