import type { Handle } from '@sveltejs/kit';
import { DATABASE_RETRY_AFTER_S, errorIsDatabaseUnavailable } from '../db/unavailable';
import { databaseUnavailableJson, databaseUnavailablePage } from '../db/unavailable-response';
import { log } from '../log';
import { isApi, type Event } from './common';

/**
 * While the database is away every request is answered 503 (JSON on /api, a page that retries by
 * itself for people), never 500 and never a crash; when it is back, requests are served again.
 */
function unavailable(event: Event, rendered?: Response): Response {
	if (isApi(event.url.pathname)) return databaseUnavailableJson();
	const type = rendered?.headers.get('content-type') ?? '';
	if (rendered && !type.includes('text/html')) {
		// form actions and client-side data requests keep SvelteKit's JSON shape, with our status
		const headers = new Headers(rendered.headers);
		headers.set('retry-after', String(DATABASE_RETRY_AFTER_S));
		return new Response(rendered.body, { status: 503, headers });
	}
	return databaseUnavailablePage();
}

/** The session check, the gate and the route run inside this: the database may go away during any of them. */
export const handleDatabaseUnavailable: Handle = async ({ event, resolve }) => {
	try {
		const response = await resolve(event);
		return event.locals.databaseUnavailable && response.status >= 500 ? unavailable(event, response) : response;
	} catch (e) {
		if (!errorIsDatabaseUnavailable(e)) throw e;
		log.warn({ method: event.request.method, route: event.route.id }, 'database unavailable');
		return unavailable(event);
	}
};
