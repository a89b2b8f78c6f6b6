import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fitNoteJson } from '$lib/server/fittings/view';
import { fitNotesOfPieces } from '$lib/server/repositories/fit-notes';
import { uuidSchema } from '$lib/server/validation';
import { pieceOr404, versionOr404 } from '$lib/server/versions/access';
import { fitNoteShowsOn } from '$lib/fittings/notes';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema });
const query = z.object({ versionId: uuidSchema.optional() });

/** The fit notes pinned on the piece; with ?versionId= only those that show on that version. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId } = parseParams(event.params, params);
	const q = parseParams(Object.fromEntries(event.url.searchParams), query);
	await pieceOr404(db(), studioId, pieceId);
	let notes = await fitNotesOfPieces(db(), [pieceId]);
	if (q.versionId) {
		const v = await versionOr404(db(), pieceId, q.versionId, role);
		notes = notes.filter((n) => fitNoteShowsOn(n, pieceId, v.number));
	}
	return json({ notes: notes.map(fitNoteJson) });
});
