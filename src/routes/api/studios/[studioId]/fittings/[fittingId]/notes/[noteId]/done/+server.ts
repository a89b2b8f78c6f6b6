import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { NOTE_RESOLVERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fitNoteDone } from '$lib/server/fittings/notes';
import { fitNoteDoneSchema } from '$lib/server/fittings/schemas';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), fittingId: uuidSchema, noteId: uuidSchema });

/** Marks the note done, resolved by a later version of its piece (pattern cutter, owner). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, NOTE_RESOLVERS);
	const { fittingId, noteId } = parseParams(event.params, params);
	const body = await readJson(event.request, fitNoteDoneSchema);
	return json({ note: await fitNoteDone(db(), { studioId, fittingId, noteId, versionId: body.versionId }) });
});
