import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { sizeSetOr404 } from '$lib/server/size-sets/sign-off';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeSetId: uuidSchema });

/** The size set: each size with its sign-off, checks and pieces (linked to the base piece and version). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { sizeSetId } = parseParams(event.params, params);
	return json({ sizeSet: (await sizeSetOr404(db(), studioId, sizeSetId, role)).view });
});
