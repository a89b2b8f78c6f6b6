import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

/** Signed-in visitors go straight to their first studio; others see the landing page. */
export const load: PageServerLoad = async ({ parent }) => {
	const { user, memberships } = await parent();
	if (user && memberships.length > 0) redirect(303, `/studios/${memberships[0].studioId}`);
	return {};
};
