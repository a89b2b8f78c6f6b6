import { sql } from 'kysely';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';

/** Sessions are stored by the SHA-256 of their id only; callers pass hashes, never raw ids. */
export interface SessionRow {
	id_hash: string;
	user_id: string;
	expires_at: Date;
}

export async function sessionsInsert(db: DbOrTx, row: SessionRow): Promise<void> {
	await db.insertInto('sessions').values(row).execute();
}

/**
 * The session with its user and the user's role in each studio they belong to (studio id → role), in one
 * round trip: every request checks the session, and most then ask for a role in one studio.
 */
export async function sessionsWithUser(db: DbOrTx, idHash: string) {
	return db
		.selectFrom('sessions')
		.innerJoin('users', 'users.id', 'sessions.user_id')
		.select([
			'sessions.id_hash',
			'sessions.user_id',
			'sessions.expires_at',
			'users.email',
			'users.name',
			sql<Record<string, Role>>`(select coalesce(json_object_agg(m.studio_id, m.role), '{}') from memberships m where m.user_id = users.id)`.as('roles')
		])
		.where('sessions.id_hash', '=', idHash)
		.executeTakeFirst();
}

export async function sessionsForUser(db: DbOrTx, userId: string): Promise<SessionRow[]> {
	return db
		.selectFrom('sessions')
		.select(['id_hash', 'user_id', 'expires_at'])
		.where('user_id', '=', userId)
		.execute();
}

export async function sessionsExpirySet(db: DbOrTx, idHash: string, expiresAt: Date): Promise<void> {
	await db.updateTable('sessions').set({ expires_at: expiresAt }).where('id_hash', '=', idHash).execute();
}

export async function sessionsDelete(db: DbOrTx, idHash: string): Promise<void> {
	await db.deleteFrom('sessions').where('id_hash', '=', idHash).execute();
}

export async function sessionsDeleteForUser(
	db: DbOrTx,
	userId: string,
	exceptIdHash?: string
): Promise<void> {
	let q = db.deleteFrom('sessions').where('user_id', '=', userId);
	if (exceptIdHash) q = q.where('id_hash', '!=', exceptIdHash);
	await q.execute();
}

export async function sessionsDeleteExpired(db: DbOrTx): Promise<void> {
	await db.deleteFrom('sessions').where('expires_at', '<=', new Date()).execute();
}
