import { json } from '@sveltejs/kit';
import { apiRoute, readJson } from '$lib/server/api';
import { accountDelete } from '$lib/server/auth/account-delete';
import { sessionCookieClear } from '$lib/server/auth/lucia';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { membershipsForUser } from '$lib/server/repositories/memberships';
import { accountDeleteSchema, accountDeleteStatus } from '$lib/server/validation-account';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	return json({ user, memberships: await membershipsForUser(db(), user.id) });
});

/**
 * Deletes the signed-in person's account (204), confirmed by their e-mail address and password. Their
 * work stays with the studios, shown as by "former member"; every session ends; the address is freed.
 */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	const body = await readJson(event.request, accountDeleteSchema(user.email));
	const r = await accountDelete(db(), { userId: user.id, email: user.email, password: body.password, address: event.getClientAddress() });
	if (!r.ok) {
		const headers = r.retryAfterSeconds ? { 'retry-after': String(r.retryAfterSeconds) } : undefined;
		throw new ApiError(accountDeleteStatus[r.reason], r.reason === 'throttled' ? 'rate_limited' : r.reason, r.message, undefined, headers);
	}
	sessionCookieClear(event);
	return new Response(null, { status: 204 });
});
