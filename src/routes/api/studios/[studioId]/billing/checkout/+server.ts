import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { BILLING_INTERVALS, STUDIO_MAX_SEATS } from '$lib/billing/plans';
import { apiRoute, readJson } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { checkoutStart } from '$lib/server/billing/sessions';
import { db } from '$lib/server/db';
import type { RequestHandler } from './$types';

const checkoutSchema = z.object({
	seats: z.number().int().min(1).max(STUDIO_MAX_SEATS),
	interval: z.enum(BILLING_INTERVALS)
});

/** Starts paying for the Studio plan: answers the provider's checkout page to send the owner to. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, OWNER);
	const body = await readJson(event.request, checkoutSchema);
	const r = await checkoutStart(db(), { studioId, ...body, owner: user, origin: event.url.origin });
	return json({ checkout: { url: r.url } }, { status: 201 });
});
