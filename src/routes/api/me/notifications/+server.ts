import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, readPatch } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { notificationPreferencesOf, notificationPreferencesSet } from '$lib/server/repositories/notification-preferences';
import type { RequestHandler } from './$types';

/** Which e-mails the signed-in user receives (each on unless turned off). */
const prefsSchema = z
	.object({ version_proposed: z.boolean(), version_reviewed: z.boolean(), fit_note_assigned: z.boolean() })
	.partial();

export const GET: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	return json({ notifications: await notificationPreferencesOf(db(), user.id) });
});

export const PATCH: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	const body = await readPatch(event.request, prefsSchema);
	await notificationPreferencesSet(db(), user.id, body);
	return json({ notifications: await notificationPreferencesOf(db(), user.id) });
});
