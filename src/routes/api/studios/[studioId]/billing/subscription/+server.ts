import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { BILLING_INTERVALS, STUDIO_MAX_SEATS } from '$lib/billing/plans';
import { apiRoute, readPatch } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { subscriptionChange } from '$lib/server/billing/sessions';
import { db } from '$lib/server/db';
import type { RequestHandler } from './$types';

const changeSchema = z.object({
	seats: z.number().int().min(1).max(STUDIO_MAX_SEATS).optional(),
	interval: z.enum(BILLING_INTERVALS).optional(),
	cancelAtPeriodEnd: z.boolean().optional()
});

/**
 * Seats, monthly or yearly, cancel at period end: asked of the provider. Answers 202: the plan shown
 * changes once the provider's webhook has been handled (GET …/billing shows it).
 */
export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const body = await readPatch(event.request, changeSchema);
	const r = await subscriptionChange(db(), { studioId, ...body });
	return json({ subscription: { id: r.subscriptionId, pending: true } }, { status: 202 });
});
