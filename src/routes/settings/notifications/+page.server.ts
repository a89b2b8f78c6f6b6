import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { notificationPreferencesOf, notificationPreferencesSet } from '$lib/server/repositories/notification-preferences';
import type { Actions, PageServerLoad } from './$types';

/** Which e-mails the signed-in person receives: each kind on unless turned off. */
export const load: PageServerLoad = async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	return { notifications: await notificationPreferencesOf(db(), user.id) };
};

// A checkbox sends "on" when ticked and nothing when not; `form` says the form was sent at all.
const formSchema = z.object({
	form: z.literal('notifications', 'Send the settings form.'),
	version_proposed: z.literal('on').optional(),
	version_reviewed: z.literal('on').optional(),
	fit_note_assigned: z.literal('on').optional()
});

export const actions: Actions = {
	default: async (event) => {
		const { user } = await requireRole(event, 'signed_in');
		const parsed = formSchema.safeParse(Object.fromEntries((await event.request.formData()).entries()));
		if (!parsed.success) return fail(400, { error: 'The settings could not be read; nothing changed.' });
		const p = parsed.data;
		await notificationPreferencesSet(db(), user.id, {
			version_proposed: p.version_proposed === 'on',
			version_reviewed: p.version_reviewed === 'on',
			fit_note_assigned: p.fit_note_assigned === 'on'
		});
		return { saved: true };
	}
};
