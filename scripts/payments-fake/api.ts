// The provider's API endpoints the app's SDK calls: customers, checkout sessions, billing-portal
// sessions, subscriptions (retrieve, update) and the invoices list. Requests come form-encoded, answers
// go out as the provider's JSON objects; errors as `{ error: { type, message, param? } }`.
import { bool, formParse, int, list, metadataOf, obj, str, type FormObject } from './form';
import { clone, newId, nowS, type FakeEvent, type FakeStore, type Json } from './store';

export interface ApiAnswer {
	status: number;
	body: Json;
	/** events the request made, to be delivered to the app */
	events?: FakeEvent[];
}

const notFound = (what: string, id: string): ApiAnswer => ({
	status: 404,
	body: { error: { type: 'invalid_request_error', code: 'resource_missing', message: `No such ${what}: '${id}'` } }
});
const invalid = (message: string, param?: string): ApiAnswer => ({
	status: 400,
	body: { error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } }
});
const ok = (body: Json, events?: FakeEvent[]): ApiAnswer => ({ status: 200, body: clone(body), events });

function customers(store: FakeStore, method: string, id: string | undefined, f: FormObject): ApiAnswer {
	if (method === 'POST' && !id) {
		return ok(store.customerCreate({ email: str(f.email), name: str(f.name), metadata: metadataOf(f.metadata) }));
	}
	if (method === 'GET' && id) {
		const c = store.customers.get(id);
		return c ? ok(c) : notFound('customer', id);
	}
	return invalid(`Unrecognized request URL (${method} /v1/customers${id ? `/${id}` : ''}).`);
}

function checkoutSessions(store: FakeStore, method: string, id: string | undefined, f: FormObject): ApiAnswer {
	if (method === 'GET' && id) {
		const s = store.checkoutSessions.get(id);
		if (!s) return notFound('checkout.session', id);
		const { line_items: _items, ...shown } = s;
		return ok(shown);
	}
	if (method !== 'POST' || id) return invalid(`Unrecognized request URL (${method} /v1/checkout/sessions).`);
	if (str(f.mode) !== 'subscription') return invalid('This fake takes mode=subscription only.', 'mode');
	const customer = str(f.customer);
	if (!customer || !store.customers.has(customer)) return invalid(`No such customer: '${customer ?? ''}'`, 'customer');
	for (const key of ['success_url', 'cancel_url']) if (!str(f[key])) return invalid(`Missing required param: ${key}.`, key);
	const items = list(f.line_items).map((li) => ({ price: str(obj(li).price) ?? '', quantity: int(obj(li).quantity) ?? 1 }));
	if (items.length !== 1) return invalid('Send exactly one line item.', 'line_items');
	if (!store.price(items[0].price)) return invalid(`No such price: '${items[0].price}'`, 'line_items[0][price]');
	if (items[0].quantity < 1) return invalid('Quantity must be at least 1.', 'line_items[0][quantity]');
	const sid = newId('cs_test');
	const session = {
		id: sid,
		object: 'checkout.session',
		mode: 'subscription',
		status: 'open',
		payment_status: 'unpaid',
		customer,
		client_reference_id: str(f.client_reference_id) ?? null,
		metadata: metadataOf(f.metadata),
		subscription_data_metadata: metadataOf(obj(f.subscription_data).metadata),
		success_url: str(f.success_url)!,
		cancel_url: str(f.cancel_url)!,
		subscription: null,
		created: nowS(),
		expires_at: nowS() + 24 * 3600,
		livemode: false,
		url: `${store.baseUrl()}/checkout/${sid}`,
		line_items: items
	};
	store.checkoutSessions.set(sid, session);
	const { line_items: _items, subscription_data_metadata: _m, ...shown } = session;
	return ok(shown);
}

function portalSessions(store: FakeStore, method: string, f: FormObject): ApiAnswer {
	if (method !== 'POST') return invalid('Unrecognized request URL.');
	const customer = str(f.customer);
	if (!customer || !store.customers.has(customer)) return invalid(`No such customer: '${customer ?? ''}'`, 'customer');
	const id = newId('bps');
	const flow = str(obj(f.flow_data).type);
	const session = {
		id,
		object: 'billing_portal.session',
		customer,
		return_url: str(f.return_url) ?? null,
		flow: flow ? { type: flow } : null,
		created: nowS(),
		livemode: false,
		url: `${store.baseUrl()}/portal/${id}${flow ? `?flow=${encodeURIComponent(flow)}` : ''}`
	};
	store.portalSessions.set(id, session);
	return ok(session);
}

function subscriptions(store: FakeStore, method: string, id: string | undefined, f: FormObject): ApiAnswer {
	if (!id) return invalid('This fake has no subscription list or creation: subscriptions start at checkout.');
	const sub = store.subscriptions.get(id);
	if (!sub) return notFound('subscription', id);
	if (method === 'GET') return ok(sub);
	if (method !== 'POST') return invalid(`Unrecognized request URL (${method} /v1/subscriptions/${id}).`);
	if (sub.status === 'canceled') return invalid('A canceled subscription can only update its metadata.');
	const item = sub.items.data[0];
	for (const change of list(f.items).map(obj)) {
		if (str(change.id) !== item.id) return invalid(`No such subscription item: '${str(change.id) ?? ''}'`, 'items');
		const quantity = int(change.quantity);
		if (change.quantity !== undefined && (quantity === undefined || quantity < 1)) return invalid('Quantity must be at least 1.', 'items[0][quantity]');
		const priceId = str(change.price);
		if (priceId !== undefined) {
			const price = store.price(priceId);
			if (!price) return invalid(`No such price: '${priceId}'`, 'items[0][price]');
			item.price = clone(price);
		}
		if (quantity !== undefined) item.quantity = quantity;
	}
	const cancel = bool(f.cancel_at_period_end);
	if (cancel !== undefined) {
		sub.cancel_at_period_end = cancel;
		sub.canceled_at = cancel ? nowS() : null;
		sub.cancel_at = cancel ? item.current_period_end : null;
	}
	return ok(sub, [store.event('customer.subscription.updated', sub)]);
}

function invoices(store: FakeStore, method: string, id: string | undefined, q: URLSearchParams): ApiAnswer {
	if (method === 'GET' && id) {
		const i = store.invoices.get(id);
		return i ? ok(i) : notFound('invoice', id);
	}
	if (method !== 'GET') return invalid('Unrecognized request URL.');
	const limit = Math.min(100, Number(q.get('limit') ?? 10) || 10);
	const customer = q.get('customer');
	const all = [...store.invoices.values()].filter((i) => !customer || i.customer === customer).sort((a, b) => b.created - a.created);
	return ok({ object: 'list', url: '/v1/invoices', has_more: all.length > limit, data: all.slice(0, limit) });
}

/** Answers one /v1 request. */
export function apiAnswer(store: FakeStore, method: string, pathname: string, body: string, query: URLSearchParams): ApiAnswer {
	const f = formParse(body);
	const parts = pathname.replace(/^\/v1\//, '').split('/').filter(Boolean);
	const [a, b, c] = parts;
	if (a === 'customers') return customers(store, method, b, f);
	if (a === 'checkout' && b === 'sessions') return checkoutSessions(store, method, c, f);
	if (a === 'billing_portal' && b === 'sessions') return portalSessions(store, method, f);
	if (a === 'subscriptions') return subscriptions(store, method, b, f);
	if (a === 'invoices') return invoices(store, method, b, query);
	return { status: 404, body: { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${method} ${pathname}). This local fake implements only what Dartelier uses.` } } };
}
