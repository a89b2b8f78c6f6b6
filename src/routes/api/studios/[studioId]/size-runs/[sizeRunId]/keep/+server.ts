import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { requireRole, SIZE_RUNNERS } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { sizeRunsById } from '$lib/server/repositories/size-runs';
import { sizeSetKeep } from '$lib/server/size-sets/keep';
import { sizeSetKeepSchema } from '$lib/server/size-sets/schemas';
import { sizeSetOr404 } from '$lib/server/size-sets/sign-off';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeRunId: uuidSchema });

/** Keeps a done run as a size set of its style (each size's pieces made again and stored): 201 { sizeSet }. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user, role } = await requireRole(event, SIZE_RUNNERS);
	const { sizeRunId } = parseParams(event.params, params);
	const body = await readJson(event.request, sizeSetKeepSchema);
	const run = await sizeRunsById(db(), studioId, sizeRunId);
	if (!run) throw new ApiError(404, 'not_found', 'No such size run in this studio.');
	const id = await sizeSetKeep(db(), { studioId, run, userId: user.id, body });
	const { view } = await sizeSetOr404(db(), studioId, id, role);
	return json({ sizeSet: view }, { status: 201 });
});
