import { limitCheck, limitsExceeded, type LimitName, type PlanState } from '../../billing/plans';
import type { DbOrTx } from '../db';
import { studiosLockForLimits } from '../repositories/studios';
import { usersLockForStudios } from '../repositories/users';
import { ApiError } from '../http-errors';
import { billingOfStudio, billingSeatUsage, billingSketchStudiosOwned, billingStylesCount, type StudioBillingRow } from '../repositories/billing';

/** Subscription statuses under which the studio has the Studio plan (past_due: paid seats kept while the provider retries). */
export const LIVE_STATUSES: ReadonlySet<string> = new Set(['active', 'trialing', 'past_due']);

/** The plan a stored billing row gives: Studio with its seats while the subscription is live, else Sketch. */
export function planStateOf(row: StudioBillingRow | undefined): PlanState {
	if (row && row.status !== null && LIVE_STATUSES.has(row.status) && row.seats > 0) return { plan: 'studio', seatsPaid: row.seats };
	return { plan: 'sketch' };
}

export interface StudioUsage {
	members: number;
	invitations: number;
	/** members + pending invitations */
	seats: number;
	styles: number;
}

export interface StudioPlan {
	state: PlanState;
	billing: StudioBillingRow | undefined;
	usage: StudioUsage;
	/** limits the studio is past now (a lapsed plan): new work past them is refused, nothing is hidden */
	exceeded: LimitName[];
}

export async function studioPlan(db: DbOrTx, studioId: string): Promise<StudioPlan> {
	const [billing, seats, styles] = await Promise.all([billingOfStudio(db, studioId), billingSeatUsage(db, studioId), billingStylesCount(db, studioId)]);
	const state = planStateOf(billing);
	const usage = { ...seats, seats: seats.members + seats.invitations, styles };
	return { state, billing, usage, exceeded: limitsExceeded(state, usage) };
}

/**
 * Refuses (402 `plan_limit`) an action that would take the studio past its plan's limit: the message
 * names the limit and who can change it.
 */
export async function planLimitEnforce(db: DbOrTx, studioId: string, limit: Extract<LimitName, 'seats' | 'styles'>, adding = 1): Promise<void> {
	const { state, usage } = await studioPlan(db, studioId);
	const check = limitCheck(state, limit, limit === 'seats' ? usage.seats : usage.styles, adding);
	if (!check.ok) throw new ApiError(402, 'plan_limit', check.message);
}

/**
 * `planLimitEnforce` for the transaction that then adds the seat or the style: it first locks the
 * studio's row (held to the end of the transaction), so of two requests racing for the last seat the
 * second waits, counts what the first added, and is refused. Call it on a transaction, never the pool.
 */
export async function planLimitReserve(tx: DbOrTx, studioId: string, limit: Extract<LimitName, 'seats' | 'styles'>, adding = 1): Promise<void> {
	await studiosLockForLimits(tx, studioId);
	await planLimitEnforce(tx, studioId, limit, adding);
}

/**
 * A new studio starts on Sketch, and the Sketch plan includes one studio per owner: refused (402) when
 * the person already owns a studio on Sketch. Studios on the Studio plan do not count. Call it on the
 * transaction that creates the studio.
 */
export async function planStudioCreateEnforce(db: DbOrTx, userId: string): Promise<void> {
	// the owner's row is locked to the end of the transaction: two new studios of one owner take turns
	await usersLockForStudios(db, userId);
	const owned = await billingSketchStudiosOwned(db, userId, [...LIVE_STATUSES]);
	const check = limitCheck({ plan: 'sketch' }, 'studios_owned', owned.length);
	if (check.ok) return;
	const names = owned.map((s) => `"${s.name}"`).join(', ');
	throw new ApiError(
		402,
		'plan_limit',
		`The Sketch plan includes one studio per owner, and you own ${names} on it. Upgrade ${owned.length === 1 ? 'it' : 'one of them'} to the Studio plan on its Billing page to start another studio.`
	);
}
