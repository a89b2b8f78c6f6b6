import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams } from '$lib/server/api';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { versionCommentsOf } from '$lib/server/repositories/version-comments';
import { versionReviewsOf } from '$lib/server/repositories/version-reviews';
import { uuidSchema } from '$lib/server/validation';
import { pieceOr404, versionOr404 } from '$lib/server/versions/access';
import { reviewItems } from '$lib/server/versions/review-items';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), pieceId: uuidSchema, versionId: uuidSchema });

/**
 * The review of a version: its record (proposed, withdrawn, sent back, signed off: who, when, why, what
 * was acknowledged), its comment thread, and what a signer would have to acknowledge now.
 */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const { pieceId, versionId } = parseParams(event.params, params);
	const piece = await pieceOr404(db(), studioId, pieceId);
	const v = await versionOr404(db(), pieceId, versionId, role);
	const [reviews, comments, toAcknowledge] = await Promise.all([
		versionReviewsOf(db(), versionId),
		versionCommentsOf(db(), versionId),
		v.state === 'proposed' ? reviewItems(db(), piece.styleId, pieceId, v) : Promise.resolve([])
	]);
	return json({ state: v.state, reviews, comments, toAcknowledge });
});
