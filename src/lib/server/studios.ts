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
import { studiosCreate, type StudioRow } from './repositories/studios';

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
