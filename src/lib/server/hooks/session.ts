import type { Handle } from '@sveltejs/kit';
import { cookieSecure, lucia, sessionCookieClear, sessionCookieSet } from '../auth/lucia';
import { mutable, type Event } from './common';

/**
 * Reads the session cookie into locals. Returns the Set-Cookie value to send when the cookie
 * changed (refreshed or cleared), for responses a later handle answers itself without SvelteKit
 * (which adds `event.cookies` only to what it renders).
 */
async function sessionLoad(event: Event): Promise<string | undefined> {
	event.locals.user = null;
	event.locals.session = null;
	event.locals.roles = undefined;
	const sessionId = event.cookies.get(lucia.sessionCookieName);
	if (!sessionId) return undefined;
	// A cookie that is not of the form lucia issues is dropped without a database round trip.
	const valid = /^[a-z2-7]{40}$/.test(sessionId) ? await lucia.validateSession(sessionId) : null;
	if (!valid?.session) {
		sessionCookieClear(event);
		const blank = lucia.createBlankSessionCookie();
		return event.cookies.serialize(blank.name, blank.value, { ...blank.attributes, path: '/', secure: cookieSecure(event.url) });
	}
	const { session, user } = valid;
	event.locals.session = { id: session.id, expiresAt: session.expiresAt };
	event.locals.user = { id: user.id, email: user.email, name: user.name };
	event.locals.roles = { userId: user.id, byStudio: user.roles };
	if (session.fresh) {
		sessionCookieSet(event, session.id);
		const c = lucia.createSessionCookie(session.id);
		return event.cookies.serialize(c.name, c.value, { ...c.attributes, path: '/', secure: cookieSecure(event.url) });
	}
	return undefined;
}

export const handleSession: Handle = async ({ event, resolve }) => {
	const cookieChange = await sessionLoad(event);
	const response = await resolve(event);
	if (!cookieChange) return response;
	const sent = response.headers.getSetCookie().some((c) => c.startsWith(`${lucia.sessionCookieName}=`));
	if (sent) return response;
	const out = mutable(response);
	out.headers.append('set-cookie', cookieChange);
	return out;
};
