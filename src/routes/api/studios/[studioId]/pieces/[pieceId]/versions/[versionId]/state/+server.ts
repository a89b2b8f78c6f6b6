import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { uuidSchema } from '$lib/server/validation';
import { EDITORS, SIGNERS } from '$lib/server/versions/access';
import { versionStateChange } from '$lib/server/versions/state';
import { versionStateSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema, versionId: uuidSchema });

/** Propose a draft (pattern cutter, owner) or sign a version off (designer, owner). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const body = await readJson(event.request, versionStateSchema);
	const { studioId, user, role } = await requireRole(event, body.state === 'signed_off' ? SIGNERS : EDITORS);
	const { pieceId, versionId } = parseParams(event.params, params);
	const r = await versionStateChange(db(), { studioId, pieceId, versionId, state: body.state, userId: user.id, role });
	if (!r.ok) throw new ApiError(r.status, r.code, r.message);
	return json({ version: r.version });
});
