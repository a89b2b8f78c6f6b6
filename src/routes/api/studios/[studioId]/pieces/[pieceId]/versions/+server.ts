import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { uuidSchema } from '$lib/server/validation';
import { EDITORS, seesOnlySignedOff } from '$lib/server/versions/access';
import { versionListOfPiece } from '$lib/server/versions/version-list';
import { versionSave } from '$lib/server/versions/save';
import { saveRefusal } from '$lib/server/versions/save-response';
import { VERSION_BODY_LIMIT_BYTES, VERSION_MAX_SEGMENTS, versionSaveSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema });

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId } = parseParams(event.params, params);
	// the list is sent only when the piece is the studio's (404 otherwise)
	const found = await versionListOfPiece(db(), studioId, pieceId, seesOnlySignedOff(role));
	if (!found) throw new ApiError(404, 'not_found', 'No such piece in this studio.');
	return json({ versions: found.versions });
});

/** Saves a new version: verified and recomputed on the server (see $lib/server/versions/save). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const { pieceId } = parseParams(event.params, params);
	const body = await readJson(event.request, versionSaveSchema, VERSION_BODY_LIMIT_BYTES);
	if (body.geometry.outline.segments.length > VERSION_MAX_SEGMENTS) {
		throw new ApiError(413, 'too_many_segments', `A piece may have at most ${VERSION_MAX_SEGMENTS} outline segments.`);
	}
	const r = await versionSave(db(), {
		studioId,
		pieceId,
		baseVersionId: body.baseVersionId,
		message: body.message,
		geometry: body.geometry,
		recipe: body.recipe,
		declared: body.declared,
		authorId: user.id
	});
	if (!r.ok) throw saveRefusal(r);
	return json({ version: r.version, checks: r.checks, warnings: r.warnings }, { status: 201 });
});
