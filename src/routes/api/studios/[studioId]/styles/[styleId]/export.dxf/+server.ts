import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { styleDxfExport } from '$lib/server/exports/dxf';
import { fileDownload } from '$lib/server/exports/style-pieces';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The style's pieces as DXF for exchange with other studios and factories (ASTM D6673 layers, mm). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	const { text, fileName } = await styleDxfExport(db(), studioId, styleId, role);
	return fileDownload(text, 'application/dxf', fileName);
});
