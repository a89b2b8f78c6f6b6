import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { seamPairsCreate, seamPairsOfStyle } from '$lib/server/repositories/seam-pairs';
import { uuidSchema } from '$lib/server/validation';
import { EDITORS, pieceOr404, styleOr404 } from '$lib/server/versions/access';
import { ApiError } from '$lib/server/http-errors';
import { seamPairCreateSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	return json({ seamPairs: await seamPairsOfStyle(db(), styleId) });
});

export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const { styleId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	const body = await readJson(event.request, seamPairCreateSchema);
	for (const side of [body.a, body.b]) {
		const piece = await pieceOr404(db(), studioId, side.pieceId);
		if (piece.styleId !== styleId) throw new ApiError(422, 'other_style', 'Both edges of a seam pair must belong to pieces of this style.');
	}
	const pair = await seamPairsCreate(db(), {
		styleId,
		label: body.label,
		aPieceId: body.a.pieceId,
		aEdge: { from: body.a.from, to: body.a.to },
		bPieceId: body.b.pieceId,
		bEdge: { from: body.b.from, to: body.b.to },
		allowedEaseMm: body.allowedEaseMm,
		toleranceMm: body.toleranceMm
	});
	return json({ seamPair: pair }, { status: 201 });
});
