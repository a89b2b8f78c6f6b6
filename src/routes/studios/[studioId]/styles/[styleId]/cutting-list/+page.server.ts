import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { styleCuttingList } from '$lib/server/exports/cutting-list';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const styleId = z.uuid().safeParse(event.params.styleId);
	if (!styleId.success) error(404, { message: 'No such style.', code: 'not_found' });
	const found = await styleCuttingList(db(), studioId, styleId.data, role).catch(() => null);
	if (!found) error(404, { message: 'No such style.', code: 'not_found' });
	return { style: found.style, rows: found.list.rows.map((r) => ({ ...r })), fabrics: found.list.fabrics.map((f) => ({ ...f })) };
};
