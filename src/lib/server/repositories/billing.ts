import { sql } from 'kysely';
import type { DbOrTx } from '../db';
import type { BillingEventsTable } from '../db/schema';

export interface StudioBillingRow {
	studio_id: string;
	customer_id: string | null;
	subscription_id: string | null;
	status: string | null;
	price_id: string | null;
	interval: 'month' | 'year' | null;
	seats: number;
	cancel_at_period_end: boolean;
	current_period_end: Date | null;
	canceled_at: Date | null;
	ended_at: Date | null;
	provider_updated_at: Date | null;
	payment_failed_at: Date | null;
}

/** A subscription as the provider showed it at `providerUpdatedAt`. */
export interface SubscriptionState {
	subscriptionId: string;
	status: string;
	priceId: string | null;
	interval: 'month' | 'year' | null;
	seats: number;
	cancelAtPeriodEnd: boolean;
	currentPeriodEnd: Date | null;
	canceledAt: Date | null;
	endedAt: Date | null;
	providerUpdatedAt: Date;
}

export interface InvoiceRow {
	id: string;
	studio_id: string;
	number: string | null;
	status: string;
	amount_due: number;
	amount_paid: number;
	currency: string;
	hosted_url: string | null;
	provider_created_at: Date;
}

const COLUMNS = [
	'studio_id',
	'customer_id',
	'subscription_id',
	'status',
	'price_id',
	'interval',
	'seats',
	'cancel_at_period_end',
	'current_period_end',
	'canceled_at',
	'ended_at',
	'provider_updated_at',
	'payment_failed_at'
] as const;

export async function billingOfStudio(db: DbOrTx, studioId: string): Promise<StudioBillingRow | undefined> {
	return db.selectFrom('studio_billing').select(COLUMNS).where('studio_id', '=', studioId).executeTakeFirst();
}

/** The studio's billing row, made empty when missing, locked (FOR UPDATE) for the rest of the transaction. */
export async function billingLocked(db: DbOrTx, studioId: string): Promise<StudioBillingRow> {
	await db.insertInto('studio_billing').values({ studio_id: studioId }).onConflict((oc) => oc.column('studio_id').doNothing()).execute();
	return db.selectFrom('studio_billing').select(COLUMNS).where('studio_id', '=', studioId).forUpdate().executeTakeFirstOrThrow();
}

export async function billingStudioOfCustomer(db: DbOrTx, customerId: string): Promise<string | undefined> {
	const row = await db.selectFrom('studio_billing').select('studio_id').where('customer_id', '=', customerId).executeTakeFirst();
	return row?.studio_id;
}

export async function billingCustomerSet(db: DbOrTx, studioId: string, customerId: string): Promise<void> {
	await db
		.insertInto('studio_billing')
		.values({ studio_id: studioId, customer_id: customerId })
		.onConflict((oc) => oc.column('studio_id').doUpdateSet({ customer_id: customerId, updated_at: sql`now()` }))
		.execute();
}

export async function billingSubscriptionSet(db: DbOrTx, studioId: string, s: SubscriptionState): Promise<void> {
	await db
		.updateTable('studio_billing')
		.set({
			subscription_id: s.subscriptionId,
			status: s.status,
			price_id: s.priceId,
			interval: s.interval,
			seats: s.seats,
			cancel_at_period_end: s.cancelAtPeriodEnd,
			current_period_end: s.currentPeriodEnd,
			canceled_at: s.canceledAt,
			ended_at: s.endedAt,
			provider_updated_at: s.providerUpdatedAt,
			updated_at: sql`now()`
		})
		.where('studio_id', '=', studioId)
		.execute();
}

export async function billingPaymentFailedSet(db: DbOrTx, studioId: string, at: Date | null): Promise<void> {
	await db.updateTable('studio_billing').set({ payment_failed_at: at, updated_at: sql`now()` }).where('studio_id', '=', studioId).execute();
}

/** Replaces the studio's billing row as a whole (the demo seed keeps it in step with the local fake). */
export async function billingReplace(db: DbOrTx, row: StudioBillingRow): Promise<void> {
	await db.deleteFrom('studio_billing').where('studio_id', '=', row.studio_id).execute();
	await db.insertInto('studio_billing').values(row).execute();
}

export async function billingForget(db: DbOrTx, studioId: string): Promise<void> {
	await db.deleteFrom('studio_billing').where('studio_id', '=', studioId).execute();
	await db.deleteFrom('billing_invoices').where('studio_id', '=', studioId).execute();
}

