import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { stylesInStudio } from '$lib/server/repositories/styles';
import { sizeSetOr404 } from '$lib/server/size-sets/sign-off';
import type { PageServerLoad } from './$types';

/** A size set: its sizes with their sign-off, checks and pieces, and its exports. */
export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const id = z.uuid().safeParse(event.params.sizeSetId);
	if (!id.success) error(404, { message: 'No such size set.', code: 'not_found' });
	const found = await sizeSetOr404(db(), studioId, id.data, role).catch(() => null);
	if (!found) error(404, { message: 'No such size set.', code: 'not_found' });
	const style = await stylesInStudio(db(), studioId, found.set.styleId);
	if (!style) error(404, { message: 'No such size set.', code: 'not_found' });
	return { sizeSet: found.view, style: { id: style.id, name: style.name, code: style.code } };
};
