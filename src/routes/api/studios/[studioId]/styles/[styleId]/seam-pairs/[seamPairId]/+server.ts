import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readPatch } from '$lib/server/api';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { seamPairsDelete, seamPairsInStyle, seamPairsUpdate } from '$lib/server/repositories/seam-pairs';
import { uuidSchema } from '$lib/server/validation';
import { styleOr404 } from '$lib/server/versions/access';
import { seamPairPatchSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema, seamPairId: uuidSchema });

/** Move a seam pair's edge ends (after a seam is trued) or change its ease and tolerance. */
export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const { styleId, seamPairId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	if (!(await seamPairsInStyle(db(), styleId, seamPairId))) throw new ApiError(404, 'not_found', 'No such seam pair in this style.');
	const body = await readPatch(event.request, seamPairPatchSchema);
	const pair = await seamPairsUpdate(db(), seamPairId, {
		label: body.label,
		aEdge: body.a,
		bEdge: body.b,
		allowedEaseMm: body.allowedEaseMm,
		toleranceMm: body.toleranceMm
	});
	return json({ seamPair: pair });
});

/** Unpair two seams: the pair is removed; its pieces and their versions stay as they are. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const { styleId, seamPairId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	if (!(await seamPairsDelete(db(), styleId, seamPairId))) throw new ApiError(404, 'not_found', 'No such seam pair in this style.');
	return new Response(null, { status: 204 });
});
