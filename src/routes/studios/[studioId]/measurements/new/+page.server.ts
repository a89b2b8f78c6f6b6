import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { setFormSchema, type FormMessage, type SetForm } from '../set-form';
import { setFormSave } from '../set-form.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	await requireRole(event, EDITORS);
	return { form: await superValidate<SetForm, FormMessage>(zod4(setFormSchema)) };
};

export const actions: Actions = {
	default: async (event) => {
		const { studioId, user } = await requireRole(event, EDITORS);
		return setFormSave(db(), event.request, { studioId, userId: user.id });
	}
};
