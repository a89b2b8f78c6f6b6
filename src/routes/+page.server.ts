import { redirect } from '@sveltejs/kit';
import { landingExample } from '$lib/pattern/fixtures/landing-example';
import type { PageServerLoad } from './$types';

/** Signed-in visitors go straight to their first studio; others see the landing page and its example. */
export const load: PageServerLoad = async ({ parent }) => {
	const { user, memberships } = await parent();
	if (user && memberships.length > 0) redirect(303, `/studios/${memberships[0].studioId}`);
	const { piece, ledger, balanceRad } = landingExample();
	return { example: { piece, ledger, balanceRad } };
};
