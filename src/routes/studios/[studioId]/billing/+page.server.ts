import { OWNER, requireRole } from '$lib/server/authz';
import { billingSummary } from '$lib/server/billing/summary';
import { db } from '$lib/server/db';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	return { billing: await billingSummary(db(), studioId) };
};
