import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { cookieSecure, lucia, sessionCookieClear, sessionCookieSet } from '$lib/server/auth/lucia';
import { decide, ruleLookup, signInPath } from '$lib/server/authz';
import { DATABASE_RETRY_AFTER_S, DATABASE_UNAVAILABLE_MESSAGE, errorIsDatabaseUnavailable } from '$lib/server/db/unavailable';
import { databaseUnavailableJson, databaseUnavailablePage } from '$lib/server/db/unavailable-response';
import { defaultErrorCode, defaultErrorMessage, jsonError } from '$lib/server/http-errors';
import { cspNonce, scriptsWithNonce, securityHeadersSet } from '$lib/server/security-headers';
import { storageOrigin } from '$lib/server/storage';
import { sizeRunWorkerStart } from '$lib/server/size-runs/queue';

/** The size-run worker (pg-boss) runs in every app process: `npm start` and the tests' app start it here. */
export const init: ServerInit = async () => {
	sizeRunWorkerStart();
};

const isApi = (pathname: string) => pathname === '/api' || pathname.startsWith('/api/');

type Event = Parameters<Handle>[0]['event'];

/**
 * Reads the session cookie into locals. Returns the Set-Cookie value to send when the cookie
 * changed (refreshed or cleared), for responses the hook answers itself without `resolve`.
 */
async function sessionLoad(event: Event): Promise<string | undefined> {
	event.locals.user = null;
	event.locals.session = null;
	const sessionId = event.cookies.get(lucia.sessionCookieName);
	if (!sessionId) return undefined;
	// A cookie that is not of the form lucia issues is dropped without a database round trip.
	const valid = /^[a-z2-7]{40}$/.test(sessionId) ? await lucia.validateSession(sessionId) : null;
	if (!valid?.session) {
		sessionCookieClear(event);
		const blank = lucia.createBlankSessionCookie();
		return event.cookies.serialize(blank.name, blank.value, {
			...blank.attributes,
			path: '/',
			secure: cookieSecure(event.url)
		});
	}
	const { session, user } = valid;
	event.locals.session = { id: session.id, expiresAt: session.expiresAt };
	event.locals.user = { id: user.id, email: user.email, name: user.name };
	if (session.fresh) {
		sessionCookieSet(event, session.id);
		const c = lucia.createSessionCookie(session.id);
		return event.cookies.serialize(c.name, c.value, { ...c.attributes, path: '/', secure: cookieSecure(event.url) });
	}
	return undefined;
}

/**
 * What the authz table says of a request: a response to answer with, or `undefined` to let it
 * through, or `{ renderDenied }`: a page the reader may not see, which the route's own check
 * (`requireRole` in its load) answers with the app's error page in the app's layout.
 */
type Gate = Response | undefined | { renderDenied: 403 | 404; message: string };

function plainDenial(status: 403 | 404): Response {
	return new Response(status === 404 ? 'Not Found' : 'Forbidden', {
		status,
		headers: { 'content-type': 'text/plain; charset=utf-8' }
	});
}

async function gate(event: Event): Promise<Gate> {
	const routeId = event.route.id;
	const api = isApi(event.url.pathname);
	if (routeId === null) return api ? jsonError(404, 'not_found', 'No such API route.') : undefined;
	const found = ruleLookup(routeId, event.request.method);
	if (found.kind === 'no_route') {
		console.error(`[authz] route ${routeId} has no row in src/lib/server/authz.ts: denied`);
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
async function deniedPage(
	event: Event,
	resolve: Parameters<Handle>[0]['resolve'],
	denied: { renderDenied: 403 | 404; message: string },
	nonce: string
): Promise<Response> {
	const response = await resolve(event, { transformPageChunk: ({ html }) => scriptsWithNonce(html, nonce) });
	if (response.status === denied.renderDenied) return response;
	console.error(
		`[authz] ${event.route.id} answered ${response.status} where the table denies it (${denied.renderDenied}): its load must call requireRole`
	);
	return plainDenial(denied.renderDenied);
}

/** Cross-site writes to the JSON API are refused, as SvelteKit already does for form posts. */
function foreignOrigin(event: Event): boolean {
	if (['GET', 'HEAD', 'OPTIONS'].includes(event.request.method)) return false;
	const origin = event.request.headers.get('origin');
	return origin !== null && origin !== event.url.origin;
}

/** Non-JSON or SvelteKit-shaped errors on /api become `{ error: { code, message } }`. */
async function apiErrorShape(response: Response): Promise<Response> {
	if (response.status < 400) return response;
	const type = response.headers.get('content-type') ?? '';
	let message = defaultErrorMessage(response.status);
	if (type.includes('application/json')) {
		const body = (await response.clone().json().catch(() => null)) as
			| { error?: unknown; message?: unknown }
			| null;
		if (body && typeof body.error === 'object' && body.error !== null) return response;
		if (body && typeof body.message === 'string' && response.status < 500) message = body.message;
	}
	const out = jsonError(response.status, defaultErrorCode(response.status), message);
	for (const h of ['allow', 'retry-after', 'set-cookie']) {
		const v = response.headers.get(h);
		if (v) out.headers.set(h, v);
	}
	return out;
}

function mutable(response: Response): Response {
	try {
		response.headers.set('x-content-type-options', 'nosniff');
		return response;
	} catch {
		return new Response(response.body, response);
	}
}

/** The session check, the gate and the route itself; the database may be away during any of them. */
async function respond(event: Event, resolve: Parameters<Handle>[0]['resolve'], nonce: string): Promise<Response> {
	const cookieChange = await sessionLoad(event);
	const early =
		isApi(event.url.pathname) && foreignOrigin(event)
			? jsonError(403, 'forbidden', 'Cross-site requests are not allowed.')
			: await gate(event);
	if (early && 'renderDenied' in early) return deniedPage(event, resolve, early, nonce); // cookies go out with the page
	if (early) {
		const response = mutable(early);
		if (cookieChange) response.headers.append('set-cookie', cookieChange);
		return response;
	}
	return resolve(event, { transformPageChunk: ({ html }) => scriptsWithNonce(html, nonce) });
}

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

export const handle: Handle = async ({ event, resolve }) => {
	const nonce = cspNonce();
	let response: Response;
	try {
		response = await respond(event, resolve, nonce);
		if (event.locals.databaseUnavailable && response.status >= 500) response = unavailable(event, response);
	} catch (e) {
		if (!errorIsDatabaseUnavailable(e)) throw e;
		console.warn(`[db] ${event.request.method} ${event.url.pathname}: database unavailable`);
		response = unavailable(event);
	}
	if (isApi(event.url.pathname)) {
		response = await apiErrorShape(response);
		response.headers.set('cache-control', 'no-store');
	}
	response = mutable(response);
	const photos = storageOrigin();
	securityHeadersSet(response.headers, nonce, photos ? [photos] : []);
	return response;
};

export const handleError: HandleServerError = ({ error, event, status, message }) => {
	if (errorIsDatabaseUnavailable(error)) {
		event.locals.databaseUnavailable = true;
		console.warn(`[db] ${event.request.method} ${event.url.pathname}: database unavailable`);
		return { message: DATABASE_UNAVAILABLE_MESSAGE, code: 'unavailable' };
	}
	if (status >= 500) {
		const id = crypto.randomUUID();
		console.error(`[error ${id}] ${event.request.method} ${event.url.pathname}:`, error);
		return { message: `Something went wrong on our side (reference ${id}).`, code: 'internal' };
	}
	return { message, code: defaultErrorCode(status) };
};
