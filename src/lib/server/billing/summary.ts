import { log } from '../log';
import { PLAN_NAMES, planAllows } from '../../billing/plans';
import type { BillingSummary } from '../../billing/summary';

export type { BillingSummary };
import type { Db } from '../db';
import { billingInvoicesOfStudio, billingInvoiceUpsert, type InvoiceRow } from '../repositories/billing';
import { studioPlan } from './plan';
import { paymentsClient } from './provider';

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

/** The studio's invoices from the provider (kept as last seen), or the ones last seen when it cannot be reached. */
async function invoicesOf(db: Db, studioId: string, customerId: string | null): Promise<{ rows: InvoiceRow[]; fresh: boolean }> {
	if (!customerId) return { rows: await billingInvoicesOfStudio(db, studioId), fresh: true };
	try {
		const list = await paymentsClient().invoices.list({ customer: customerId, limit: 24 });
		for (const i of list.data) {
			if (!i.id) continue;
			await billingInvoiceUpsert(db, {
				id: i.id,
				studio_id: studioId,
				number: i.number ?? null,
				status: i.status ?? 'draft',
				amount_due: i.amount_due,
				amount_paid: i.amount_paid,
				currency: i.currency,
				hosted_url: i.hosted_invoice_url ?? null,
				provider_created_at: new Date(i.created * 1000)
			});
		}
		return { rows: await billingInvoicesOfStudio(db, studioId), fresh: true };
	} catch (e) {
		log.warn({ studioId, err: e }, 'invoices from the payment provider failed, showing the ones last seen');
		return { rows: await billingInvoicesOfStudio(db, studioId), fresh: false };
	}
}

export async function billingSummary(db: Db, studioId: string, options: { invoices?: boolean } = {}): Promise<BillingSummary> {
	const { state, billing: b, usage, exceeded } = await studioPlan(db, studioId);
	const invoices = options.invoices === false ? { rows: [], fresh: false } : await invoicesOf(db, studioId, b?.customer_id ?? null);
	return {
		plan: { id: state.plan, name: PLAN_NAMES[state.plan] },
		seats: {
			paid: state.plan === 'studio' ? state.seatsPaid : null,
			limit: planAllows(state, 'seats') ?? 0,
			used: usage.seats,
			members: usage.members,
			invitations: usage.invitations
		},
		styles: { used: usage.styles, limit: planAllows(state, 'styles') },
		subscription:
			b?.subscription_id && b.status
				? {
						id: b.subscription_id,
						status: b.status,
						interval: b.interval,
						seats: b.seats,
						cancelAtPeriodEnd: b.cancel_at_period_end,
						currentPeriodEnd: iso(b.current_period_end),
						canceledAt: iso(b.canceled_at),
						updatedAt: iso(b.provider_updated_at)
					}
				: null,
		hasBillingAccount: Boolean(b?.customer_id),
		paymentFailedAt: iso(b?.payment_failed_at),
		exceeded,
		invoices: invoices.rows.map((i) => ({
			id: i.id,
			number: i.number,
			date: i.provider_created_at.toISOString(),
			amountMinor: i.status === 'paid' ? i.amount_paid : i.amount_due,
			currency: i.currency,
			status: i.status,
			url: i.hosted_url
		})),
		invoicesFresh: invoices.fresh
	};
}
