import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { passwordResetRequest } from '$lib/server/auth/accounts';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { log } from '$lib/server/log';
import { rateLimitsTake } from '$lib/server/rate-limits';
import { emailNormalize } from '$lib/server/repositories/users';
import { emailSchema, fieldErrors, formObject } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

const schema = z.object({ email: emailSchema });

export const load: PageServerLoad = async (event) => {
	await requireRole(event, 'public');
	return {};
};

export const actions: Actions = {
	default: async (event) => {
		await requireRole(event, 'public');
		const raw = formObject(await event.request.formData());
		const parsed = schema.safeParse(raw);
		if (!parsed.success) {
			return fail(400, { email: raw.email ?? '', errors: fieldErrors(parsed.error), sent: false });
		}
		// counted whether or not the address has an account, so the answer tells nothing either way
		const limited = await rateLimitsTake([
			['reset_email', emailNormalize(parsed.data.email)],
			['reset_address', event.getClientAddress()]
		]);
		if (limited) {
			event.setHeaders({ 'retry-after': String(limited.retryAfterSeconds) });
			return fail(429, { email: parsed.data.email, errors: { email: [limited.message] }, sent: false });
		}
		try {
			await passwordResetRequest(db(), { email: parsed.data.email, origin: event.url.origin });
		} catch (e) {
			log.error({ err: e }, 'could not send the reset mail');
			return fail(503, {
				email: parsed.data.email,
				errors: { email: ['We could not send mail just now. Try again in a few minutes.'] },
				sent: false
			});
		}
		// The same answer whether or not the address has an account.
		return { email: parsed.data.email, errors: {}, sent: true };
	}
};