/**
 * Records a provider event by id. Returns false when it was recorded before (it is then not handled
 * again). Call in the transaction that applies it, so the id and the change commit together.
 */
export async function billingEventRecord(
	db: DbOrTx,
	e: { id: string; type: string; studioId: string | null; providerCreatedAt: Date; outcome: BillingEventsTable['outcome'] }
): Promise<boolean> {
	const r = await db
		.insertInto('billing_events')
		.values({ id: e.id, type: e.type, studio_id: e.studioId, provider_created_at: e.providerCreatedAt, outcome: e.outcome })
		.onConflict((oc) => oc.column('id').doNothing())
		.executeTakeFirst();
	return Number(r.numInsertedOrUpdatedRows ?? 0) > 0;
}

export async function billingEventOutcomeSet(db: DbOrTx, id: string, studioId: string | null, outcome: BillingEventsTable['outcome']): Promise<void> {
	await db.updateTable('billing_events').set({ outcome, studio_id: studioId }).where('id', '=', id).execute();
}

export async function billingEventsCount(db: DbOrTx, id: string): Promise<number> {
	const r = await db.selectFrom('billing_events').select((eb) => eb.fn.countAll<number>().as('n')).where('id', '=', id).executeTakeFirstOrThrow();
	return Number(r.n);
}

export async function billingInvoiceUpsert(db: DbOrTx, i: InvoiceRow): Promise<void> {
	const { id, ...rest } = i;
	await db
		.insertInto('billing_invoices')
		.values(i)
		.onConflict((oc) => oc.column('id').doUpdateSet({ ...rest, updated_at: sql`now()` }))
		.execute();
}

export async function billingInvoicesOfStudio(db: DbOrTx, studioId: string, limit = 24): Promise<InvoiceRow[]> {
	return db
		.selectFrom('billing_invoices')
		.select(['id', 'studio_id', 'number', 'status', 'amount_due', 'amount_paid', 'currency', 'hosted_url', 'provider_created_at'])
		.where('studio_id', '=', studioId)
		.orderBy('provider_created_at', 'desc')
		.limit(limit)
		.execute();
}

/** What counts toward the studio's seats: members with a role and pending (open) invitations. */
export async function billingSeatUsage(db: DbOrTx, studioId: string): Promise<{ members: number; invitations: number }> {
	const r = await db
		.selectNoFrom((eb) => [
			eb.selectFrom('memberships').select(eb.fn.countAll<number>().as('n')).where('studio_id', '=', studioId).as('members'),
			eb
				.selectFrom('invitations')
				.select(eb.fn.countAll<number>().as('n'))
				.where('studio_id', '=', studioId)
				.where('used_at', 'is', null)
				.where('expires_at', '>', new Date())
				.as('invitations')
		])
		.executeTakeFirstOrThrow();
	return { members: Number(r.members ?? 0), invitations: Number(r.invitations ?? 0) };
}

export async function billingStylesCount(db: DbOrTx, studioId: string): Promise<number> {
	const r = await db.selectFrom('styles').select((eb) => eb.fn.countAll<number>().as('n')).where('studio_id', '=', studioId).executeTakeFirstOrThrow();
	return Number(r.n);
}

/** The studio's owners, for billing e-mails. */
export async function billingOwners(db: DbOrTx, studioId: string): Promise<{ email: string; name: string }[]> {
	return db
		.selectFrom('memberships')
		.innerJoin('users', 'users.id', 'memberships.user_id')
		.select(['users.email', 'users.name'])
		.where('memberships.studio_id', '=', studioId)
		.where('memberships.role', '=', 'owner')
		.orderBy('users.email')
		.execute();
}

/** The studios this person owns that are not on a live paid subscription (the Sketch plan's). */
export async function billingSketchStudiosOwned(db: DbOrTx, userId: string, liveStatuses: readonly string[]): Promise<{ id: string; name: string }[]> {
	return db
		.selectFrom('memberships')
		.innerJoin('studios', 'studios.id', 'memberships.studio_id')
		.leftJoin('studio_billing', 'studio_billing.studio_id', 'memberships.studio_id')
		.select(['studios.id', 'studios.name'])
		.where('memberships.user_id', '=', userId)
		.where('memberships.role', '=', 'owner')
		.where((eb) =>
			eb.or([
				eb('studio_billing.status', 'is', null),
				eb('studio_billing.status', 'not in', [...liveStatuses]),
				eb('studio_billing.seats', '<=', 0)
			])
		)
		.orderBy('studios.name')
		.execute();
}
