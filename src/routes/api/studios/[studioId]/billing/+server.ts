import { json } from '@sveltejs/kit';
import { apiRoute } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { billingSummary } from '$lib/server/billing/summary';
import { db } from '$lib/server/db';
import type { RequestHandler } from './$types';

/** The studio's plan, seats, subscription and invoices: for its owners only. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const invoices = event.url.searchParams.get('invoices') !== 'no';
	return json(await billingSummary(db(), studioId, { invoices }));
});
