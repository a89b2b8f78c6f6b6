import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { styleCuttingList } from '$lib/server/exports/cutting-list';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The cutting list: per piece fabric, cut, quantity, grain and areas (mm²); per fabric the totals. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	const { style, list } = await styleCuttingList(db(), studioId, styleId, role);
	return json({ style, units: { area: 'mm2' }, pieces: list.rows, fabrics: list.fabrics }, { headers: { 'cache-control': 'private, no-store' } });
});
