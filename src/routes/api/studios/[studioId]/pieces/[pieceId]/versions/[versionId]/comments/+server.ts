import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { ALL_ROLES, COMMENTERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { versionCommentsInsert, versionCommentsOf } from '$lib/server/repositories/version-comments';
import { uuidSchema } from '$lib/server/validation';
import { pieceOr404, versionOr404 } from '$lib/server/versions/access';
import { versionCommentSchema } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema, versionId: uuidSchema });

/** The version's comment thread, oldest first. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId, versionId } = parseParams(event.params, params);
	await pieceOr404(db(), studioId, pieceId);
	await versionOr404(db(), pieceId, versionId, role);
	return json({ comments: await versionCommentsOf(db(), versionId) });
});

/** Adds a comment to the thread (designer, pattern cutter, owner). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, role, user } = await requireRole(event, COMMENTERS);
	const { pieceId, versionId } = parseParams(event.params, params);
	const body = await readJson(event.request, versionCommentSchema);
	await pieceOr404(db(), studioId, pieceId);
	await versionOr404(db(), pieceId, versionId, role);
	const { id } = await versionCommentsInsert(db(), { versionId, authorId: user.id, body: body.body });
	const comment = (await versionCommentsOf(db(), versionId)).find((c) => c.id === id);
	return json({ comment }, { status: 201 });
});
