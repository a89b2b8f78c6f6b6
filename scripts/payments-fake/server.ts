// A local fake of the payment provider's HTTP API, for `npm start` and the tests: the app's SDK is
// pointed at it (STRIPE_API_HOST/PORT/PROTOCOL), it keeps its state in memory, serves a checkout page
// and a customer-management page, and posts signed webhook events to the app. Loopback only.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import demoBilling from '../../fixtures/demo-billing.json';
import { demoPeriod, demoPeriodBefore } from '../../src/lib/billing/demo';
import { apiAnswer } from './api';
import { formParse, str } from './form';
import { checkoutPage, DECLINED_CARD, invoicePage, portalPage, TEST_CARD } from './pages';
import { FakeStore, type FakeEvent, type Json } from './store';
import { WebhookQueue, type Delivery } from './webhooks';

export const PAYMENTS_FAKE_DEFAULT_PORT = 4176;
export const PAYMENTS_FAKE_KEY = 'sk_test_dartelier_local';
export const PAYMENTS_FAKE_WEBHOOK_SECRET = 'whsec_dartelier_local';

export interface PaymentsFakeOptions {
	/** 0 = any free port */
	port?: number;
	secretKey?: string;
	webhookSecret?: string;
	webhookUrl?: string | null;
	/** seed the demo studio's customer, subscription and invoices (fixtures/demo-billing.json) */
	demo?: boolean;
	log?: (line: string) => void;
}

export interface PaymentsFake {
	url: string;
	port: number;
	store: FakeStore;
	deliveries: Delivery[];
	setWebhookUrl(url: string | null): void;
	/** waits until every event made so far has been delivered */
	idle(): Promise<void>;
	/** posts one event now, outside the queue: signed, or with the given signature (null: none) */
	deliver(event: FakeEvent, signature?: string | null): Promise<{ status: number; body: string }>;
	/** starts the subscription's next period, its payment taken or failed; the events are delivered */
	renew(subscriptionId: string, paid: boolean): FakeEvent[];
	close(): Promise<void>;
}

