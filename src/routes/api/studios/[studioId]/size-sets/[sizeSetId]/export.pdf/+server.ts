import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fileDownload } from '$lib/server/exports/style-pieces';
import { exportQuery, sizeSetPrintPdf, sizeSetPrintQuerySchema } from '$lib/server/size-sets/export';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), sizeSetId: uuidSchema });

/** The size set's pieces at true scale as a PDF (tiled pages or large sheets), each labelled with its size. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { sizeSetId } = parseParams(event.params, params);
	const q = parseParams(exportQuery(event.url.searchParams), sizeSetPrintQuerySchema);
	const { bytes, fileName } = await sizeSetPrintPdf(db(), studioId, sizeSetId, role, q);
	return fileDownload(bytes, 'application/pdf', fileName);
});
