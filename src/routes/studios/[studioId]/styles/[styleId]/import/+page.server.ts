import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { styleOr404 } from '$lib/server/versions/access';
import type { PageServerLoad } from './$types';

/** Import a .dxf or .svg into a style: the page previews what will be made, then saves it. */
export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const styleId = z.uuid().safeParse(event.params.styleId);
	if (!styleId.success) error(404, { message: 'No such style.', code: 'not_found' });
	const style = await styleOr404(db(), studioId, styleId.data).catch(() => null);
	if (!style) error(404, { message: 'No such style.', code: 'not_found' });
	return { style: { id: style.id, name: style.name } };
};
