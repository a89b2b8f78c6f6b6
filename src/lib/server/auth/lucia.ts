import type { Cookies } from '@sveltejs/kit';
import { Lucia, TimeSpan } from 'lucia';
import { db } from '../db';
import type { Role } from '../db/schema';
import { KyselySessionAdapter } from './adapter';

export const lucia = new Lucia(new KyselySessionAdapter(db), {
	sessionExpiresIn: new TimeSpan(30, 'd'),
	sessionCookie: {
		name: 'dartelier_session',
		attributes: { sameSite: 'lax', secure: true }
	},
	getUserAttributes: (a) => ({ email: a.email, name: a.name, roles: a.roles })
});

declare module 'lucia' {
	interface Register {
		Lucia: typeof lucia;
		UserId: string;
		/** `roles`: the user's role in each of their studios (studio id → role), read with the session */
		DatabaseUserAttributes: { email: string; name: string; roles: Record<string, Role> };
	}
}

const LOOPBACK = new Set(['localhost', '127.0.0.1', '[::1]']);

/** `Secure` everywhere except plain-http loopback (a browser would drop a Secure cookie there). */
export function cookieSecure(url: URL): boolean {
	return !(url.protocol === 'http:' && LOOPBACK.has(url.hostname));
}

function cookieWrite(cookies: Cookies, url: URL, cookie: ReturnType<typeof lucia.createSessionCookie>) {
	cookies.set(cookie.name, cookie.value, {
		...cookie.attributes,
		path: '/',
		httpOnly: true,
		sameSite: 'lax',
		secure: cookieSecure(url)
	});
}

export function sessionCookieSet(event: { cookies: Cookies; url: URL }, sessionId: string): void {
	cookieWrite(event.cookies, event.url, lucia.createSessionCookie(sessionId));
}

export function sessionCookieClear(event: { cookies: Cookies; url: URL }): void {
	cookieWrite(event.cookies, event.url, lucia.createBlankSessionCookie());
}

/**
 * Starts a fresh session (a new random id every time) and sets its cookie. Any session the request
 * came with is ended first, so a sign-in never keeps a token that existed before it.
 */
export async function sessionStart(
	event: { cookies: Cookies; url: URL; locals: App.Locals },
	userId: string
): Promise<void> {
	if (event.locals.session) await lucia.invalidateSession(event.locals.session.id);
	const session = await lucia.createSession(userId, {});
	sessionCookieSet(event, session.id);
	event.locals.session = { id: session.id, expiresAt: session.expiresAt };
}

export async function sessionEnd(event: { cookies: Cookies; url: URL; locals: App.Locals }): Promise<void> {
	if (event.locals.session) await lucia.invalidateSession(event.locals.session.id);
	sessionCookieClear(event);
	event.locals.session = null;
	event.locals.user = null;
}
