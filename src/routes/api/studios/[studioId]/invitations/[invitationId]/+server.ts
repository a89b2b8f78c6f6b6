import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { invitationWithdraw } from '$lib/server/studios';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const paramsSchema = z.object({ studioId: z.string(), invitationId: uuidSchema });

/** Withdraws an open invitation (204): its link no longer works and its seat is free. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const { invitationId } = parseParams(event.params, paramsSchema);
	const r = await invitationWithdraw(db(), { studioId, invitationId });
	if (!r.ok) throw new ApiError(r.reason === 'used' ? 409 : 404, r.reason === 'used' ? 'invitation_used' : 'not_found', r.message);
	return new Response(null, { status: 204 });
});
