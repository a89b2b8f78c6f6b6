import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { uuidSchema } from '$lib/server/validation';
import { EDITORS } from '$lib/server/versions/access';
import { pieceCreateWithFirstVersion } from '$lib/server/versions/piece-create';
import { pieceCreateSchema, VERSION_BODY_LIMIT_BYTES } from '$lib/server/versions/schemas';
import { saveRefusal } from '$lib/server/versions/save-response';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const { styleId } = parseParams(event.params, params);
	const body = await readJson(event.request, pieceCreateSchema, VERSION_BODY_LIMIT_BYTES);
	const r = await pieceCreateWithFirstVersion(db(), { studioId, styleId, authorId: user.id, ...body });
	if (!r.ok) throw saveRefusal(r);
	return json({ piece: r.piece, version: r.version, checks: r.checks }, { status: 201 });
});
