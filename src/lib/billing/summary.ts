import type { LimitName, PlanId } from './plans';

/** What GET /api/studios/{studioId}/billing answers, and what the Billing page shows. */
export interface BillingSummary {
	plan: { id: PlanId; name: string };
	seats: { paid: number | null; limit: number; used: number; members: number; invitations: number };
	styles: { used: number; limit: number | null };
	subscription: {
		id: string;
		status: string;
		interval: 'month' | 'year' | null;
		seats: number;
		cancelAtPeriodEnd: boolean;
		currentPeriodEnd: string | null;
		canceledAt: string | null;
		updatedAt: string | null;
	} | null;
	hasBillingAccount: boolean;
	paymentFailedAt: string | null;
	exceeded: LimitName[];
	invoices: { id: string; number: string | null; date: string; amountMinor: number; currency: string; status: string; url: string | null }[];
	/** false when the provider could not be asked and the invoices are the ones last seen */
	invoicesFresh: boolean;
}

