import { json } from '@sveltejs/kit';
import { apiRoute, readJson } from '$lib/server/api';
import { ALL_ROLES, EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetCreate, measurementSetCreateSchema, measurementSetsList } from '$lib/server/measurements';
import type { RequestHandler } from './$types';

/** The studio's measurement sets: its read-only charts (seeded on first use) and its own sets. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	return json({ measurementSets: await measurementSetsList(db(), studioId) });
});

/** A client (or custom) set: 400 field errors for what is not a length, 422 for implausible values. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const body = await readJson(event.request, measurementSetCreateSchema);
	const measurementSet = await measurementSetCreate(db(), studioId, user.id, body);
	return json({ measurementSet }, { status: 201 });
});
