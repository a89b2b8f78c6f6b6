import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { stylesInStudio } from '$lib/server/repositories/styles';
import type { PageServerLoad } from './$types';

/** The editor's shell names the style it edits; the pieces themselves come from the API in the browser. */
export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const styleId = z.uuid().safeParse(event.params.styleId);
	if (!styleId.success) error(404, { message: 'No such style.', code: 'not_found' });
	const style = await stylesInStudio(db(), studioId, styleId.data);
	if (!style) error(404, { message: 'No such style.', code: 'not_found' });
	return { style: { name: style.name, code: style.code } };
};
