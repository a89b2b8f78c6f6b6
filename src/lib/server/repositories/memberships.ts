import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';

export interface MembershipOfUser {
	studioId: string;
	studioName: string;
	role: Role;
}

export interface MemberRow {
	userId: string;
	email: string;
	name: string;
	role: Role;
	joinedAt: Date;
}

export async function membershipsCreate(
	db: DbOrTx,
	input: { studioId: string; userId: string; role: Role }
): Promise<void> {
	await db
		.insertInto('memberships')
		.values({ studio_id: input.studioId, user_id: input.userId, role: input.role })
		.execute();
}

/** Adds the membership, or leaves an existing one as it is. Returns whether a row was added. */
export async function membershipsAddIfAbsent(
	db: DbOrTx,
	input: { studioId: string; userId: string; role: Role }
): Promise<boolean> {
	const r = await db
		.insertInto('memberships')
		.values({ studio_id: input.studioId, user_id: input.userId, role: input.role })
		.onConflict((oc) => oc.columns(['studio_id', 'user_id']).doNothing())
		.executeTakeFirst();
	return Number(r.numInsertedOrUpdatedRows ?? 0) > 0;
}

export async function membershipsForUser(db: DbOrTx, userId: string): Promise<MembershipOfUser[]> {
	const rows = await db
		.selectFrom('memberships')
		.innerJoin('studios', 'studios.id', 'memberships.studio_id')
		.select(['studios.id as studioId', 'studios.name as studioName', 'memberships.role'])
		.where('memberships.user_id', '=', userId)
		.orderBy('studios.name')
		.orderBy('studios.id')
		.execute();
	return rows;
}

export async function membershipsRole(
	db: DbOrTx,
	studioId: string,
	userId: string
): Promise<Role | undefined> {
	const row = await db
		.selectFrom('memberships')
		.select('role')
		.where('studio_id', '=', studioId)
		.where('user_id', '=', userId)
		.executeTakeFirst();
	return row?.role;
}

export async function membershipsOfStudio(db: DbOrTx, studioId: string): Promise<MemberRow[]> {
	return db
		.selectFrom('memberships')
		.innerJoin('users', 'users.id', 'memberships.user_id')
		.select([
			'users.id as userId',
			'users.email',
			'users.name',
			'memberships.role',
			'memberships.created_at as joinedAt'
		])
		.where('memberships.studio_id', '=', studioId)
		.orderBy('users.name')
		.orderBy('users.email')
		.execute();
}

export async function membershipsIsMemberByEmail(
	db: DbOrTx,
	studioId: string,
	email: string
): Promise<boolean> {
	const row = await db
		.selectFrom('memberships')
		.innerJoin('users', 'users.id', 'memberships.user_id')
		.select('users.id')
		.where('memberships.studio_id', '=', studioId)
		.where('users.email', '=', email.trim().toLowerCase())
		.executeTakeFirst();
	return row !== undefined;
}

/**
 * Locks the studio's owner rows (FOR UPDATE) so two owners cannot demote or remove each other at
 * the same moment and leave the studio without one. Call inside a transaction.
 */
export async function membershipsOwnersLocked(db: DbOrTx, studioId: string): Promise<string[]> {
	const rows = await db
		.selectFrom('memberships')
		.select('user_id')
		.where('studio_id', '=', studioId)
		.where('role', '=', 'owner')
		.forUpdate()
		.execute();
	return rows.map((r) => r.user_id);
}

export async function membershipsRoleSet(
	db: DbOrTx,
	studioId: string,
	userId: string,
	role: Role
): Promise<boolean> {
	const r = await db
		.updateTable('memberships')
		.set({ role })
		.where('studio_id', '=', studioId)
		.where('user_id', '=', userId)
		.executeTakeFirst();
	return Number(r.numUpdatedRows) > 0;
}

export async function membershipsDelete(db: DbOrTx, studioId: string, userId: string): Promise<boolean> {
	const r = await db
		.deleteFrom('memberships')
		.where('studio_id', '=', studioId)
		.where('user_id', '=', userId)
		.executeTakeFirst();
	return Number(r.numDeletedRows) > 0;
}

/** How many members a studio has (every role). */
export async function membershipsCount(db: DbOrTx, studioId: string): Promise<number> {
	const r = await db.selectFrom('memberships').select((eb) => eb.fn.countAll<string>().as('n')).where('studio_id', '=', studioId).executeTakeFirstOrThrow();
	return Number(r.n);
}

/**
 * The studios a person is the only owner of, each with how many other members it has: what stops them
 * deleting their account (read for the account page; the deletion checks again under the owners' locks).
 */
export async function membershipsSoleOwnerOf(db: DbOrTx, userId: string): Promise<{ studioId: string; studioName: string; otherMembers: number }[]> {
	const rows = await db
		.selectFrom('memberships as mine')
		.innerJoin('studios', 'studios.id', 'mine.studio_id')
		.select((eb) => [
			'studios.id as studioId',
			'studios.name as studioName',
			eb
				.selectFrom('memberships as o')
				.select((e2) => e2.fn.countAll<string>().as('n'))
				.whereRef('o.studio_id', '=', 'mine.studio_id')
				.where('o.role', '=', 'owner')
				.as('owners'),
			eb
				.selectFrom('memberships as m')
				.select((e2) => e2.fn.countAll<string>().as('n'))
				.whereRef('m.studio_id', '=', 'mine.studio_id')
				.as('members')
		])
		.where('mine.user_id', '=', userId)
		.where('mine.role', '=', 'owner')
		.orderBy('studios.name')
		.execute();
	return rows
		.filter((r) => Number(r.owners) <= 1)
		.map((r) => ({ studioId: r.studioId, studioName: r.studioName, otherMembers: Number(r.members) - 1 }));
}
