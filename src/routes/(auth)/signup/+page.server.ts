import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { signUp } from '$lib/server/auth/accounts';
import { sessionStart } from '$lib/server/auth/lucia';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { rateLimitTake } from '$lib/server/rate-limits';
import {
	emailSchema,
	fieldErrors,
	formObject,
	passwordSchema,
	personNameSchema,
	studioNameSchema
} from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

const schema = z.object({
	name: personNameSchema,
	email: emailSchema,
	password: passwordSchema,
	studioName: studioNameSchema
});

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'public');
	return {};
};

export const actions: Actions = {
	default: async (event) => {
		await requireRole(event, 'public');
		const raw = formObject(await event.request.formData());
		const values = { name: raw.name ?? '', email: raw.email ?? '', studioName: raw.studioName ?? '' };
		const parsed = schema.safeParse(raw);
		if (!parsed.success) return fail(400, { values, errors: fieldErrors(parsed.error), message: null });
		const limited = await rateLimitTake('signup_address', event.getClientAddress());
		if (limited) {
			event.setHeaders({ 'retry-after': String(limited.retryAfterSeconds) });
			return fail(429, { values, errors: {}, message: limited.message });
		}
		const r = await signUp(db(), parsed.data);
		if (!r.ok) return fail(409, { values, errors: { email: [r.message] }, message: null });
		await sessionStart(event, r.value.user.id);
		redirect(303, `/studios/${r.value.studioId}`);
	}
};
