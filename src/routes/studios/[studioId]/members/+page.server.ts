import { ALL_ROLES, requireRole } from '$lib/server/authz';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { user } = await requireRole(event, ALL_ROLES);
	return { meId: user.id };
};
