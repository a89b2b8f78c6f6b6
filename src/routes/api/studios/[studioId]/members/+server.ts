import { json } from '@sveltejs/kit';
import { apiRoute } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { membershipsOfStudio } from '$lib/server/repositories/memberships';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const members = await membershipsOfStudio(db(), studioId);
	return json({ members: members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() })) });
});
