import { redirect } from '@sveltejs/kit';
import { sessionEnd } from '$lib/server/auth/lucia';
import { requireRole } from '$lib/server/authz';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'public');
	return {};
};

export const actions: Actions = {
	default: async (event) => {
		await requireRole(event, 'public');
		await sessionEnd(event);
		redirect(303, '/');
	}
};
