import type { HandleServerError, ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { DATABASE_UNAVAILABLE_MESSAGE, errorIsDatabaseUnavailable } from '$lib/server/db/unavailable';
import { handleApiShape } from '$lib/server/hooks/api-shape';
import { handleAuthz, handleCrossSite } from '$lib/server/hooks/authz-gate';
import { handleChangeSync } from '$lib/server/hooks/change-sync';
import { handleDatabaseUnavailable } from '$lib/server/hooks/database-unavailable';
import { handleRequestLog } from '$lib/server/hooks/request-log';
import { handleSecurityHeaders } from '$lib/server/hooks/security-headers';
import { handleSession } from '$lib/server/hooks/session';
import { defaultErrorCode } from '$lib/server/http-errors';
import { log } from '$lib/server/log';
import { rateLimitCleanupStart } from '$lib/server/rate-limit-cleanup';
import { shutdownOnSignal } from '$lib/server/shutdown';
import { sizeRunWorkerStart } from '$lib/server/size-runs/queue';

/**
 * The size-run worker (pg-boss) runs in every app process: `npm start` and the tests' app start it here,
 * with the timer that deletes expired rate-limit counters.
 * On SIGTERM or SIGINT adapter-node stops taking connections and lets the requests in flight finish
 * (SHUTDOWN_TIMEOUT, default 30 s), then says `sveltekit:shutdown`: the worker and the pools close then.
 */
export const init: ServerInit = async () => {
	sizeRunWorkerStart();
	rateLimitCleanupStart();
	shutdownOnSignal();
};

/**
 * Every request passes these, outermost first: its id and log line; the security headers; the API's
 * error shape; 503 while the database is away (around everything that may need it); after a write, the
 * wait for its change notices (so what this process keeps is never older than its own writes); the session; the
 * cross-site check of API writes; the authz table; then the route.
 */
export const handle = sequence(
	handleRequestLog,
	handleSecurityHeaders,
	handleApiShape,
	handleDatabaseUnavailable,
	handleChangeSync,
	handleSession,
	handleCrossSite,
	handleAuthz
);

export const handleError: HandleServerError = ({ error, event, status, message }) => {
	if (errorIsDatabaseUnavailable(error)) {
		event.locals.databaseUnavailable = true;
		log.warn({ method: event.request.method, route: event.route.id }, 'database unavailable');
		return { message: DATABASE_UNAVAILABLE_MESSAGE, code: 'unavailable' };
	}
	if (status >= 500) {
		const reference = event.locals.requestId ?? crypto.randomUUID();
		log.error({ requestId: reference, method: event.request.method, route: event.route.id, err: error }, 'unexpected error');
		return { message: `Something went wrong on our side (reference ${reference}).`, code: 'internal' };
	}
	return { message, code: defaultErrorCode(status) };
};
