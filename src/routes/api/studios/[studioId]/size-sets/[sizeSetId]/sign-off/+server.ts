import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { requireRole, SIZE_SET_SIGNERS } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { sizeSetSignOffSchema } from '$lib/server/size-sets/schemas';
import { sizeSetOr404, sizeSetSignOff } from '$lib/server/size-sets/sign-off';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeSetId: uuidSchema });

/** Signs sizes off ({ sizes: [ids] | 'all', comment?, acknowledgeChecks? }): who and when are recorded. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user, role } = await requireRole(event, SIZE_SET_SIGNERS);
	const { sizeSetId } = parseParams(event.params, params);
	const body = await readJson(event.request, sizeSetSignOffSchema);
	const { set } = await sizeSetOr404(db(), studioId, sizeSetId, role);
	const signed = await sizeSetSignOff(db(), { set, userId: user.id, body });
	return json({ signed, sizeSet: (await sizeSetOr404(db(), studioId, sizeSetId, role)).view });
});
