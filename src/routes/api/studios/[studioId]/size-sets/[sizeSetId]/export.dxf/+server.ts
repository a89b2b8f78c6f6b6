import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fileDownload } from '$lib/server/exports/style-pieces';
import { exportQuery, sizeSetDxfExport, sizeSetFileQuerySchema } from '$lib/server/size-sets/export';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeSetId: uuidSchema });

/** The size set's pieces as DXF (ASTM D6673 layers, mm): one block per piece and size, the size in its Size field. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { sizeSetId } = parseParams(event.params, params);
	const q = parseParams(exportQuery(event.url.searchParams), sizeSetFileQuerySchema);
	const { text, fileName } = await sizeSetDxfExport(db(), studioId, sizeSetId, role, q.sizes);
	return fileDownload(text, 'application/dxf', fileName);
});
