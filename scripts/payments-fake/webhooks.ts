// Posts events to the app's webhook endpoint, signed as the provider signs them (the SDK's own test
// header: `t=<time>,v1=<HMAC-SHA256 of "<time>.<body>" with the endpoint's secret>`), one at a time in
// the order they were made, retrying a refused delivery a few times.
import http from 'node:http';
import Stripe from 'stripe';
import type { FakeEvent } from './store';

export interface Delivery {
	eventId: string;
	type: string;
	status: number | null;
	body: string;
	attempts: number;
}

const signer = new Stripe('sk_test_signing_only', { telemetry: false, maxNetworkRetries: 0 });

export function signatureHeader(payload: string, secret: string): string {
	return signer.webhooks.generateTestHeaderString({ payload, secret });
}

/** One POST of a body to a URL with a Stripe-Signature header (no Origin header, as a server sends). */
export function webhookPost(url: string, payload: string, signature: string | null): Promise<{ status: number; body: string }> {
	return new Promise((resolve, reject) => {
		const u = new URL(url);
		const headers: Record<string, string | number> = { 'content-type': 'application/json', 'content-length': Buffer.byteLength(payload), 'user-agent': 'Dartelier-local-payments-fake' };
		if (signature !== null) headers['stripe-signature'] = signature;
		const req = http.request({ hostname: u.hostname, port: u.port, path: u.pathname + u.search, method: 'POST', headers, timeout: 15_000 }, (res) => {
			let body = '';
			res.setEncoding('utf8');
			res.on('data', (d) => (body += d));
			res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
		});
		req.on('timeout', () => req.destroy(new Error('webhook delivery timed out')));
		req.on('error', reject);
		req.end(payload);
	});
}

export class WebhookQueue {
	readonly deliveries: Delivery[] = [];
	private queue: FakeEvent[] = [];
	private running: Promise<void> | null = null;

	constructor(
		private readonly target: () => string | null,
		private readonly secret: string,
		private readonly log: (line: string) => void
	) {}

	push(events: FakeEvent[]): void {
		this.queue.push(...events);
		this.running ??= this.drain().finally(() => (this.running = null));
	}

	/** Resolves once every event made so far has been delivered (or given up on). */
	async idle(): Promise<void> {
		while (this.running) await this.running;
	}

	/** Delivers one event now, signed (or with the given signature), outside the queue. */
	async deliverNow(event: FakeEvent, signature?: string | null): Promise<{ status: number; body: string }> {
		const url = this.target();
		if (!url) throw new Error('the payments fake has no webhook URL');
		const payload = JSON.stringify(event, null, 2);
		return webhookPost(url, payload, signature === undefined ? signatureHeader(payload, this.secret) : signature);
	}

	private async drain(): Promise<void> {
		while (this.queue.length > 0) {
			const event = this.queue.shift()!;
			const d: Delivery = { eventId: event.id, type: event.type, status: null, body: '', attempts: 0 };
			this.deliveries.push(d);
			if (!this.target()) continue;
			for (const waitMs of [0, 250, 1000, 3000]) {
				if (waitMs) await new Promise((r) => setTimeout(r, waitMs));
				d.attempts += 1;
				try {
					const r = await this.deliverNow(event);
					d.status = r.status;
					d.body = r.body;
					if (r.status >= 200 && r.status < 300) break;
				} catch (e) {
					d.body = e instanceof Error ? e.message : String(e);
				}
			}
			this.log(`${event.type} ${event.id} → ${d.status ?? 'not delivered'}${d.attempts > 1 ? ` after ${d.attempts} attempts` : ''}`);
		}
	}
}
