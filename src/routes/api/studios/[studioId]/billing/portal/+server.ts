import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, readJson } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { portalStart } from '$lib/server/billing/sessions';
import { db } from '$lib/server/db';
import type { RequestHandler } from './$types';

const portalSchema = z.object({ flow: z.enum(['manage', 'payment_method_update', 'subscription_cancel']) });

/** The provider's customer-management page (card, cancelling), for the owner to go to. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const body = await readJson(event.request, portalSchema);
	const r = await portalStart(db(), { studioId, flow: body.flow, origin: event.url.origin });
	return json({ portal: { url: r.url } }, { status: 201 });
});
