import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { uuidSchema } from '$lib/server/validation';
import { pieceOr404, versionOr404 } from '$lib/server/versions/access';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema, versionId: uuidSchema });

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId, versionId } = parseParams(event.params, params);
	await pieceOr404(db(), studioId, pieceId);
	return json({ version: await versionOr404(db(), pieceId, versionId, role) });
});
