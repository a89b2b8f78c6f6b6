import { log } from '../log';
import type Stripe from 'stripe';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { billingEventOutcomeSet, billingEventRecord, billingOwners } from '../repositories/billing';
import { studiosById } from '../repositories/studios';
import { webhookEventCheck } from './event-schemas';
import { billingEventApply, type EventEffect } from './events';
import { paymentFailedMailSend } from './mail';
import { billingConfig, paymentsClient } from './provider';

export type WebhookResult = { duplicate: true; eventId: string } | ({ duplicate: false; eventId: string } & EventEffect);

/** Verifies the provider's signature over the exact bytes received (400 when missing or wrong), then the event's fields (400). */
export function webhookEventVerify(rawBody: string, signature: string | null): Stripe.Event {
	if (!signature) throw new ApiError(400, 'signature_missing', 'The Stripe-Signature header is missing: only the payment provider may post here.');
	const config = billingConfig();
	if (!config.webhookSecret) {
		throw new ApiError(503, 'billing_unavailable', 'Billing is not set up on this server (STRIPE_WEBHOOK_SECRET is missing).');
	}
	let event: Stripe.Event;
	try {
		event = paymentsClient(config).webhooks.constructEvent(rawBody, signature, config.webhookSecret);
	} catch (e) {
		const why = e instanceof Error ? e.message.split('\n')[0] : 'it does not match';
		throw new ApiError(400, 'signature_invalid', `The webhook signature was not accepted: ${why}`);
	}
	// signed is not yet well formed: the fields this app reads are checked with zod
	return webhookEventCheck(event);
}

/**
 * Handles one verified event exactly once: its id is recorded in the same transaction as its effect,
 * so a redelivery (or two deliveries at once) changes nothing. After the commit, a failed payment is
 * mailed to the studio's owners.
 */
export async function webhookHandle(db: Db, event: Stripe.Event, origin: string): Promise<WebhookResult> {
	const at = new Date(event.created * 1000);
	const result = await db.transaction().execute(async (tx): Promise<WebhookResult> => {
		const fresh = await billingEventRecord(tx, { id: event.id, type: event.type, studioId: null, providerCreatedAt: at, outcome: 'ignored' });
		if (!fresh) return { duplicate: true, eventId: event.id };
		const effect = await billingEventApply(tx, event);
		await billingEventOutcomeSet(tx, event.id, effect.studioId, effect.outcome);
		return { duplicate: false, eventId: event.id, ...effect };
	});
	if (!result.duplicate && result.paymentFailed && result.studioId) {
		const studio = await studiosById(db, result.studioId);
		for (const owner of await billingOwners(db, result.studioId)) {
			try {
				await paymentFailedMailSend({
					to: owner.email,
					studioName: studio?.name ?? 'your studio',
					...result.paymentFailed,
					billingLink: `${origin}/studios/${result.studioId}/billing`,
					invoiceLink: result.paymentFailed.invoiceUrl
				});
			} catch (e) {
				// The event stays handled (the banner shows it); the mail is lost, and the log says so.
				log.error({ studioId: result.studioId, err: e }, 'could not mail an owner about a failed payment');
			}
		}
	}
	return result;
}
