import { json } from '@sveltejs/kit';
import { apiRoute, readPatch } from '$lib/server/api';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetDuplicate, measurementSetDuplicateSchema } from '$lib/server/measurements';
import type { RequestHandler } from './$types';

/**
 * An editable copy (a chart becomes a custom set naming the chart). No body: the copy is named
 * "… (copy)"; a body, when sent, is an object that names the copy ({ name }), else 400.
 */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const hasBody = (event.request.headers.get('content-length') ?? '0') !== '0' || event.request.headers.has('content-type');
	const body = hasBody
		? await readPatch(event.request, measurementSetDuplicateSchema, {
				nothingMessage: () => 'Send { "name": … } to name the copy, or no body at all for the usual name.'
			})
		: {};
	const measurementSet = await measurementSetDuplicate(db(), studioId, event.params.setId, user.id, body.name);
	return json({ measurementSet }, { status: 201 });
});
