import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { invitationAcceptExisting, invitationAcceptNew, invitationPeek } from '$lib/server/auth/accounts';
import { sessionStart } from '$lib/server/auth/lucia';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { usersByEmail } from '$lib/server/repositories/users';
import { fieldErrors, formObject, passwordSchema, personNameSchema } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

const SPENT = 'This invitation link does not work any more: it was used already or it has expired. Ask the studio owner for a new one.';

const signupSchema = z.object({ name: personNameSchema, password: passwordSchema });

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'public');
	const inv = await invitationPeek(db(), event.params.token);
	if (!inv) error(404, { message: SPENT, code: 'link_spent' });
	const hasAccount = (await usersByEmail(db(), inv.email)) !== undefined;
	return {
		invitation: { email: inv.email, role: inv.role, studioName: inv.studio_name, expiresAt: inv.expires_at.toISOString() },
		hasAccount
	};
};

export const actions: Actions = {
	/** A newcomer: create the account with the invited address and join. */
	signup: async (event) => {
		await requireRole(event, 'public');
		const raw = formObject(await event.request.formData());
		const parsed = signupSchema.safeParse(raw);
		if (!parsed.success) {
			return fail(400, { values: { name: raw.name ?? '' }, errors: fieldErrors(parsed.error), message: null });
		}
		const r = await invitationAcceptNew(db(), { token: event.params.token, ...parsed.data });
		if (!r.ok) {
			return fail(r.reason === 'spent' ? 410 : 409, { values: { name: parsed.data.name }, errors: {}, message: r.message });
		}
		await sessionStart(event, r.value.user.id);
		redirect(303, `/studios/${r.value.studioId}`);
	},
	/** Someone with an account, signed in with the invited address: join. */
	join: async (event) => {
		const { user } = await requireRole(event, 'signed_in');
		const r = await invitationAcceptExisting(db(), { token: event.params.token, user });
		if (!r.ok) return fail(r.reason === 'spent' ? 410 : 403, { values: { name: '' }, errors: {}, message: r.message });
		redirect(303, `/studios/${r.value.studioId}`);
	}
};
