import { json } from '@sveltejs/kit';
import { apiRoute, readBodyLimited } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { webhookEventVerify, webhookHandle } from '$lib/server/billing/webhook';
import { db } from '$lib/server/db';
import type { RequestHandler } from './$types';

/** The payment provider's events: the body is checked against its signature before anything else. */
export const POST: RequestHandler = apiRoute(async (event) => {
	await requireRole(event, 'public');
	// the exact bytes: the signature covers them, so the body is read raw, never re-serialized
	const raw = await readBodyLimited(event.request, 256 * 1024);
	const verified = webhookEventVerify(raw, event.request.headers.get('stripe-signature'));
	const r = await webhookHandle(db(), verified, event.url.origin);
	return json({ received: true, duplicate: r.duplicate, ...(r.duplicate ? {} : { outcome: r.outcome }) });
});
