import { json } from '@sveltejs/kit';
import { apiRoute, readJson } from '$lib/server/api';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetDuplicate, measurementSetDuplicateSchema } from '$lib/server/measurements';
import type { RequestHandler } from './$types';

/** An editable copy (a chart becomes a custom set naming the chart). Body optional: { name }. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const hasBody = (event.request.headers.get('content-length') ?? '0') !== '0' || event.request.headers.has('content-type');
	const body = hasBody ? await readJson(event.request, measurementSetDuplicateSchema) : {};
	const measurementSet = await measurementSetDuplicate(db(), studioId, event.params.setId, user.id, body.name);
	return json({ measurementSet }, { status: 201 });
});
