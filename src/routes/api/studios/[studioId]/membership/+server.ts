import { apiRoute } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { memberLeave } from '$lib/server/studios';
import type { RequestHandler } from './$types';

/** The signed-in member leaves the studio (204); its last owner cannot (409 `last_owner`). */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, ALL_ROLES);
	const r = await memberLeave(db(), { studioId, userId: user.id });
	if (!r.ok) throw new ApiError(r.reason === 'last_owner' ? 409 : 404, r.reason === 'last_owner' ? 'last_owner' : 'not_found', r.message);
	return new Response(null, { status: 204 });
});
