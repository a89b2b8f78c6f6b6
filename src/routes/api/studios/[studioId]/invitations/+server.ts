import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, readJson } from '$lib/server/api';
import { invitationSend } from '$lib/server/auth/accounts';
import { OWNER, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { log } from '$lib/server/log';
import { rateLimitedError, rateLimitTake } from '$lib/server/rate-limits';
import { invitationsOpenForStudio, type InvitationRow } from '$lib/server/repositories/invitations';
import { emailSchema, roleSchema } from '$lib/server/validation';
import type { RequestHandler } from './$types';

const publicInvitation = (i: InvitationRow) => ({
	id: i.id,
	email: i.email,
	role: i.role,
	expiresAt: i.expires_at.toISOString(),
	createdAt: i.created_at.toISOString()
});

export const GET: RequestHandler = apiRoute(async (event) => {
	const { studioId } = await requireRole(event, OWNER);
	const rows = await invitationsOpenForStudio(db(), studioId);
	return json({ invitations: rows.map(publicInvitation) });
});

const createSchema = z.object({ email: emailSchema, role: roleSchema });

export const POST: RequestHandler = apiRoute(async (event) => {
	const { studioId, user } = await requireRole(event, OWNER);
	const body = await readJson(event.request, createSchema);
	const limited = await rateLimitTake('invite_studio', studioId);
	if (limited) throw rateLimitedError(limited);
	// a pending invitation takes a seat: invitationSend refuses it (402) past the plan's seats, counting
	// and inserting under the studio's lock
	let r;
	try {
		r = await invitationSend(db(), {
			studioId,
			email: body.email,
			role: body.role,
			inviter: user,
			origin: event.url.origin
		});
	} catch (e) {
		if (e instanceof ApiError) throw e;
		log.error({ studioId, err: e }, 'could not send the invitation mail');
		throw new ApiError(503, 'mail_unavailable', 'We could not send the invitation just now. Try again in a few minutes.');
	}
	if (!r.ok) {
		if (r.reason === 'already_member') throw new ApiError(409, 'already_member', r.message, { email: [r.message] });
		throw new ApiError(404, 'not_found', r.message);
	}
	return json({ invitation: publicInvitation(r.value) }, { status: 201 });
});
