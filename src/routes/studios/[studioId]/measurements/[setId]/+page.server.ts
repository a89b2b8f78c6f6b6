import { error, fail, redirect } from '@sveltejs/kit';
import { measurementDefinitions } from '$lib/pattern/measurements';
import { ALL_ROLES, EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { measurementSetDelete, measurementSetDuplicate, measurementSetOr404, setView } from '$lib/server/measurements';
import type { Actions, PageServerLoad } from './$types';

const notFound = (e: unknown): never => {
	if (e instanceof ApiError && e.status === 404) error(404, { message: e.message, code: 'not_found' });
	throw e;
};

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const set = setView(await measurementSetOr404(db(), studioId, event.params.setId).catch(notFound));
	const u = event.url.searchParams.get('unit');
	return {
		set,
		unit: u === 'mm' || u === 'cm' || u === 'in' ? u : set.unit,
		labels: Object.fromEntries(Object.values(measurementDefinitions).map((d) => [d.id, { label: d.label, definition: d.definition }]))
	};
};

export const actions: Actions = {
	duplicate: async (event) => {
		const { studioId, user } = await requireRole(event, EDITORS);
		const copy = await measurementSetDuplicate(db(), studioId, event.params.setId, user.id).catch(notFound);
		redirect(303, `/studios/${studioId}/measurements/${copy.id}`);
	},
	delete: async (event) => {
		const { studioId } = await requireRole(event, EDITORS);
		try {
			await measurementSetDelete(db(), studioId, event.params.setId);
		} catch (e) {
			if (e instanceof ApiError && e.status === 409) return fail(409, { message: e.message });
			notFound(e);
		}
		redirect(303, `/studios/${studioId}/measurements`);
	}
};
