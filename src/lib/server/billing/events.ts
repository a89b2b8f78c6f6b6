import type Stripe from 'stripe';
import type { DbOrTx } from '../db';
import type { BillingEventsTable } from '../db/schema';
import {
	billingCustomerSet,
	billingInvoiceUpsert,
	billingLocked,
	billingPaymentFailedSet,
	billingStudioOfCustomer,
	billingSubscriptionSet,
	type SubscriptionState
} from '../repositories/billing';
import { uuidSchema } from '../validation';
import { LIVE_STATUSES } from './plan';
import { intervalOfPrice } from './provider';

/** The provider events this app acts on; every other type is recorded and ignored. */
export const HANDLED_EVENTS = [
	'checkout.session.completed',
	'customer.subscription.created',
	'customer.subscription.updated',
	'customer.subscription.deleted',
	'invoice.paid',
	'invoice.payment_failed'
] as const;

export interface EventEffect {
	outcome: BillingEventsTable['outcome'];
	studioId: string | null;
	/** a payment failed: whom to tell, once the transaction has committed */
	paymentFailed?: { amountMinor: number; currency: string; invoiceUrl: string | null };
}

const idOf = (x: string | { id: string } | null | undefined): string | null => (typeof x === 'string' ? x : (x?.id ?? null));
const dateOf = (s: number | null | undefined): Date | null => (typeof s === 'number' ? new Date(s * 1000) : null);

async function studioExists(db: DbOrTx, id: string): Promise<boolean> {
	return (await db.selectFrom('studios').select('id').where('id', '=', id).executeTakeFirst()) !== undefined;
}

/** Which studio an object belongs to: our id in its metadata (set when we made it), else its customer. */
async function studioOf(db: DbOrTx, metadataStudioId: string | null | undefined, customer: string | null): Promise<string | null> {
	const fromMeta = uuidSchema.safeParse(metadataStudioId);
	if (fromMeta.success && (await studioExists(db, fromMeta.data))) return fromMeta.data;
	return customer ? ((await billingStudioOfCustomer(db, customer)) ?? null) : null;
}

function subscriptionState(sub: Stripe.Subscription, at: Date): SubscriptionState {
	const item = sub.items?.data?.[0];
	const priceId = item?.price?.id ?? null;
	return {
		subscriptionId: sub.id,
		status: sub.status,
		priceId,
		interval: intervalOfPrice(priceId) ?? (item?.price?.recurring?.interval === 'year' ? 'year' : item?.price?.recurring?.interval === 'month' ? 'month' : null),
		seats: item?.quantity ?? 0,
		cancelAtPeriodEnd: sub.cancel_at_period_end,
		currentPeriodEnd: dateOf(item?.current_period_end),
		canceledAt: dateOf(sub.canceled_at),
		endedAt: dateOf(sub.ended_at),
		providerUpdatedAt: at
	};
}

async function subscriptionApply(db: DbOrTx, sub: Stripe.Subscription, at: Date): Promise<EventEffect> {
	const customer = idOf(sub.customer);
	const studioId = await studioOf(db, sub.metadata?.studio_id, customer);
	if (!studioId) return { outcome: 'unknown_studio', studioId: null };
	const row = await billingLocked(db, studioId);
	// Out of order: the state stored was made by the provider after this one.
	if (row.provider_updated_at && at < row.provider_updated_at) return { outcome: 'stale', studioId };
	// Another subscription is the studio's live one: an old subscription's news does not replace it.
	if (row.subscription_id && row.subscription_id !== sub.id && row.status && LIVE_STATUSES.has(row.status) && !LIVE_STATUSES.has(sub.status)) {
		return { outcome: 'stale', studioId };
	}
	if (customer && !row.customer_id) await billingCustomerSet(db, studioId, customer);
	await billingSubscriptionSet(db, studioId, subscriptionState(sub, at));
	return { outcome: 'applied', studioId };
}

async function checkoutApply(db: DbOrTx, session: Stripe.Checkout.Session): Promise<EventEffect> {
	const customer = idOf(session.customer);
	const studioId = await studioOf(db, session.client_reference_id ?? session.metadata?.studio_id, customer);
	if (!studioId) return { outcome: 'unknown_studio', studioId: null };
	const row = await billingLocked(db, studioId);
	if (customer && row.customer_id !== customer) await billingCustomerSet(db, studioId, customer);
	// The plan itself changes with the subscription's own events (they carry its state and time).
	return { outcome: 'applied', studioId };
}

async function invoiceApply(db: DbOrTx, invoice: Stripe.Invoice, at: Date, failed: boolean): Promise<EventEffect> {
	const customer = idOf(invoice.customer);
	const studioId = await studioOf(db, invoice.metadata?.studio_id, customer);
	if (!studioId || !invoice.id) return { outcome: 'unknown_studio', studioId: null };
	const row = await billingLocked(db, studioId);
	await billingInvoiceUpsert(db, {
		id: invoice.id,
		studio_id: studioId,
		number: invoice.number ?? null,
		status: invoice.status ?? (failed ? 'open' : 'paid'),
		amount_due: invoice.amount_due,
		amount_paid: invoice.amount_paid,
		currency: invoice.currency,
		hosted_url: invoice.hosted_invoice_url ?? null,
		provider_created_at: dateOf(invoice.created) ?? at
	});
	if (!failed) {
		if (row.payment_failed_at && at >= row.payment_failed_at) await billingPaymentFailedSet(db, studioId, null);
		return { outcome: 'applied', studioId };
	}
	if (row.payment_failed_at && at < row.payment_failed_at) return { outcome: 'stale', studioId };
	await billingPaymentFailedSet(db, studioId, at);
	return {
		outcome: 'applied',
		studioId,
		paymentFailed: { amountMinor: invoice.amount_due, currency: invoice.currency, invoiceUrl: invoice.hosted_invoice_url ?? null }
	};
}

/** Applies one verified provider event inside the caller's transaction. */
export async function billingEventApply(db: DbOrTx, event: Stripe.Event): Promise<EventEffect> {
	const at = new Date(event.created * 1000);
	switch (event.type) {
		case 'checkout.session.completed':
			return checkoutApply(db, event.data.object);
		case 'customer.subscription.created':
		case 'customer.subscription.updated':
		case 'customer.subscription.deleted':
			return subscriptionApply(db, event.data.object, at);
		case 'invoice.paid':
			return invoiceApply(db, event.data.object, at, false);
		case 'invoice.payment_failed':
			return invoiceApply(db, event.data.object, at, true);
		default:
			return { outcome: 'ignored', studioId: null };
	}
}
