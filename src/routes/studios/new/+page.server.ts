import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
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
		let studio;
		try {
			studio = await studioCreateOwned(db(), parsed.data.name, user.id);
		} catch (e) {
			if (e instanceof ApiError && e.status === 402) return fail(402, { name: parsed.data.name, errors: { name: [e.message] } });
			throw e;
		}
		redirect(303, `/studios/${studio.id}`);
	}
};
