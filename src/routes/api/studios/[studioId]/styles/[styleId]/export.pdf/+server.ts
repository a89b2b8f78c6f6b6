import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fileDownload } from '$lib/server/exports/style-pieces';
import { printQuerySchema, stylePrintPdf } from '$lib/server/exports/print';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** The style's pieces at true scale as a PDF: tiled pages of a home printer's paper, or large sheets. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { styleId } = parseParams(event.params, params);
	// pieces come as one comma-separated value or as repeated fields (the options form's checkboxes)
	const search = event.url.searchParams;
	const pieces = search.getAll('pieces').join(',') || undefined;
	const q = parseParams({ ...Object.fromEntries(search), pieces }, printQuerySchema);
	const { bytes, fileName } = await stylePrintPdf(db(), studioId, styleId, role, q);
	return fileDownload(bytes, 'application/pdf', fileName);
});