const HTML = { 'content-type': 'text/html; charset=utf-8', 'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; form-action *" };

function read(req: http.IncomingMessage): Promise<string> {
	return new Promise((resolve, reject) => {
		let body = '';
		req.setEncoding('utf8');
		req.on('data', (d) => (body += d));
		req.on('end', () => resolve(body));
		req.on('error', reject);
	});
}

function demoSeed(store: FakeStore): void {
	const d = demoBilling.paid;
	const price = store.price(d.price)!;
	store.customerCreate({ id: d.customer, name: d.studio, metadata: {} });
	const now = Date.now();
	const sub = store.subscriptionCreate({ id: d.subscription, customer: d.customer, price, quantity: d.seats, metadata: {}, startS: demoPeriodBefore(now, d.invoicesBefore) });
	const item = sub.items.data[0];
	for (let back = d.invoicesBefore; back >= 0; back--) {
		item.current_period_start = demoPeriodBefore(now, back);
		item.current_period_end = back === 0 ? demoPeriod(now).endS : demoPeriodBefore(now, back - 1);
		store.invoiceFor(sub, true, item.current_period_start);
	}
}

export async function paymentsFakeStart(options: PaymentsFakeOptions = {}): Promise<PaymentsFake> {
	const secretKey = options.secretKey ?? PAYMENTS_FAKE_KEY;
	const log = options.log ?? (() => {});
	let baseUrl = '';
	let webhookUrl = options.webhookUrl ?? null;
	const store = new FakeStore(() => baseUrl);
	const cards = new Map<string, string>(); // customer → last 4 digits
	const queue = new WebhookQueue(() => webhookUrl, options.webhookSecret ?? PAYMENTS_FAKE_WEBHOOK_SECRET, (l) => log(`[payments-fake] ${l}`));
	if (options.demo) demoSeed(store);
	const emit = (events: FakeEvent[] | undefined) => events && events.length > 0 && queue.push(events);

	async function pages(req: http.IncomingMessage, res: http.ServerResponse, url: URL): Promise<void> {
		const [kind, id, action] = url.pathname.split('/').filter(Boolean);
		const send = (status: number, html: string): void => void res.writeHead(status, HTML).end(html);
		const redirect = (to: string): void => void res.writeHead(303, { location: to }).end();
		if (kind === 'invoices' && id && req.method === 'GET') {
			const i = store.invoices.get(id);
			return i ? send(200, invoicePage(i)) : send(404, 'No such invoice');
		}
		if (kind === 'checkout' && id) {
			const s = store.checkoutSessions.get(id);
			if (!s) return send(404, 'No such checkout');
			const li = s.line_items[0];
			const price = store.price(li.price)!;
			if (req.method === 'GET' && !action) return send(200, checkoutPage(s, price, li.quantity));
			if (req.method === 'POST' && action === 'cancel') return redirect(String(s.cancel_url));
			if (req.method !== 'POST' || action !== 'pay') return send(404, 'Not found');
			if (s.status !== 'open') return send(409, checkoutPage(s, price, li.quantity));
			const card = (str(formParse(await read(req)).card) ?? '').replace(/\D/g, '');
			if (card === DECLINED_CARD.replace(/\D/g, '')) return send(402, checkoutPage(s, price, li.quantity, 'Your card was declined.'));
			if (card !== TEST_CARD.replace(/\D/g, '')) return send(400, checkoutPage(s, price, li.quantity, `Use the test card ${TEST_CARD}.`));
			const sub = store.subscriptionCreate({ customer: String(s.customer), price, quantity: li.quantity, metadata: s.subscription_data_metadata as Record<string, string> });
			const invoice = store.invoiceFor(sub, true);
			cards.set(String(s.customer), card.slice(-4));
			Object.assign(s, { status: 'complete', payment_status: 'paid', subscription: sub.id });
			const { line_items: _l, subscription_data_metadata: _m, ...shown } = s;
			emit([store.event('customer.subscription.created', sub), store.event('invoice.paid', invoice), store.event('checkout.session.completed', shown)]);
			return redirect(String(s.success_url).replace('{CHECKOUT_SESSION_ID}', s.id as string));
		}
		if (kind === 'portal' && id) {
			const p = store.portalSessions.get(id);
			if (!p) return send(404, 'No such session');
			const customer = String(p.customer);
			const subs = [...store.subscriptions.values()].filter((x) => x.customer === customer);
			if (req.method === 'GET' && !action) return send(200, portalPage(p, subs, cards.get(customer) ?? null));
			if (req.method !== 'POST') return send(404, 'Not found');
			const f = formParse(await read(req));
			if (action === 'card') {
				const card = (str(f.card) ?? '').replace(/\D/g, '');
				if (card.length >= 12) cards.set(customer, card.slice(-4));
				return redirect(`/portal/${id}`);
			}
			const sub = subs.find((x) => x.id === str(f.subscription));
			if (!sub || (action !== 'cancel' && action !== 'resume')) return send(404, 'No such subscription');
			const cancel = action === 'cancel';
			sub.cancel_at_period_end = cancel;
			sub.canceled_at = cancel ? Math.floor(Date.now() / 1000) : null;
			sub.cancel_at = cancel ? sub.items.data[0].current_period_end : null;
			emit([store.event('customer.subscription.updated', sub)]);
			return redirect(`/portal/${id}`);
		}
		send(404, 'Not found');
	}

	/** Control of the fake itself (not the provider's API): renewals and ends, for tests and people. */
	function control(method: string, url: URL): { status: number; body: Json } {
		const [, , kind, id, action] = url.pathname.split('/');
		if (method === 'GET' && kind === 'events') return { status: 200, body: { events: store.events, deliveries: queue.deliveries } };
		const sub = kind === 'subscriptions' && id ? store.subscriptions.get(id) : undefined;
		if (method !== 'POST' || !sub) return { status: 404, body: { error: { message: 'No such control path or subscription.' } } };
		if (action === 'renew' || action === 'fail-renewal') return { status: 200, body: { events: fake.renew(sub.id, action === 'renew') } };
		if (action === 'end') {
			const e = store.end(sub);
			emit([e]);
			return { status: 200, body: { events: [e] } };
		}
		return { status: 404, body: { error: { message: `Unknown action ${action}.` } } };
	}

	const server = http.createServer((req, res) => {
		const url = new URL(req.url ?? '/', 'http://127.0.0.1');
		const json = (status: number, body: Json) =>
			res.writeHead(status, { 'content-type': 'application/json', 'request-id': `req_${Date.now().toString(36)}` }).end(JSON.stringify(body));
		(async () => {
			const isApi = url.pathname.startsWith('/v1/');
			if (isApi || url.pathname.startsWith('/_fake/')) {
				if (req.headers.authorization !== `Bearer ${secretKey}`) {
					return json(401, { error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } });
				}
				if (!isApi) {
					const r = control(req.method ?? 'GET', url);
					return json(r.status, r.body);
				}
				const r = apiAnswer(store, req.method ?? 'GET', url.pathname, await read(req), url.searchParams);
				emit(r.events);
				return json(r.status, r.body);
			}
			await pages(req, res, url);
		})().catch((e: unknown) => {
			log(`[payments-fake] ${req.method} ${url.pathname} failed: ${e instanceof Error ? e.stack : e}`);
			if (!res.headersSent) json(500, { error: { type: 'api_error', message: 'The local payments fake failed; see its log.' } });
		});
	});
	await new Promise<void>((resolve, reject) => {
		server.once('error', reject);
		server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
	});
	const port = (server.address() as AddressInfo).port;
	baseUrl = `http://127.0.0.1:${port}`;
	const fake: PaymentsFake = {
		url: baseUrl,
		port,
		store,
		deliveries: queue.deliveries,
		setWebhookUrl: (u) => (webhookUrl = u),
		idle: () => queue.idle(),
		deliver: (event, signature) => queue.deliverNow(event, signature),
		renew(subscriptionId, paid) {
			const sub = store.subscriptions.get(subscriptionId);
			if (!sub) throw new Error(`no subscription ${subscriptionId} in the payments fake`);
			const events = store.renew(sub, paid);
			emit(events);
			return events;
		},
		close: () =>
			new Promise<void>((resolve) => {
				server.closeAllConnections();
				server.close(() => resolve());
			})
	};
	return fake;
}
