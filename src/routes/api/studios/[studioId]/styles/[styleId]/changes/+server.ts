import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseParams, readJson } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { changeRefusal } from '$lib/server/changes/response';
import { changeSave } from '$lib/server/changes/save';
import { changeSaveSchema } from '$lib/server/changes/schemas';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { uuidSchema } from '$lib/server/validation';
import { EDITORS } from '$lib/server/versions/access';
import { VERSION_MAX_SEGMENTS } from '$lib/server/versions/schemas';
import type { RequestHandler } from './$types';

const params = z.object({ studioId: z.string(), styleId: uuidSchema });

/** Upper bound of one change's body (every new piece at full precision). */
const CHANGE_BODY_LIMIT_BYTES = 8 * 1024 * 1024;

/** Test seam only: hold the transaction open this long before it commits (the crash test kills the server then). */
function stall(): (() => Promise<void>) | undefined {
	const ms = Number(process.env.DARTELIER_TEST_CHANGE_STALL_MS ?? 0);
	return ms > 0 ? () => new Promise((resolve) => setTimeout(resolve, ms)) : undefined;
}

/** Saves one style change: recomputed and checked on the server, stored in one transaction (see $lib/server/changes/save). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, EDITORS);
	const { styleId } = parseParams(event.params, params);
	const body = await readJson(event.request, changeSaveSchema, CHANGE_BODY_LIMIT_BYTES);
	const segments = body.pieces.reduce((t, p) => t + p.geometry.outline.segments.length + (p.edits?.geometry.outline.segments.length ?? 0), 0);
	if (segments > VERSION_MAX_SEGMENTS * 2) throw new ApiError(413, 'too_many_segments', `One change may hold at most ${VERSION_MAX_SEGMENTS * 2} outline segments.`);
	const r = await changeSave(db(), { studioId, styleId, authorId: user.id, body }, { afterInsert: stall() });
	if (!r.ok) throw changeRefusal(r);
	return json({ change: r.change, pieces: r.pieces, seamPairs: r.seamPairs, checks: r.checks, warnings: r.warnings }, { status: 201 });
});
