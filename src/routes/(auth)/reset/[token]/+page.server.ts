import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { passwordResetComplete, passwordResetPeek } from '$lib/server/auth/accounts';
import { sessionStart } from '$lib/server/auth/lucia';
import { homePath } from '$lib/server/auth/redirects';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fieldErrors, formObject, passwordSchema } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

const SPENT = 'This link does not work any more: it was used already or it has expired. Ask for a new one.';
const schema = z
	.object({ password: passwordSchema, confirm: z.string() })
	.refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'public');
	const reset = await passwordResetPeek(db(), event.params.token);
	if (!reset) error(404, { message: SPENT, code: 'link_spent' });
	return { email: reset.email };
};

export const actions: Actions = {
	default: async (event) => {
		await requireRole(event, 'public');
		const parsed = schema.safeParse(formObject(await event.request.formData()));
		if (!parsed.success) return fail(400, { errors: fieldErrors(parsed.error), message: null });
		const r = await passwordResetComplete(db(), { token: event.params.token, password: parsed.data.password });
		if (!r.ok) return fail(410, { errors: {}, message: SPENT });
		// Every session of the user ended with the reset (including any this browser had): start a new one.
		event.locals.session = null;
		await sessionStart(event, r.value.userId);
		redirect(303, await homePath(r.value.userId));
	}
};
