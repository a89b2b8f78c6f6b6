import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { sizeSetsOfStyleShown } from '$lib/server/size-sets/list';
import { uuidSchema } from '$lib/server/validation';
import { styleOr404 } from '$lib/server/versions/access';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The style's size sets, newest first, each with its sizes and their sign-off (the sample room: signed-off sizes only). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	return json({ sizeSets: await sizeSetsOfStyleShown(db(), studioId, styleId, role) });
});
