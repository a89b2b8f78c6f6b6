import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { stylesOfStudio } from '$lib/server/repositories/styles';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	return { styles: await stylesOfStudio(db(), studioId) };
};
