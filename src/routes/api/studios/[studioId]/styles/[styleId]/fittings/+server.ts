import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { ALL_ROLES, FITTERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fittingCreate } from '$lib/server/fittings/fittings';
import { fittingCreateSchema } from '$lib/server/fittings/schemas';
import { fittingJson } from '$lib/server/fittings/view';
import { fittingsOfStyle } from '$lib/server/repositories/fittings';
import { uuidSchema } from '$lib/server/validation';
import { styleOr404 } from '$lib/server/versions/access';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The style's fittings, newest first, with their photo and note counts. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	await styleOr404(db(), studioId, styleId);
	const rows = await fittingsOfStyle(db(), styleId);
	return json({
		fittings: rows.map((f) => ({ ...fittingJson(f), photoCount: Number(f.photoCount), noteCount: Number(f.noteCount), openNoteCount: Number(f.openNoteCount) }))
	});
});

/** Records a fitting of the style's toile (the sample room, the owner). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user, role } = await requireRole(event, FITTERS);
	const { styleId } = parseParams(event.params, params);
	const body = await readJson(event.request, fittingCreateSchema);
	const fitting = await fittingCreate(db(), { studioId, styleId, userId: user.id, role, body });
	return json({ fitting }, { status: 201 });
});
