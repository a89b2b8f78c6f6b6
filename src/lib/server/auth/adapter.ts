import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import type { DbOrTx } from '../db';
import {
	sessionsDelete,
	sessionsDeleteExpired,
	sessionsDeleteForUser,
	sessionsExpirySet,
	sessionsForUser,
	sessionsInsert,
	sessionsWithUser
} from '../repositories/sessions';
import { keptReads } from '../cache/kept';
import { sha256Hex } from './tokens';

type SessionWithUser = NonNullable<Awaited<ReturnType<typeof sessionsWithUser>>>;

/**
 * Sessions read lately, with their user and roles, by hash: every request checks its session, and a
 * kept one is forgotten as soon as the database says its session, user or memberships changed (a
 * sign-out, a new role, an expiry moved; see cache/change-feed.ts), or after a minute regardless.
 */
const keptSessions = keptReads<SessionWithUser>({ max: 10_000, ttlMs: 60_000, kinds: ['user'], names: (row, _kind, userId) => row.user_id === userId });

/**
 * lucia's storage, over Kysely. The database only ever sees SHA-256(session id): a leaked sessions
 * table gives nobody a cookie. Sessions read back by user (getUserSessions) therefore carry the hash
 * as their id; lucia only uses those for listing.
 */
export class KyselySessionAdapter implements Adapter {
	constructor(private readonly db: () => DbOrTx) {}

	async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
		const hash = sha256Hex(sessionId);
		const row = await keptSessions.get(hash, () => sessionsWithUser(this.db(), hash));
		if (!row) return [null, null];
		return [
			{ id: sessionId, userId: row.user_id, expiresAt: row.expires_at, attributes: {} },
			{ id: row.user_id, attributes: { email: row.email, name: row.name, roles: row.roles } }
		];
	}

	async getUserSessions(userId: string): Promise<DatabaseSession[]> {
		const rows = await sessionsForUser(this.db(), userId);
		return rows.map((r) => ({ id: r.id_hash, userId: r.user_id, expiresAt: r.expires_at, attributes: {} }));
	}

	async setSession(session: DatabaseSession): Promise<void> {
		await sessionsInsert(this.db(), {
			id_hash: sha256Hex(session.id),
			user_id: session.userId,
			expires_at: session.expiresAt
		});
	}

	async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
		await sessionsExpirySet(this.db(), sha256Hex(sessionId), expiresAt);
	}

	async deleteSession(sessionId: string): Promise<void> {
		await sessionsDelete(this.db(), sha256Hex(sessionId));
	}

	async deleteUserSessions(userId: string): Promise<void> {
		await sessionsDeleteForUser(this.db(), userId);
	}

	async deleteExpiredSessions(): Promise<void> {
		await sessionsDeleteExpired(this.db());
	}
}
