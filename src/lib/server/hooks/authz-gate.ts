import type { Handle } from '@sveltejs/kit';
import { decide, ruleLookup, signInPath } from '../authz';
import { defaultErrorCode, jsonError } from '../http-errors';
import { log } from '../log';
import { isApi, type Event, type Resolve } from './common';

/**
 * What the authz table says of a request: a response to answer with, or `undefined` to let it
 * through, or `{ renderDenied }`: a page the reader may not see, which the route's own check
 * (`requireRole` in its load) answers with the app's error page in the app's layout.
 */
type Gate = Response | undefined | { renderDenied: 403 | 404; message: string };

function plainDenial(status: 403 | 404): Response {
	return new Response(status === 404 ? 'Not Found' : 'Forbidden', { status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
}

async function gate(event: Event): Promise<Gate> {
	const routeId = event.route.id;
	const api = isApi(event.url.pathname);
	if (routeId === null) return api ? jsonError(404, 'not_found', 'No such API route.') : undefined;
	const found = ruleLookup(routeId, event.request.method);
	if (found.kind === 'no_route') {
		log.error({ route: routeId }, 'route has no row in src/lib/server/authz.ts: denied');
		return api
			? jsonError(403, 'forbidden', 'This route is not open to anyone yet.')
			: new Response('Forbidden', { status: 403, headers: { 'content-type': 'text/plain' } });
	}
	if (found.kind === 'no_method') {
		const allow = found.allow.join(', ');
		return api
			? jsonError(405, 'method_not_allowed', `Use ${allow} here.`, undefined, { allow })
			: new Response('Method Not Allowed', { status: 405, headers: { allow, 'content-type': 'text/plain' } });
	}
	const d = await decide(event, found.rule);
	if (d.ok) return undefined;
	if (api) return jsonError(d.status, defaultErrorCode(d.status), d.message);
	if (d.status === 401) return new Response(null, { status: 303, headers: { location: signInPath(event.url) } });
	if (event.request.method === 'GET' || event.request.method === 'HEAD') return { renderDenied: d.status, message: d.message };
	return plainDenial(d.status);
}

/**
 * A denied page is rendered by its route, whose load makes the same check and throws the same
 * error. Should a route ever answer otherwise (a load that forgot its check), nothing of it leaves:
 * the plain denial goes out instead, and the log says which route to fix.
 */
async function deniedPage(event: Event, resolve: Resolve, denied: { renderDenied: 403 | 404 }): Promise<Response> {
	const response = await resolve(event);
	if (response.status === denied.renderDenied) return response;
	log.error(
		{ route: event.route.id, status: response.status, denied: denied.renderDenied },
		'a route answered where the table denies it: its load must call requireRole'
	);
	return plainDenial(denied.renderDenied);
}

/** Cross-site writes to the JSON API are refused, as SvelteKit already does for form posts. */
export const handleCrossSite: Handle = async ({ event, resolve }) => {
	if (!isApi(event.url.pathname) || ['GET', 'HEAD', 'OPTIONS'].includes(event.request.method)) return resolve(event);
	const origin = event.request.headers.get('origin');
	if (origin !== null && origin !== event.url.origin) return jsonError(403, 'forbidden', 'Cross-site requests are not allowed.');
	return resolve(event);
};

/** The authz table (src/lib/server/authz.ts), checked before the route runs; the route checks again. */
export const handleAuthz: Handle = async ({ event, resolve }) => {
	const early = await gate(event);
	if (early && 'renderDenied' in early) return deniedPage(event, resolve, early);
	return early ?? resolve(event);
};
