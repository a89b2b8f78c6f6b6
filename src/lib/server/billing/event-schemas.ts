import type Stripe from 'stripe';
import { z } from 'zod';
import { ApiError } from '../http-errors';
import { fieldErrors } from '../validation';

/**
 * The parts of the provider's events this app reads, checked with zod after the signature: a signed
 * event whose object lacks them is refused (400, nothing stored) rather than read half. Objects keep
 * every other field they carry (the provider adds fields over time).
 */
const idOrObject = z.union([z.string(), z.object({ id: z.string() }).loose()]).nullable().optional();
const metadata = z.record(z.string(), z.string()).nullable().optional();
const unixTime = z.number().int().nonnegative();

const envelopeSchema = z
	.object({
		id: z.string().min(1),
		type: z.string().min(1),
		created: unixTime,
		data: z.object({ object: z.object({}).loose() }).loose()
	})
	.loose();

const checkoutSessionSchema = z.object({ customer: idOrObject, client_reference_id: z.string().nullable().optional(), metadata }).loose();

const subscriptionSchema = z
	.object({
		id: z.string().min(1),
		status: z.string().min(1),
		customer: idOrObject,
		metadata,
		cancel_at_period_end: z.boolean(),
		canceled_at: unixTime.nullable().optional(),
		ended_at: unixTime.nullable().optional(),
		items: z
			.object({
				data: z.array(
					z
						.object({
							quantity: z.number().int().nonnegative().optional(),
							current_period_end: unixTime.optional(),
							price: z
								.object({ id: z.string(), recurring: z.object({ interval: z.string() }).loose().nullable().optional() })
								.loose()
								.nullable()
								.optional()
						})
						.loose()
				)
			})
			.loose()
			.optional()
	})
	.loose();

const invoiceSchema = z
	.object({
		id: z.string().optional(),
		customer: idOrObject,
		metadata,
		number: z.string().nullable().optional(),
		status: z.string().nullable().optional(),
		amount_due: z.number().int().nonnegative(),
		amount_paid: z.number().int().nonnegative(),
		currency: z.string().min(3),
		hosted_invoice_url: z.string().nullable().optional(),
		created: unixTime.optional()
	})
	.loose();

const OBJECT_SCHEMAS: Record<string, z.ZodType> = {
	'checkout.session.completed': checkoutSessionSchema,
	'customer.subscription.created': subscriptionSchema,
	'customer.subscription.updated': subscriptionSchema,
	'customer.subscription.deleted': subscriptionSchema,
	'invoice.paid': invoiceSchema,
	'invoice.payment_failed': invoiceSchema
};

/** Checks a verified event's envelope and, for the kinds this app handles, its object; 400 if they do not fit. */
export function webhookEventCheck(event: Stripe.Event): Stripe.Event {
	const envelope = envelopeSchema.safeParse(event);
	if (!envelope.success) throw new ApiError(400, 'invalid', 'The event does not have the fields of a provider event.', fieldErrors(envelope.error));
	const schema = OBJECT_SCHEMAS[event.type];
	if (schema) {
		const object = schema.safeParse(event.data.object);
		if (!object.success) {
			throw new ApiError(400, 'invalid', `The ${event.type} event's object lacks fields this app reads; nothing was changed.`, fieldErrors(object.error));
		}
	}
	return event;
}
