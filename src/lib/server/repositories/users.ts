import type { DbOrTx } from '../db';

export interface UserRow {
	id: string;
	email: string;
	name: string;
}

export interface UserWithHash extends UserRow {
	password_hash: string;
}

export function emailNormalize(email: string): string {
	return email.trim().toLowerCase();
}

export async function usersCreate(
	db: DbOrTx,
	input: { email: string; name: string; passwordHash: string }
): Promise<UserRow> {
	return db
		.insertInto('users')
		.values({ email: emailNormalize(input.email), name: input.name, password_hash: input.passwordHash })
		.returning(['id', 'email', 'name'])
		.executeTakeFirstOrThrow();
}

export async function usersByEmail(db: DbOrTx, email: string): Promise<UserWithHash | undefined> {
	return db
		.selectFrom('users')
		.select(['id', 'email', 'name', 'password_hash'])
		.where('email', '=', emailNormalize(email))
		.executeTakeFirst();
}

export async function usersById(db: DbOrTx, id: string): Promise<UserRow | undefined> {
	return db.selectFrom('users').select(['id', 'email', 'name']).where('id', '=', id).executeTakeFirst();
}

export async function usersPasswordSet(db: DbOrTx, id: string, passwordHash: string): Promise<void> {
	await db.updateTable('users').set({ password_hash: passwordHash }).where('id', '=', id).execute();
}

/** Is this a unique-key violation from PostgreSQL (e.g. an e-mail already taken)? */
export function isUniqueViolation(e: unknown): boolean {
	return typeof e === 'object' && e !== null && (e as { code?: unknown }).code === '23505';
}

/** Locks the person's row for the rest of the transaction (the one-studio-per-Sketch-owner check takes it). */
export async function usersLockForStudios(db: DbOrTx, id: string): Promise<void> {
	await db.selectFrom('users').select('id').where('id', '=', id).forUpdate().executeTakeFirst();
}

/** The studios the person owns, with their names. */
export async function usersOwnedStudios(db: DbOrTx, userId: string): Promise<{ studioId: string; studioName: string }[]> {
	return db
		.selectFrom('memberships')
		.innerJoin('studios', 'studios.id', 'memberships.studio_id')
		.select(['studios.id as studioId', 'studios.name as studioName'])
		.where('memberships.user_id', '=', userId)
		.where('memberships.role', '=', 'owner')
		.orderBy('studios.name')
		.execute();
}

/**
 * Deletes the person's row. Their sessions, memberships, reset links and e-mail settings go with it
 * (cascade); every row they authored keeps its place with its author set to NULL. Returns how many
 * studios they were a member of.
 */
export async function usersDelete(db: DbOrTx, id: string): Promise<number> {
	const m = await db.selectFrom('memberships').select((eb) => eb.fn.countAll<number>().as('n')).where('user_id', '=', id).executeTakeFirstOrThrow();
	await db.deleteFrom('users').where('id', '=', id).execute();
	return Number(m.n);
}
