import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { uuidSchema } from '$lib/server/validation';
import { styleSvgExport, svgDownload } from '$lib/server/versions/export';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	const { svg, fileName } = await styleSvgExport(db(), studioId, styleId, role);
	return svgDownload(svg, fileName);
});
