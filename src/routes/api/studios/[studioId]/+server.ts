import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, readPatch } from '$lib/server/api';
import { ALL_ROLES, OWNER, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { studiosById, studiosRename } from '$lib/server/repositories/studios';
import { studioNameSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const studio = await studiosById(db(), studioId);
	if (!studio) throw new ApiError(404, 'not_found', 'No such studio.');
	return json({ studio: { ...studio, role } });
});

const patchSchema = z.object({ name: studioNameSchema });

export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, OWNER);
	const body = await readPatch(event.request, patchSchema);
	const studio = await studiosRename(db(), studioId, body.name);
	if (!studio) throw new ApiError(404, 'not_found', 'No such studio.');
	return json({ studio: { ...studio, role } });
});
