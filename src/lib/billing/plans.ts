/**
 * The studio plans and their rules (ours, not the payment provider's). Pure: shared by the server (which
 * enforces them) and the pages (which show them). The provider only knows a price and a quantity; what a
 * plan allows is decided here.
 *
 *   Sketch (free): one studio per owner, up to 3 seats, up to 5 styles, size runs of up to 3 sizes.
 *   Studio (per seat, monthly or yearly): seats up to the quantity paid for, everything else open.
 *
 * Seats: every member with a role counts, and so does every pending invitation. Nothing already made is
 * ever hidden or deleted past a limit: only new work past it is refused.
 */
export const PLAN_IDS = ['sketch', 'studio'] as const;
export type PlanId = (typeof PLAN_IDS)[number];
export const BILLING_INTERVALS = ['month', 'year'] as const;
export type BillingInterval = (typeof BILLING_INTERVALS)[number];

export const PLAN_NAMES: Record<PlanId, string> = { sketch: 'Sketch', studio: 'Studio' };

/** What the Sketch plan allows. Size runs do not exist in the product yet: the limit waits here for them. */
export const SKETCH_LIMITS = { studiosOwned: 1, seats: 3, styles: 5, sizesPerRun: 3 } as const;

/** The most seats one Studio subscription may have (a guard against typing errors, not a sales limit). */
export const STUDIO_MAX_SEATS = 200;

/** Studio plan prices per seat, in the currency's minor unit; the provider's prices must say the same. */
export const STUDIO_PRICES: Record<BillingInterval, { perSeatMinor: number; currency: string }> = {
	month: { perSeatMinor: 1500, currency: 'eur' },
	year: { perSeatMinor: 15000, currency: 'eur' }
};

/** The plan a studio is on now: Studio with its paid seats, or Sketch. */
export type PlanState = { plan: 'sketch' } | { plan: 'studio'; seatsPaid: number };

export type LimitName = 'seats' | 'styles' | 'sizes_per_run' | 'studios_owned';

export type LimitCheck =
	| { ok: true }
	| { ok: false; limit: LimitName; allowed: number; used: number; message: string };

const WHO_CAN_CHANGE = "The studio's owner can change the plan on the Billing page.";

const WHAT: Record<LimitName, (n: number) => string> = {
	seats: (n) => `${n} ${n === 1 ? 'seat' : 'seats'} (members and pending invitations)`,
	styles: (n) => `${n} ${n === 1 ? 'style' : 'styles'}`,
	sizes_per_run: (n) => `${n} ${n === 1 ? 'size' : 'sizes'} in a size run`,
	studios_owned: (n) => `${n} ${n === 1 ? 'studio' : 'studios'} per owner`
};

/** How many of a thing the plan allows; null = no limit. */
export function planAllows(state: PlanState, limit: LimitName): number | null {
	if (state.plan === 'studio') return limit === 'seats' ? state.seatsPaid : null;
	switch (limit) {
		case 'seats':
			return SKETCH_LIMITS.seats;
		case 'styles':
			return SKETCH_LIMITS.styles;
		case 'sizes_per_run':
			return SKETCH_LIMITS.sizesPerRun;
		case 'studios_owned':
			return SKETCH_LIMITS.studiosOwned;
	}
}

/**
 * May the studio go from `used` to `used + adding` of a thing? Refusals name the limit, the plan and who
 * can change it (the API answers them 402, the pages show them with a link for the owner).
 */
export function limitCheck(state: PlanState, limit: LimitName, used: number, adding = 1): LimitCheck {
	const allowed = planAllows(state, limit);
	if (allowed === null || used + adding <= allowed) return { ok: true };
	const plan =
		state.plan === 'studio'
			? `This studio has ${WHAT[limit](allowed)} paid for on the Studio plan`
			: `The Sketch plan allows ${WHAT[limit](allowed)}`;
	const change =
		state.plan === 'studio' && limit === 'seats'
			? "The studio's owner can add seats on the Billing page."
			: WHO_CAN_CHANGE;
	return { ok: false, limit, allowed, used, message: `${plan}, and ${used} ${used === 1 ? 'is' : 'are'} in use. ${change}` };
}

/** A size run of this many sizes: allowed on the plan? (Size runs come later; the rule is ready.) */
export function sizeRunCheck(state: PlanState, sizes: number): LimitCheck {
	return limitCheck(state, 'sizes_per_run', sizes, 0);
}

/** Going down to `seats` paid seats while `used` are in use: refused with what to do first. */
export function seatsReductionCheck(seats: number, used: { members: number; invitations: number }): LimitCheck {
	const inUse = used.members + used.invitations;
	if (seats >= inUse) return { ok: true };
	const parts = [`${used.members} ${used.members === 1 ? 'member' : 'members'}`];
	if (used.invitations > 0) parts.push(`${used.invitations} pending ${used.invitations === 1 ? 'invitation' : 'invitations'}`);
	return {
		ok: false,
		limit: 'seats',
		allowed: seats,
		used: inUse,
		message: `${inUse} seats are in use (${parts.join(', ')}): remove members or withdraw invitations before going down to ${seats} ${seats === 1 ? 'seat' : 'seats'}.`
	};
}

/** Every limit the studio is past now (after a plan lapsed): shown as a banner, never enforced backwards. */
export function limitsExceeded(state: PlanState, usage: { seats: number; styles: number }): LimitName[] {
	const out: LimitName[] = [];
	const seats = planAllows(state, 'seats');
	if (seats !== null && usage.seats > seats) out.push('seats');
	const styles = planAllows(state, 'styles');
	if (styles !== null && usage.styles > styles) out.push('styles');
	return out;
}

/** The price of a number of seats for an interval, e.g. "€75.00 a month". */
export function priceLabel(interval: BillingInterval, seats: number): string {
	const p = STUDIO_PRICES[interval];
	const amount = new Intl.NumberFormat('en-GB', { style: 'currency', currency: p.currency.toUpperCase() }).format((p.perSeatMinor * seats) / 100);
	return `${amount} a ${interval}`;
}
