import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { DRAFT_READERS, requireRole, SIZE_RUNNERS } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { sizeRunsOfStyle } from '$lib/server/repositories/size-runs';
import { sizeRunStart, sizeRunStartSchema, sizeRunView } from '$lib/server/size-runs/service';
import { uuidSchema } from '$lib/server/validation';
import { styleOr404 } from '$lib/server/versions/access';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The style's size runs, newest first. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, DRAFT_READERS);
	const { styleId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	return json({ sizeRuns: (await sizeRunsOfStyle(db(), studioId, styleId)).map(sizeRunView) });
});

/** Starts a size run over the given measurement sets: 202, the worker makes the sizes. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, SIZE_RUNNERS);
	const { styleId } = parseParams(event.params, params);
	const body = await readJson(event.request, sizeRunStartSchema);
	const run = await sizeRunStart(db(), { studioId, styleId, userId: user.id, body });
	return json({ sizeRun: { id: run.id, status: run.status } }, { status: 202 });
});
