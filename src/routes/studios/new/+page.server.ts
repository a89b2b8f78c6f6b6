import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { studioCreateOwned } from '$lib/server/studios';
import { fieldErrors, formObject, studioNameSchema } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

const schema = z.object({ name: studioNameSchema });

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'signed_in');
	return {};
};

export const actions: Actions = {
	default: async (event) => {
		const { user } = await requireRole(event, 'signed_in');
		const raw = formObject(await event.request.formData());
		const parsed = schema.safeParse(raw);
		if (!parsed.success) return fail(400, { name: raw.name ?? '', errors: fieldErrors(parsed.error) });
		const studio = await studioCreateOwned(db(), parsed.data.name, user.id);
		redirect(303, `/studios/${studio.id}`);
	}
};
