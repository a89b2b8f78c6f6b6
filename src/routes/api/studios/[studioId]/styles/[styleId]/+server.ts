import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readPatch } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { stylesUpdate } from '$lib/server/repositories/styles';
import { uuidSchema } from '$lib/server/validation';
import { EDITORS, styleOr404 } from '$lib/server/versions/access';
import { styleOverviewJsonBytes } from '$lib/server/versions/overview';
import { stylePatchSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	return new Response(await styleOverviewJsonBytes(db(), studioId, styleId, role), { headers: { 'content-type': 'application/json' } });
});

export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const { styleId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	const patch = await readPatch(event.request, stylePatchSchema);
	return json({ style: await stylesUpdate(db(), styleId, patch) });
});
