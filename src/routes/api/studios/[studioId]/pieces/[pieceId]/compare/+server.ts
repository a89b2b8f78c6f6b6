import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { uuidSchema } from '$lib/server/validation';
import { versionsComparison } from '$lib/server/versions/compare';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema });
const query = z.object({ a: uuidSchema, b: uuidSchema, bPiece: uuidSchema.optional() });

/** Two versions side by side: ?a=<version>&b=<version>[&bPiece=<other piece>]. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId } = parseParams(event.params, params);
	const q = parseParams(Object.fromEntries(event.url.searchParams), query);
	return json(await versionsComparison(db(), studioId, role, { pieceId, versionId: q.a }, { pieceId: q.bPiece ?? pieceId, versionId: q.b }));
});
