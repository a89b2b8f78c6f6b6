import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { DRAFT_READERS, requireRole, SIZE_RUNNERS } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { sizeRunsById } from '$lib/server/repositories/size-runs';
import { sizeRunCancel, sizeRunView } from '$lib/server/size-runs/service';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeRunId: uuidSchema });

async function runOr404(studioId: string, sizeRunId: string) {
	const run = await sizeRunsById(db(), studioId, sizeRunId);
	if (!run) throw new ApiError(404, 'not_found', 'No such size run in this studio.');
	return run;
}

/** The run: status, progress (steps done of steps total) and what each size gave. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, DRAFT_READERS);
	const { sizeRunId } = parseParams(event.params, params);
	return json({ sizeRun: sizeRunView(await runOr404(studioId, sizeRunId)) });
});

/** Cancels a queued or running run; the sizes already made are kept. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, SIZE_RUNNERS);
	const { sizeRunId } = parseParams(event.params, params);
	await sizeRunCancel(db(), studioId, await runOr404(studioId, sizeRunId));
	return json({ sizeRun: sizeRunView(await runOr404(studioId, sizeRunId)) });
});
