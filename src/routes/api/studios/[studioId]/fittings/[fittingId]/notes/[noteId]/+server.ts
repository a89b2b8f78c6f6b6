import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readPatch } from '$lib/server/api';
import { NOTE_WRITERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fitNotePatch } from '$lib/server/fittings/notes';
import { fitNotePatchSchema } from '$lib/server/fittings/schemas';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), fittingId: uuidSchema, noteId: uuidSchema });

/** Open ↔ in hand, assign (the assignee gets an e-mail), reword. Marking done is POST …/done. */
export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, NOTE_WRITERS);
	const { fittingId, noteId } = parseParams(event.params, params);
	const body = await readPatch(event.request, fitNotePatchSchema);
	const note = await fitNotePatch(db(), { studioId, fittingId, noteId, user, origin: event.url.origin, body });
	return json({ note });
});
