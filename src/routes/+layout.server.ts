import { db } from '$lib/server/db';
import { membershipsForUser } from '$lib/server/repositories/memberships';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals }) => {
	const user = locals.user;
	return {
		user,
		memberships: user ? await membershipsForUser(db(), user.id) : []
	};
};
