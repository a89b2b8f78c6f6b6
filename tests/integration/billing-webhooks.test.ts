// The provider's webhook: signatures checked on the exact body (bad or missing → 400, nothing changed),
// each event handled once by id, and events out of order resolved by the provider's own times.
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PAYMENTS_FAKE_WEBHOOK_SECRET } from '../../scripts/payments-fake/server';
import { startApp, type RunningApp } from './app-server';
import { billingOf, checkoutPay, ownedStudio, upgrade } from './billing-helpers';
import { testDb, testDbClose } from './helpers';

let app: RunningApp;
const signer = new Stripe('sk_test_signing_only', { telemetry: false, maxNetworkRetries: 0 });

beforeAll(async () => {
	app = await startApp();
});

afterAll(async () => {
	await app?.close();
	await testDbClose();
});

const eventsStored = async (id: string) => (await testDb().selectFrom('billing_events').select(['id', 'outcome']).where('id', '=', id).execute());

describe('webhook signatures', () => {
	it('answers 400 to a body without a signature, with a wrong secret, or changed after signing, and changes nothing', async () => {
		const s = await ownedStudio(app);
		await upgrade(app, s, 2);
		const before = await billingOf(s);
		const sub = [...app.payments.store.subscriptions.values()].find((x) => x.id === before.subscription.id)!;
		const forged = { ...app.payments.store.event('customer.subscription.deleted', { ...sub, status: 'canceled', ended_at: Math.floor(Date.now() / 1000) }) };
		const payload = JSON.stringify(forged);
		const cases: [string, string | null, string][] = [
			['missing', null, 'signature_missing'],
			['wrong secret', signer.webhooks.generateTestHeaderString({ payload, secret: 'whsec_someone_else' }), 'signature_invalid'],
			['garbage', 't=1,v1=abc', 'signature_invalid'],
			['old timestamp', signer.webhooks.generateTestHeaderString({ payload, secret: PAYMENTS_FAKE_WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 3600 }), 'signature_invalid']
		];
		for (const [what, signature, code] of cases) {
			const r = await app.payments.deliver(forged, signature);
			expect(r.status, what).toBe(400);
			expect(JSON.parse(r.body).error.code, what).toBe(code);
		}
		// a body changed after signing
		const signed = signer.webhooks.generateTestHeaderString({ payload, secret: PAYMENTS_FAKE_WEBHOOK_SECRET });
		const tampered = await fetch(`${app.baseUrl}/api/billing/webhook`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', 'stripe-signature': signed },
			body: payload.replace('"canceled"', '"active" ')
		});
		expect(tampered.status).toBe(400);
		expect(await eventsStored(forged.id)).toEqual([]);
		expect(await billingOf(s)).toEqual(before);
	});
});

describe('webhook bodies', () => {
	it('answers 400 to a signed event whose object lacks the fields the app reads, and stores and changes nothing', async () => {
		const s = await ownedStudio(app);
		await upgrade(app, s, 2);
		const before = await billingOf(s);
		const sub = [...app.payments.store.subscriptions.values()].find((x) => x.id === before.subscription.id)!;
		const { status: _status, ...withoutStatus } = sub;
		const cases: [string, Record<string, unknown>][] = [
			['no status', withoutStatus],
			['seats as text', { ...sub, cancel_at_period_end: 'no', items: { data: [{ ...sub.items.data[0], quantity: 'five' }] } }]
		];
		for (const [what, object] of cases) {
			const event = app.payments.store.event('customer.subscription.updated', object as never);
			const r = await app.payments.deliver(event);
			expect(r.status, what).toBe(400);
			const err = JSON.parse(r.body).error;
			expect(err.code, what).toBe('invalid');
			expect(err.message, what).toContain('customer.subscription.updated');
			expect(await eventsStored(event.id), what).toEqual([]);
		}
		expect(await billingOf(s)).toEqual(before);
	});
});

describe('each event once, in the provider\'s order', () => {
	it('handles an event delivered twice only once', async () => {
		const s = await ownedStudio(app);
		await upgrade(app, s, 2);
		const change = await s.client.api('PATCH', `/api/studios/${s.studioId}/billing/subscription`, { seats: 3 });
		expect(change.status).toBe(202);
		await app.payments.idle();
		const updated = app.payments.store.events.filter((e) => e.type === 'customer.subscription.updated').at(-1)!;
		expect((await billingOf(s)).seats.paid).toBe(3);
		// the same event again, and twice at the same moment
		const again = await Promise.all([app.payments.deliver(updated), app.payments.deliver(updated)]);
		for (const r of again) {
			expect(r.status).toBe(200);
			expect(JSON.parse(r.body)).toMatchObject({ received: true, duplicate: true });
		}
		expect(await eventsStored(updated.id)).toEqual([{ id: updated.id, outcome: 'applied' }]);
		expect((await billingOf(s)).seats.paid).toBe(3);
	});

	it('resolves events that arrive in reverse order by the times the provider gave them', async () => {
		const s = await ownedStudio(app);
		app.payments.setWebhookUrl(null); // hold the deliveries back, to send them in the wrong order
		const first = app.payments.store.events.length;
		try {
			const start = await s.client.api('POST', `/api/studios/${s.studioId}/billing/checkout`, { seats: 3, interval: 'year' });
			expect((await checkoutPay((await start.json()).checkout.url)).status).toBe(303);
			await app.payments.idle();
			const subId = app.payments.store.events.slice(first).find((e) => e.type === 'customer.subscription.created')!.data.object.id as string;
			const sub = app.payments.store.subscriptions.get(subId)!;
			// the owner then cancels at period end: a later state of the same subscription
			sub.cancel_at_period_end = true;
			app.payments.store.event('customer.subscription.updated', sub);
		} finally {
			app.payments.setWebhookUrl(`${app.baseUrl}/api/billing/webhook`);
		}
		const held = app.payments.store.events.slice(first);
		expect(held.map((e) => e.type)).toEqual(['customer.subscription.created', 'invoice.paid', 'checkout.session.completed', 'customer.subscription.updated']);
		const outcomes: string[] = [];
		for (const e of [...held].reverse()) {
			const r = await app.payments.deliver(e);
			expect(r.status).toBe(200);
			outcomes.push(`${e.type}: ${JSON.parse(r.body).outcome}`);
		}
		// the created event came last but is older than the stored state: recorded, not applied
		expect(outcomes).toEqual([
			'customer.subscription.updated: applied',
			'checkout.session.completed: applied',
			'invoice.paid: applied',
			'customer.subscription.created: stale'
		]);
		const b = await billingOf(s);
		expect(b.plan.id).toBe('studio');
		expect(b.subscription).toMatchObject({ seats: 3, interval: 'year', cancelAtPeriodEnd: true });
		expect(b.invoices).toHaveLength(1);
	});

	it('records and ignores events of other kinds and of studios it does not know', async () => {
		const other = app.payments.store.event('customer.created', { id: 'cus_elsewhere', object: 'customer', metadata: {} });
		const r = await app.payments.deliver(other);
		expect(JSON.parse(r.body)).toMatchObject({ received: true, duplicate: false, outcome: 'ignored' });
		const stray = app.payments.store.event('invoice.paid', { id: 'in_stray', object: 'invoice', customer: 'cus_nobody', amount_due: 1, amount_paid: 1, currency: 'eur', created: 1, metadata: {} });
		expect(JSON.parse((await app.payments.deliver(stray)).body).outcome).toBe('unknown_studio');
	});
});
