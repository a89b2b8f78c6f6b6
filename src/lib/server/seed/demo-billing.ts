import billing from '../../../../fixtures/demo-billing.json';
import demo from '../../../../fixtures/demo-studio.json';
import { demoPeriod, demoPeriodBefore } from '../../billing/demo';
import type { Db } from '../db';
import type { Role } from '../db/schema';
import { passwordHash } from '../auth/password';
import { INVITATION_TTL_MS, linkTokenCreate, sha256Hex } from '../auth/tokens';
import { billingForget, billingReplace } from '../repositories/billing';
import { invitationsCreate, invitationsOpenForStudio } from '../repositories/invitations';
import { membershipsAddIfAbsent, membershipsForUser } from '../repositories/memberships';
import { studiosCreate } from '../repositories/studios';
import { stylesCreate, stylesOfStudio } from '../repositories/styles';
import { usersByEmail, usersCreate } from '../repositories/users';

/**
 * The demo studios' billing (fixtures/demo-billing.json), in step with the local payments fake, which
 * starts with the same customer and subscription in memory: the paid studio on the Studio plan with its
 * seats, and a second studio on the free Sketch plan at its seat limit (two members and a pending
 * invitation) with some styles. The fake forgets everything when it stops, so every seed puts both
 * studios' billing back to this state.
 */
export async function demoBillingSeed(db: Db, paidStudioId: string): Promise<{ sketchStudioId: string }> {
	const p = billing.paid;
	const now = Date.now();
	await billingReplace(db, {
		studio_id: paidStudioId,
		customer_id: p.customer,
		subscription_id: p.subscription,
		status: 'active',
		price_id: p.price,
		interval: p.interval as 'month',
		seats: p.seats,
		cancel_at_period_end: false,
		current_period_end: new Date(demoPeriod(now).endS * 1000),
		canceled_at: null,
		ended_at: null,
		provider_updated_at: new Date(demoPeriodBefore(now, p.invoicesBefore) * 1000),
		payment_failed_at: null
	});
	await db.deleteFrom('billing_invoices').where('studio_id', '=', paidStudioId).execute();

	const s = billing.sketch;
	const sketchStudioId = await db.transaction().execute(async (tx) => {
		const hash = await passwordHash(demo.password);
		const ids: Partial<Record<Role, string>> = {};
		for (const spec of s.users) {
			const user = (await usersByEmail(tx, spec.email)) ?? (await usersCreate(tx, { ...spec, passwordHash: hash }));
			ids[spec.role as Role] = user.id;
		}
		const owner = ids.owner!;
		const existing = (await membershipsForUser(tx, owner)).find((m) => m.studioName === s.studio);
		const studioId = existing?.studioId ?? (await studiosCreate(tx, s.studio)).id;
		for (const spec of s.users) await membershipsAddIfAbsent(tx, { studioId, userId: ids[spec.role as Role]!, role: spec.role as Role });
		const open = await invitationsOpenForStudio(tx, studioId);
		if (!open.some((i) => i.email === s.pendingInvitation.email)) {
			await invitationsCreate(tx, {
				studioId,
				email: s.pendingInvitation.email,
				role: s.pendingInvitation.role as Role,
				tokenHash: sha256Hex(linkTokenCreate()), // nobody holds the link: the invitation only takes its seat
				invitedBy: owner,
				expiresAt: new Date(now + INVITATION_TTL_MS)
			});
		}
		const styles = new Set((await stylesOfStudio(tx, studioId)).map((x) => x.name));
		for (const name of s.styles) if (!styles.has(name)) await stylesCreate(tx, { studioId, name, createdBy: ids.patterncutter ?? owner });
		await billingForget(tx, studioId);
		return studioId;
	});
	return { sketchStudioId };
}
