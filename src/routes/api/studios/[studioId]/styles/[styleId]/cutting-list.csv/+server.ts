import { z } from 'zod';
import { cuttingListCsv } from '$lib/export/cutting-list';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { styleCuttingList } from '$lib/server/exports/cutting-list';
import { fileDownload } from '$lib/server/exports/style-pieces';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The cutting list as CSV (areas in cm²). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	const { list, fileName } = await styleCuttingList(db(), studioId, styleId, role);
	return fileDownload(cuttingListCsv(list), 'text/csv; charset=utf-8', fileName);
});
