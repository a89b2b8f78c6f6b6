import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { OWNER, requireRole } from '$lib/server/authz';
import { billingSummary } from '$lib/server/billing/summary';
import { db } from '$lib/server/db';
import type { RequestHandler } from './$types';

/** `?invoices=no` leaves the invoices out (the page's polling while a change is handled). */
const query = z.object({ invoices: z.enum(['yes', 'no']).default('yes') });

/** The studio's plan, seats, subscription and invoices: for its owners only. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const q = parseParams(Object.fromEntries(event.url.searchParams), query);
	return json(await billingSummary(db(), studioId, { invoices: q.invoices === 'yes' }));
});
