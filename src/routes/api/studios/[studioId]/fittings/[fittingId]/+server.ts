import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, FITTERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fittingDelete, fittingDetail } from '$lib/server/fittings/fittings';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), fittingId: uuidSchema });

/** The fitting with its versions, photos (short-lived links) and fit notes. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const { fittingId } = parseParams(event.params, params);
	return json({ fitting: await fittingDetail(db(), studioId, fittingId) });
});

/** Deletes the fitting with its notes and its photos (their objects leave the store too). */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, FITTERS);
	const { fittingId } = parseParams(event.params, params);
	await fittingDelete(db(), studioId, fittingId);
	return new Response(null, { status: 204 });
});
