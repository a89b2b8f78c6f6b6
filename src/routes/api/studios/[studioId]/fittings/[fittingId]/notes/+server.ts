import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { NOTE_WRITERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fitNoteCreate } from '$lib/server/fittings/notes';
import { fitNoteCreateSchema } from '$lib/server/fittings/schemas';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), fittingId: uuidSchema });

/** Pins a fit note on a point of a piece version of the fitting's style. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user, role } = await requireRole(event, NOTE_WRITERS);
	const { fittingId } = parseParams(event.params, params);
	const body = await readJson(event.request, fitNoteCreateSchema);
	const note = await fitNoteCreate(db(), { studioId, fittingId, user, role, origin: event.url.origin, body });
	return json({ note }, { status: 201 });
});
