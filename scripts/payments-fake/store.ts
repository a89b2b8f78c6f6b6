// The fake's in-memory state and the provider's object shapes (customers, prices, checkout and portal
// sessions, subscriptions, invoices, events). Only what the app and its tests use; ids look like the
// provider's (cus_…, sub_…, in_…, evt_…).
import { randomBytes } from 'node:crypto';

export type Json = Record<string, unknown>;
export type Interval = 'month' | 'year';

export interface Price extends Json {
	id: string;
	object: 'price';
	currency: string;
	unit_amount: number;
	recurring: { interval: Interval; interval_count: 1; usage_type: 'licensed' };
}

export interface SubscriptionItem extends Json {
	id: string;
	object: 'subscription_item';
	price: Price;
	quantity: number;
	current_period_start: number;
	current_period_end: number;
	subscription: string;
}

export interface Subscription extends Json {
	id: string;
	object: 'subscription';
	customer: string;
	status: string;
	cancel_at_period_end: boolean;
	canceled_at: number | null;
	ended_at: number | null;
	created: number;
	metadata: Record<string, string>;
	items: { object: 'list'; data: SubscriptionItem[]; has_more: false; url: string };
	latest_invoice: string | null;
}

export interface Invoice extends Json {
	id: string;
	object: 'invoice';
	customer: string;
	number: string;
	status: 'paid' | 'open';
	amount_due: number;
	amount_paid: number;
	amount_remaining: number;
	currency: string;
	created: number;
	hosted_invoice_url: string;
	metadata: Record<string, string>;
}

export interface FakeEvent extends Json {
	id: string;
	object: 'event';
	type: string;
	created: number;
	data: { object: Json };
}

export const nowS = () => Math.floor(Date.now() / 1000);
export const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
export const clone = <T>(x: T): T => structuredClone(x);

/** The Studio plan's prices per seat; their ids are the app's defaults (STRIPE_PRICE_STUDIO_*). */
export const PRICES: Price[] = [
	{ id: 'price_studio_seat_monthly', object: 'price', active: true, currency: 'eur', unit_amount: 1500, product: 'prod_studio_seat', type: 'recurring', nickname: 'Studio seat, monthly', recurring: { interval: 'month', interval_count: 1, usage_type: 'licensed' } },
	{ id: 'price_studio_seat_yearly', object: 'price', active: true, currency: 'eur', unit_amount: 15000, product: 'prod_studio_seat', type: 'recurring', nickname: 'Studio seat, yearly', recurring: { interval: 'year', interval_count: 1, usage_type: 'licensed' } }
];

/** The end of a period that starts at `startS`: one calendar month or year later (UTC). */
export function periodEnd(startS: number, interval: Interval): number {
	const d = new Date(startS * 1000);
	if (interval === 'month') d.setUTCMonth(d.getUTCMonth() + 1);
	else d.setUTCFullYear(d.getUTCFullYear() + 1);
	return Math.floor(d.getTime() / 1000);
}

export class FakeStore {
	customers = new Map<string, Json>();
	checkoutSessions = new Map<string, Json & { line_items: { price: string; quantity: number }[] }>();
	portalSessions = new Map<string, Json>();
	subscriptions = new Map<string, Subscription>();
	invoices = new Map<string, Invoice>();
	/** every event made, oldest first */
	events: FakeEvent[] = [];
	private lastEventS = 0;
	private invoiceCount = 0;

	constructor(readonly baseUrl: () => string) {}

	price(id: string): Price | undefined {
		return PRICES.find((p) => p.id === id);
	}

	/**
	 * Makes an event of the object as it is now. Its `created` second never goes back and never repeats,
	 * so the app can order a subscription's states by it even when deliveries come out of order.
	 */
	event(type: string, object: Json): FakeEvent {
		this.lastEventS = Math.max(nowS(), this.lastEventS + 1);
		const e: FakeEvent = {
			id: newId('evt'),
			object: 'event',
			api_version: '2026-10-28.endive',
			type,
			created: this.lastEventS,
			livemode: false,
			pending_webhooks: 1,
			request: { id: null, idempotency_key: null },
			data: { object: clone(object) }
		};
		this.events.push(e);
		return e;
	}

	customerCreate(fields: { id?: string; email?: string; name?: string; metadata: Record<string, string> }): Json {
		const c = { id: fields.id ?? newId('cus'), object: 'customer', created: nowS(), email: fields.email ?? null, name: fields.name ?? null, metadata: fields.metadata, livemode: false };
		this.customers.set(c.id, c);
		return c;
	}

	subscriptionCreate(input: { id?: string; customer: string; price: Price; quantity: number; metadata: Record<string, string>; startS?: number }): Subscription {
		const id = input.id ?? newId('sub');
		const start = input.startS ?? nowS();
		const sub: Subscription = {
			id,
			object: 'subscription',
			customer: input.customer,
			status: 'active',
			cancel_at_period_end: false,
			cancel_at: null,
			canceled_at: null,
			ended_at: null,
			created: start,
			start_date: start,
			currency: input.price.currency,
			livemode: false,
			metadata: input.metadata,
			latest_invoice: null,
			items: {
				object: 'list',
				has_more: false,
				url: `/v1/subscription_items?subscription=${id}`,
				data: [
					{ id: newId('si'), object: 'subscription_item', created: start, price: clone(input.price), quantity: input.quantity, current_period_start: start, current_period_end: periodEnd(start, input.price.recurring.interval), subscription: id, metadata: {} }
				]
			}
		};
		this.subscriptions.set(id, sub);
		return sub;
	}

	/** An invoice for the subscription's current period: paid, or left open when the payment failed. */
	invoiceFor(sub: Subscription, paid: boolean, createdS = nowS()): Invoice {
		const item = sub.items.data[0];
		const amount = item.price.unit_amount * item.quantity;
		this.invoiceCount += 1;
		const id = newId('in');
		const invoice: Invoice = {
			id,
			object: 'invoice',
			customer: sub.customer,
			number: `DART-${String(this.invoiceCount).padStart(4, '0')}`,
			status: paid ? 'paid' : 'open',
			amount_due: amount,
			amount_paid: paid ? amount : 0,
			amount_remaining: paid ? 0 : amount,
			currency: item.price.currency,
			created: createdS,
			period_start: item.current_period_start,
			period_end: item.current_period_end,
			hosted_invoice_url: `${this.baseUrl()}/invoices/${id}`,
			livemode: false,
			metadata: {},
			parent: { type: 'subscription_details', subscription_details: { subscription: sub.id, metadata: clone(sub.metadata) } }
		};
		this.invoices.set(id, invoice);
		sub.latest_invoice = id;
		return invoice;
	}

	/** Starts the next period of a subscription: its invoice paid (active) or failed (past_due). */
	renew(sub: Subscription, paid: boolean): FakeEvent[] {
		const item = sub.items.data[0];
		item.current_period_start = item.current_period_end;
		item.current_period_end = periodEnd(item.current_period_start, item.price.recurring.interval);
		const invoice = this.invoiceFor(sub, paid);
		sub.status = paid ? 'active' : 'past_due';
		return [this.event(paid ? 'invoice.paid' : 'invoice.payment_failed', invoice), this.event('customer.subscription.updated', sub)];
	}

	/** Ends a subscription now. */
	end(sub: Subscription): FakeEvent {
		sub.status = 'canceled';
		sub.canceled_at ??= nowS();
		sub.ended_at = nowS();
		return this.event('customer.subscription.deleted', sub);
	}
}
