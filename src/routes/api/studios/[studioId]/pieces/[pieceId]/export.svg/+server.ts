import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { uuidSchema } from '$lib/server/validation';
import { pieceSvgExport, svgDownload } from '$lib/server/versions/export';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema });
const query = z.object({ version: uuidSchema.optional() });

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId } = parseParams(event.params, params);
	const q = parseParams(Object.fromEntries(event.url.searchParams), query);
	const { svg, fileName } = await pieceSvgExport(db(), studioId, pieceId, q.version ?? null, role);
	return svgDownload(svg, fileName);
});
