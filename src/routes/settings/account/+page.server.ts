import { fail, redirect } from '@sveltejs/kit';
import { accountDelete } from '$lib/server/auth/account-delete';
import { lastOwnerMessage } from '$lib/server/auth/last-owner-message';
import { sessionCookieClear } from '$lib/server/auth/lucia';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { membershipsForUser, membershipsSoleOwnerOf } from '$lib/server/repositories/memberships';
import { accountDeleteSchema, accountDeleteStatus } from '$lib/server/validation-account';
import { fieldErrors, formObject } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

/**
 * The person's account: their studios (to leave one), a download of their data, and deleting the account
 * (with, up front, what would refuse it: studios they are the only owner of).
 */
export const load: PageServerLoad = async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	const [memberships, soleOwnerOf] = await Promise.all([membershipsForUser(db(), user.id), membershipsSoleOwnerOf(db(), user.id)]);
	// what would refuse the deletion, said before the person types their password
	return { me: { email: user.email, name: user.name }, memberships, lastOwner: lastOwnerMessage(soleOwnerOf, '') };
};

export const actions: Actions = {
	delete: async (event) => {
		const { user } = await requireRole(event, 'signed_in');
		const raw = formObject(await event.request.formData());
		const parsed = accountDeleteSchema(user.email).safeParse(raw);
		const values = { email: raw.email ?? '' };
		if (!parsed.success) return fail(400, { values, errors: fieldErrors(parsed.error), message: null });
		const r = await accountDelete(db(), { userId: user.id, email: user.email, password: parsed.data.password, address: event.getClientAddress() });
		if (!r.ok) {
			if (r.retryAfterSeconds) event.setHeaders({ 'retry-after': String(r.retryAfterSeconds) });
			return fail(accountDeleteStatus[r.reason], { values, errors: {}, message: r.message });
		}
		sessionCookieClear(event);
		event.locals.session = null;
		event.locals.user = null;
		redirect(303, '/?account=deleted');
	}
};
