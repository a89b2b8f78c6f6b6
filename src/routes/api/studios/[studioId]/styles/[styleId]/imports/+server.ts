import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { importFileRead, importParse, importPreview, importSave } from '$lib/server/exports/import';
import { styleOr404 } from '$lib/server/versions/access';
import { rateLimitUpload } from '$lib/server/rate-limits';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });
const query = z.object({ preview: z.enum(['1', 'true']).optional() });

/**
 * One .dxf or .svg file (multipart, field "file"): each closed boundary becomes a new piece (version 1,
 * origin import). `?preview=1` reads the file and answers what would be made, storing nothing.
 */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const { styleId } = parseParams(event.params, params);
	const q = parseParams(Object.fromEntries(event.url.searchParams), query);
	await styleOr404(db(), studioId, styleId);
	await rateLimitUpload('import_user', user.id, event.request);
	const file = await importFileRead(event.request);
	const { kind, pieces } = importParse(file.name, file.bytes);
	if (q.preview) return json({ kind, fileName: file.name, pieces: importPreview(pieces) });
	const made = await importSave(db(), { studioId, styleId, authorId: user.id, fileName: file.name, kind, pieces });
	return json({ kind, pieces: made }, { status: 201 });
});
