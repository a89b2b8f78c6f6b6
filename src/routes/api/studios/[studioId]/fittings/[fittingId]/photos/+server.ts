import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { FITTERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fittingOr404, photoUpload } from '$lib/server/fittings/fittings';
import { photoFileRead } from '$lib/server/fittings/photo-read';
import { rateLimitUpload } from '$lib/server/rate-limits';
import { uuidSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), fittingId: uuidSchema });

/**
 * One photo (multipart, field "file"): JPEG, PNG or WebP by its bytes, up to 15 MB and 50 megapixels,
 * 30 per fitting. Stored re-encoded (orientation applied, metadata removed) as a display size and a thumbnail.
 */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, FITTERS);
	const { fittingId } = parseParams(event.params, params);
	await fittingOr404(db(), studioId, fittingId);
	await rateLimitUpload('photo_user', user.id, event.request);
	const file = await photoFileRead(event.request);
	const photo = await photoUpload(db(), { studioId, fittingId, userId: user.id, name: file.name, bytes: file.bytes });
	return json({ photo }, { status: 201 });
});
