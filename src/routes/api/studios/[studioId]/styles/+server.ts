import { json } from '@sveltejs/kit';
import { apiRoute, readJson } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { planLimitReserve } from '$lib/server/billing/plan';
import { db } from '$lib/server/db';
import { stylesCreate, stylesOfStudio } from '$lib/server/repositories/styles';
import { EDITORS } from '$lib/server/versions/access';
import { styleCreateSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	return json({ styles: await stylesOfStudio(db(), studioId) });
});

export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const body = await readJson(event.request, styleCreateSchema);
	// counted and inserted under the studio's lock: two requests cannot both take the last style
	const style = await db()
		.transaction()
		.execute(async (tx) => {
			await planLimitReserve(tx, studioId, 'styles');
			return stylesCreate(tx, { ...body, studioId, createdBy: user.id });
		});
	return json({ style }, { status: 201 });
});
