import { seatsReductionCheck, type BillingInterval } from '../../billing/plans';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import { billingCustomerSet, billingOfStudio } from '../repositories/billing';
import { studiosById } from '../repositories/studios';
import { studioPlan } from './plan';
import { billingConfig, paymentsClient, providerError } from './provider';

/**
 * Changes of plan go through the provider: a checkout session to start paying, the provider's
 * customer-management (portal) session for the card and cancelling, and a subscription update for
 * seats and interval. None of them changes the plan stored here: the provider's webhook does.
 */

const billingPath = (studioId: string) => `/studios/${studioId}/billing`;

async function customerEnsure(db: Db, studioId: string, owner: { email: string; name: string }): Promise<string> {
	const row = await billingOfStudio(db, studioId);
	if (row?.customer_id) return row.customer_id;
	const studio = await studiosById(db, studioId);
	if (!studio) throw new ApiError(404, 'not_found', 'No such studio.');
	const customer = await paymentsClient()
		.customers.create({ email: owner.email, name: studio.name, metadata: { studio_id: studioId } }, { idempotencyKey: `customer-${studioId}` })
		.catch((e: unknown) => {
			throw providerError(e);
		});
	await billingCustomerSet(db, studioId, customer.id);
	return customer.id;
}

function seatsRefusal(check: ReturnType<typeof seatsReductionCheck>): void {
	if (!check.ok) throw new ApiError(409, 'seats_in_use', check.message, { seats: [check.message] });
}

export async function checkoutStart(
	db: Db,
	input: { studioId: string; seats: number; interval: BillingInterval; owner: { email: string; name: string }; origin: string }
): Promise<{ url: string }> {
	const plan = await studioPlan(db, input.studioId);
	if (plan.state.plan === 'studio') {
		throw new ApiError(409, 'already_subscribed', 'This studio is on the Studio plan already: change its seats or interval instead.');
	}
	seatsRefusal(seatsReductionCheck(input.seats, plan.usage));
	const customer = await customerEnsure(db, input.studioId, input.owner);
	const back = `${input.origin}${billingPath(input.studioId)}`;
	try {
		const session = await paymentsClient().checkout.sessions.create({
			mode: 'subscription',
			customer,
			client_reference_id: input.studioId,
			line_items: [{ price: billingConfig().prices[input.interval], quantity: input.seats }],
			subscription_data: { metadata: { studio_id: input.studioId } },
			metadata: { studio_id: input.studioId },
			success_url: `${back}?checkout=done`,
			cancel_url: `${back}?checkout=cancelled`
		});
		if (!session.url) throw new ApiError(502, 'billing_provider_error', 'The payment provider gave no checkout address.');
		return { url: session.url };
	} catch (e) {
		throw providerError(e);
	}
}

export type PortalFlow = 'manage' | 'payment_method_update' | 'subscription_cancel';

export async function portalStart(db: Db, input: { studioId: string; flow: PortalFlow; origin: string }): Promise<{ url: string }> {
	const row = await billingOfStudio(db, input.studioId);
	if (!row?.customer_id) throw new ApiError(409, 'no_billing_account', 'This studio has no billing account yet: upgrade to the Studio plan first.');
	if (input.flow === 'subscription_cancel' && !row.subscription_id) {
		throw new ApiError(409, 'no_subscription', 'This studio has no subscription to cancel.');
	}
	try {
		const session = await paymentsClient().billingPortal.sessions.create({
			customer: row.customer_id,
			return_url: `${input.origin}${billingPath(input.studioId)}?portal=done`,
			...(input.flow === 'payment_method_update'
				? { flow_data: { type: 'payment_method_update' as const } }
				: input.flow === 'subscription_cancel'
					? { flow_data: { type: 'subscription_cancel' as const, subscription_cancel: { subscription: row.subscription_id! } } }
					: {})
		});
		return { url: session.url };
	} catch (e) {
		throw providerError(e);
	}
}

/** Seats, interval, cancel at period end: asked of the provider; the stored plan follows its webhook. */
export async function subscriptionChange(
	db: Db,
	input: { studioId: string; seats?: number; interval?: BillingInterval; cancelAtPeriodEnd?: boolean }
): Promise<{ subscriptionId: string }> {
	const plan = await studioPlan(db, input.studioId);
	const row = plan.billing;
	if (plan.state.plan !== 'studio' || !row?.subscription_id) {
		throw new ApiError(409, 'no_subscription', 'This studio is on the free Sketch plan: upgrade to Studio first.');
	}
	if (input.seats !== undefined) seatsRefusal(seatsReductionCheck(input.seats, plan.usage));
	const stripe = paymentsClient();
	try {
		const sub = await stripe.subscriptions.retrieve(row.subscription_id);
		const item = sub.items.data[0];
		if (!item) throw new ApiError(502, 'billing_provider_error', 'The subscription has no item at the payment provider.');
		const changesItem = input.seats !== undefined || input.interval !== undefined;
		await stripe.subscriptions.update(row.subscription_id, {
			...(changesItem
				? {
						items: [
							{
								id: item.id,
								...(input.seats !== undefined ? { quantity: input.seats } : {}),
								...(input.interval !== undefined ? { price: billingConfig().prices[input.interval] } : {})
							}
						],
						proration_behavior: 'create_prorations' as const
					}
				: {}),
			...(input.cancelAtPeriodEnd !== undefined ? { cancel_at_period_end: input.cancelAtPeriodEnd } : {})
		});
		return { subscriptionId: row.subscription_id };
	} catch (e) {
		throw providerError(e);
	}
}
