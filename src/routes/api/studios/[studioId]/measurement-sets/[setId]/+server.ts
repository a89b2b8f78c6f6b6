import { json } from '@sveltejs/kit';
import { apiRoute, readPatch } from '$lib/server/api';
import { ALL_ROLES, EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetDelete, measurementSetOr404, measurementSetPatch, measurementSetPatchSchema, setView } from '$lib/server/measurements';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	return json({ measurementSet: setView(await measurementSetOr404(db(), studioId, event.params.setId)) });
});

/** Charts are read-only (409). */
export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const body = await readPatch(event.request, measurementSetPatchSchema, { flags: ['acceptWarnings'] });
	return json({ measurementSet: await measurementSetPatch(db(), studioId, event.params.setId, body) });
});

/** Charts are read-only (409). Styles drafted from the set keep their pieces; they lose the link. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	await measurementSetDelete(db(), studioId, event.params.setId);
	return new Response(null, { status: 204 });
});
