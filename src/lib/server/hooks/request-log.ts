import { randomUUID } from 'node:crypto';
import type { Handle } from '@sveltejs/kit';
import { log, requestContext } from '../log';
import { mutable, type Event } from './common';

export const REQUEST_ID_HEADER = 'x-request-id';

/**
 * The id a request is known by in the logs and in its response's `x-request-id`: the one a proxy in
 * front already gave it, when that one is plain (letters, digits, `-_.:`, 8 to 128 of them), else a new one.
 */
export function requestIdFrom(incoming: string | null): string {
	if (incoming && /^[A-Za-z0-9._:-]{8,128}$/.test(incoming)) return incoming;
	return randomUUID();
}

/** One line for a request: who, where (the route's id, never the path, which may hold a token), the answer and how long. */
export function requestLine(event: Event, status: number, durationMs: number) {
	return {
		method: event.request.method,
		route: event.route.id,
		status,
		durationMs: Math.round(durationMs * 10) / 10,
		userId: event.locals.user?.id ?? null,
		studioId: event.params.studioId ?? null
	};
}

/**
 * Outermost handle: gives the request its id (locals, every log line written while answering it, the
 * response header) and logs one line when the answer is ready (warn for 5xx, error when a handle threw).
 */
export const handleRequestLog: Handle = async ({ event, resolve }) => {
	const requestId = requestIdFrom(event.request.headers.get(REQUEST_ID_HEADER));
	event.locals.requestId = requestId;
	const startMs = performance.now();
	return requestContext.run({ requestId }, async () => {
		let response: Response;
		try {
			response = mutable(await resolve(event));
		} catch (e) {
			log.error({ ...requestLine(event, 500, performance.now() - startMs), err: e }, 'request failed');
			throw e;
		}
		response.headers.set(REQUEST_ID_HEADER, requestId);
		const line = requestLine(event, response.status, performance.now() - startMs);
		if (response.status >= 500) log.warn(line, 'request');
		else log.info(line, 'request');
		return response;
	});
};
