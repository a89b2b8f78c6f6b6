import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { signInCheck } from '$lib/server/auth/accounts';
import { sessionStart } from '$lib/server/auth/lucia';
import { homePath, safeNext } from '$lib/server/auth/redirects';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fieldErrors, formObject } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

const schema = z.object({
	email: z.string().trim().min(1, 'Enter your e-mail address.').max(254),
	password: z.string().min(1, 'Enter your password.').max(256),
	next: z.string().optional()
});

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'public');
	return { next: safeNext(event.url.searchParams.get('next')) };
};

export const actions: Actions = {
	default: async (event) => {
		await requireRole(event, 'public');
		const raw = formObject(await event.request.formData());
		const values = { email: raw.email ?? '', next: raw.next ?? '' };
		const parsed = schema.safeParse(raw);
		if (!parsed.success) return fail(400, { values, errors: fieldErrors(parsed.error), message: null });
		const r = await signInCheck(db(), {
			email: parsed.data.email,
			password: parsed.data.password,
			address: event.getClientAddress()
		});
		if (!r.ok) {
			if (r.retryAfterSeconds) event.setHeaders({ 'retry-after': String(r.retryAfterSeconds) });
			return fail(r.reason === 'throttled' ? 429 : 400, { values, errors: {}, message: r.message });
		}
		await sessionStart(event, r.value.id);
		redirect(303, safeNext(parsed.data.next) ?? (await homePath(r.value.id)));
	}
};
