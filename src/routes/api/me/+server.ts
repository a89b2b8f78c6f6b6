import { json } from '@sveltejs/kit';
import { apiRoute } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { membershipsForUser } from '$lib/server/repositories/memberships';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	return json({ user, memberships: await membershipsForUser(db(), user.id) });
});
