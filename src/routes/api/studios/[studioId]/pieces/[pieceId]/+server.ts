import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { uuidSchema } from '$lib/server/validation';
import { pieceOverview } from '$lib/server/versions/overview';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema });

/** The piece, its versions (newest first) and its head version with geometry. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId } = parseParams(event.params, params);
	return json(await pieceOverview(db(), studioId, pieceId, role));
});
