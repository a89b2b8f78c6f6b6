import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { exportQuery, sizeSetFileQuerySchema, sizeSetSvgExport } from '$lib/server/size-sets/export';
import { uuidSchema } from '$lib/server/validation';
import { svgDownload } from '$lib/server/versions/export';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeSetId: uuidSchema });

/** The size set's pieces at true scale as one SVG, each labelled with its size (`?sizes=` picks sizes). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { sizeSetId } = parseParams(event.params, params);
	const q = parseParams(exportQuery(event.url.searchParams), sizeSetFileQuerySchema);
	const { svg, fileName } = await sizeSetSvgExport(db(), studioId, sizeSetId, role, q.sizes);
	return svgDownload(svg, fileName);
});
