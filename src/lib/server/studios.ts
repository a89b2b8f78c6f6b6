import { planStudioCreateEnforce } from './billing/plan';
import type { Db } from './db';
import type { Role } from './db/schema';
import {
	membershipsCreate,
	membershipsDelete,
	membershipsOwnersLocked,
	membershipsRole,
	membershipsRoleSet
} from './repositories/memberships';
import { invitationsWithdraw } from './repositories/invitations';
import { studiosCreate, studiosLockForLimits, type StudioRow } from './repositories/studios';

/** Studio and membership rules that span several rows (a studio always keeps an owner). */

/** A new studio with its owner; 402 when the owner has a studio on the free plan already (plans.ts). */
export async function studioCreateOwned(db: Db, name: string, ownerId: string): Promise<StudioRow> {
	return db.transaction().execute(async (tx) => {
		await planStudioCreateEnforce(tx, ownerId);
		const studio = await studiosCreate(tx, name);
		await membershipsCreate(tx, { studioId: studio.id, userId: ownerId, role: 'owner' });
		return studio;
	});
}

export type MemberChange =
	| { ok: true }
	| { ok: false; reason: 'not_member' | 'last_owner'; message: string };

const LAST_OWNER =
	'A studio needs at least one owner: make another member owner first.';

export async function memberRoleChange(
	db: Db,
	input: { studioId: string; userId: string; role: Role }
): Promise<MemberChange> {
	return db.transaction().execute(async (tx) => {
		const owners = await membershipsOwnersLocked(tx, input.studioId);
		const current = await membershipsRole(tx, input.studioId, input.userId);
		if (!current) return { ok: false, reason: 'not_member', message: 'This person is not a member of the studio.' };
		if (current === 'owner' && input.role !== 'owner' && owners.length <= 1) {
			return { ok: false, reason: 'last_owner', message: `This is the studio's last owner. ${LAST_OWNER}` };
		}
		await membershipsRoleSet(tx, input.studioId, input.userId, input.role);
		return { ok: true };
	});
}

export async function memberRemove(db: Db, input: { studioId: string; userId: string }): Promise<MemberChange> {
	return db.transaction().execute(async (tx) => {
		const owners = await membershipsOwnersLocked(tx, input.studioId);
		const current = await membershipsRole(tx, input.studioId, input.userId);
		if (!current) return { ok: false, reason: 'not_member', message: 'This person is not a member of the studio.' };
		if (current === 'owner' && owners.length <= 1) {
			return { ok: false, reason: 'last_owner', message: `The studio's last owner cannot be removed. ${LAST_OWNER}` };
		}
		await membershipsDelete(tx, input.studioId, input.userId);
		return { ok: true };
	});
}

const YOU_LAST_OWNER =
	"You are this studio's last owner, and a studio needs one: make another member owner first (if you are its only member, invite someone as owner and wait until they join).";

/** A member leaves the studio themselves; the last owner cannot. */
export async function memberLeave(db: Db, input: { studioId: string; userId: string }): Promise<MemberChange> {
	return db.transaction().execute(async (tx) => {
		const owners = await membershipsOwnersLocked(tx, input.studioId);
		const current = await membershipsRole(tx, input.studioId, input.userId);
		if (!current) return { ok: false, reason: 'not_member', message: 'You are not a member of this studio.' };
		if (current === 'owner' && owners.length <= 1) return { ok: false, reason: 'last_owner', message: YOU_LAST_OWNER };
		await membershipsDelete(tx, input.studioId, input.userId);
		return { ok: true };
	});
}

export type InvitationWithdrawal =
	| { ok: true }
	| { ok: false; reason: 'missing' | 'used'; message: string };

/**
 * Withdraws an open invitation: the link stops working and the seat it held is free. Taken under the
 * studio's plan-limit lock (as seats are reserved), so a count in progress sees it either whole or gone.
 */
export async function invitationWithdraw(db: Db, input: { studioId: string; invitationId: string }): Promise<InvitationWithdrawal> {
	return db.transaction().execute(async (tx) => {
		await studiosLockForLimits(tx, input.studioId);
		const r = await invitationsWithdraw(tx, input.studioId, input.invitationId);
		if (r === 'withdrawn') return { ok: true };
		if (r === 'used') {
			return {
				ok: false,
				reason: 'used',
				message: 'This invitation was accepted already: the person is a member now. Remove them on the members page instead.'
			};
		}
		return { ok: false, reason: 'missing', message: 'This studio has no invitation with this id (it may have been withdrawn already).' };
	});
}
