import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readPatch } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { memberRemove, memberRoleChange, type MemberChange } from '$lib/server/studios';
import { roleSchema, uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const paramsSchema = z.object({ studioId: z.string(), userId: uuidSchema });
const patchSchema = z.object({ role: roleSchema });

function refused(r: Extract<MemberChange, { ok: false }>): ApiError {
	return r.reason === 'last_owner'
		? new ApiError(409, 'last_owner', r.message)
		: new ApiError(404, 'not_member', r.message);
}

export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const { userId } = parseParams(event.params, paramsSchema);
	const body = await readPatch(event.request, patchSchema);
	const r = await memberRoleChange(db(), { studioId, userId, role: body.role });
	if (!r.ok) throw refused(r);
	return json({ member: { userId, role: body.role } });
});

export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const { userId } = parseParams(event.params, paramsSchema);
	const r = await memberRemove(db(), { studioId, userId });
	if (!r.ok) throw refused(r);
	return new Response(null, { status: 204 });
});
