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

/**
 * The review of a version: propose or withdraw (pattern cutter, owner), sign off or send back
 * (designer, owner). See versionStateChange for the rules.
 */
export const POST: RequestHandler = apiRoute(async (event) => {
	const body = await readJson(event.request, versionStateSchema);
	const signer = body.action === 'sign_off' || body.action === 'send_back';
	const { studioId, user, role } = await requireRole(event, signer ? SIGNERS : EDITORS);
	const { pieceId, versionId } = parseParams(event.params, params);
	const r = await versionStateChange(db(), { studioId, pieceId, versionId, action: body, user, role, origin: event.url.origin });
	if (!r.ok) throw new ApiError(r.status, r.code, r.message, r.fields);
	return json({ version: r.version });
});
