import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { FITTERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { photoDelete } from '$lib/server/fittings/fittings';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), fittingId: uuidSchema, photoId: uuidSchema });

/** Deletes the photo and its objects (display size and thumbnail) from the store. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, FITTERS);
	const { fittingId, photoId } = parseParams(event.params, params);
	await photoDelete(db(), studioId, fittingId, photoId);
	return new Response(null, { status: 204 });
});
