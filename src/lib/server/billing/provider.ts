import Stripe from 'stripe';
import type { BillingInterval } from '../../billing/plans';
import { ApiError } from '../http-errors';

/**
 * The payment provider's SDK, configured from the environment only (production points it at the real
 * service by setting these, no code changes):
 *   STRIPE_SECRET_KEY       the secret API key (required for billing; without it billing answers 503)
 *   STRIPE_WEBHOOK_SECRET   the signing secret of the webhook endpoint (whsec_…)
 *   STRIPE_API_HOST / STRIPE_API_PORT / STRIPE_API_PROTOCOL
 *                           where the API lives; unset = the provider's own service. `npm start` and the
 *                           tests point them at the local fake (scripts/payments-fake/).
 *   STRIPE_PRICE_STUDIO_MONTHLY / STRIPE_PRICE_STUDIO_YEARLY
 *                           the provider's price ids of the Studio plan per seat (defaults: the fake's)
 */
export interface BillingConfig {
	secretKey: string;
	webhookSecret: string;
	host?: string;
	port?: number;
	protocol?: 'http' | 'https';
	prices: Record<BillingInterval, string>;
}

export const FAKE_PRICE_IDS: Record<BillingInterval, string> = { month: 'price_studio_seat_monthly', year: 'price_studio_seat_yearly' };

export function billingConfig(env: NodeJS.ProcessEnv = process.env): BillingConfig {
	const protocol = env.STRIPE_API_PROTOCOL;
	if (protocol !== undefined && protocol !== 'http' && protocol !== 'https') {
		throw new Error(`STRIPE_API_PROTOCOL must be http or https, not "${protocol}"`);
	}
	const port = env.STRIPE_API_PORT ? Number(env.STRIPE_API_PORT) : undefined;
	if (port !== undefined && !(Number.isInteger(port) && port > 0 && port < 65536)) {
		throw new Error(`STRIPE_API_PORT must be a port number, not "${env.STRIPE_API_PORT}"`);
	}
	return {
		secretKey: env.STRIPE_SECRET_KEY ?? '',
		webhookSecret: env.STRIPE_WEBHOOK_SECRET ?? '',
		host: env.STRIPE_API_HOST || undefined,
		port,
		protocol,
		prices: {
			month: env.STRIPE_PRICE_STUDIO_MONTHLY || FAKE_PRICE_IDS.month,
			year: env.STRIPE_PRICE_STUDIO_YEARLY || FAKE_PRICE_IDS.year
		}
	};
}

let cached: { key: string; client: Stripe } | undefined;

/** The SDK client; 503 when billing is not configured (no secret key). */
export function paymentsClient(config = billingConfig()): Stripe {
	if (!config.secretKey) {
		throw new ApiError(503, 'billing_unavailable', 'Billing is not set up on this server (STRIPE_SECRET_KEY is missing).');
	}
	const key = JSON.stringify([config.secretKey, config.host, config.port, config.protocol]);
	if (cached?.key === key) return cached.client;
	const client = new Stripe(config.secretKey, {
		...(config.host ? { host: config.host } : {}),
		...(config.port ? { port: config.port } : {}),
		...(config.protocol ? { protocol: config.protocol } : {}),
		telemetry: false,
		maxNetworkRetries: 0,
		timeout: 10_000
	});
	cached = { key, client };
	return client;
}

/** The interval of one of our price ids, or null for a price that is not ours. */
export function intervalOfPrice(priceId: string | null | undefined, config = billingConfig()): BillingInterval | null {
	if (priceId === config.prices.month) return 'month';
	if (priceId === config.prices.year) return 'year';
	return null;
}

/** The provider could not be reached or refused: a 502/503 with a message people can act on. */
export function providerError(e: unknown): ApiError {
	if (e instanceof ApiError) return e;
	if (e instanceof Stripe.errors.StripeConnectionError) {
		return new ApiError(503, 'billing_unavailable', 'The payment provider cannot be reached just now. Try again in a few minutes.');
	}
	if (e instanceof Stripe.errors.StripeError) {
		return new ApiError(502, 'billing_provider_error', `The payment provider refused: ${e.message}`);
	}
	throw e;
}
