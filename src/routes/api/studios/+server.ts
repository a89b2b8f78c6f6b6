import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, readJson } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { membershipsForUser } from '$lib/server/repositories/memberships';
import { studioCreateOwned } from '$lib/server/studios';
import { studioNameSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	const rows = await membershipsForUser(db(), user.id);
	return json({ studios: rows.map((m) => ({ id: m.studioId, name: m.studioName, role: m.role })) });
});

const createSchema = z.object({ name: studioNameSchema });

export const POST: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	const body = await readJson(event.request, createSchema);
	const studio = await studioCreateOwned(db(), body.name, user.id);
	return json({ studio: { ...studio, role: 'owner' } }, { status: 201 });
});
