import { error } from '@sveltejs/kit';
import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { measurementSetOr404, setView } from '$lib/server/measurements';
import { formFromSet, setFormSchema, type FormMessage, type SetForm } from '../../set-form';
import { setFormSave } from '../../set-form.server';
import type { Actions, PageServerLoad } from './$types';

async function editable(studioId: string, setId: string) {
	const row = await measurementSetOr404(db(), studioId, setId).catch((e) => {
		if (e instanceof ApiError) error(404, { message: e.message, code: 'not_found' });
		throw e;
	});
	if (row.readOnly) error(409, { message: `"${row.name}" is a published chart: duplicate it to make an editable set.`, code: 'read_only' });
	return row;
}

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const set = setView(await editable(studioId, event.params.setId));
	return { set: { id: set.id, name: set.name }, form: await superValidate<SetForm, FormMessage>(formFromSet(set), zod4(setFormSchema), { errors: false }) };
};

export const actions: Actions = {
	default: async (event) => {
		const { studioId, user } = await requireRole(event, EDITORS);
		const row = await editable(studioId, event.params.setId);
		return setFormSave(db(), event.request, { studioId, userId: user.id, setId: row.id });
	}
};
