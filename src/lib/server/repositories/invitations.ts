import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';

export interface InvitationRow {
	id: string;
	studio_id: string;
	email: string;
	role: Role;
	expires_at: Date;
	used_at: Date | null;
	created_at: Date;
}

const COLUMNS = ['id', 'studio_id', 'email', 'role', 'expires_at', 'used_at', 'created_at'] as const;

/** Creates an invitation; an earlier open invitation of the same address to the same studio is withdrawn. */
export async function invitationsCreate(
	db: DbOrTx,
	input: { studioId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date }
): Promise<InvitationRow> {
	const email = input.email.trim().toLowerCase();
	await db
		.deleteFrom('invitations')
		.where('studio_id', '=', input.studioId)
		.where('email', '=', email)
		.where('used_at', 'is', null)
		.execute();
	return db
		.insertInto('invitations')
		.values({
			studio_id: input.studioId,
			email,
			role: input.role,
			token_hash: input.tokenHash,
			invited_by: input.invitedBy,
			expires_at: input.expiresAt
		})
		.returning(COLUMNS)
		.executeTakeFirstOrThrow();
}

/** An invitation that can still be used (not used, not expired), with its studio's name. */
export async function invitationsOpenByTokenHash(db: DbOrTx, tokenHash: string) {
	return db
		.selectFrom('invitations')
		.innerJoin('studios', 'studios.id', 'invitations.studio_id')
		.select([
			'invitations.id',
			'invitations.studio_id',
			'invitations.email',
			'invitations.role',
			'invitations.expires_at',
			'studios.name as studio_name'
		])
		.where('invitations.token_hash', '=', tokenHash)
		.where('invitations.used_at', 'is', null)
		.where('invitations.expires_at', '>', new Date())
		.executeTakeFirst();
}

/** Marks the invitation used, atomically: only one caller ever gets the row back. */
export async function invitationsConsume(db: DbOrTx, tokenHash: string) {
	return db
		.updateTable('invitations')
		.set({ used_at: new Date() })
		.where('token_hash', '=', tokenHash)
		.where('used_at', 'is', null)
		.where('expires_at', '>', new Date())
		.returning(['id', 'studio_id', 'email', 'role'])
		.executeTakeFirst();
}

export async function invitationsOpenForStudio(db: DbOrTx, studioId: string): Promise<InvitationRow[]> {
	return db
		.selectFrom('invitations')
		.select(COLUMNS)
		.where('studio_id', '=', studioId)
		.where('used_at', 'is', null)
		.where('expires_at', '>', new Date())
		.orderBy('created_at', 'desc')
		.execute();
}

/** Is there an invitation of this address to this studio that can still be used? */
export async function invitationsOpenForEmail(db: DbOrTx, studioId: string, email: string): Promise<boolean> {
	const r = await db
		.selectFrom('invitations')
		.select('id')
		.where('studio_id', '=', studioId)
		.where('email', '=', email.trim().toLowerCase())
		.where('used_at', 'is', null)
		.where('expires_at', '>', new Date())
		.executeTakeFirst();
	return r !== undefined;
}

export async function invitationsDelete(db: DbOrTx, id: string): Promise<void> {
	await db.deleteFrom('invitations').where('id', '=', id).execute();
}

/**
 * Withdraws an invitation that has not been used: its row goes, so its link no longer works and its seat
 * is free. 'used' when it was accepted already, 'missing' when the studio has no invitation of that id.
 */
export async function invitationsWithdraw(db: DbOrTx, studioId: string, id: string): Promise<'withdrawn' | 'used' | 'missing'> {
	const gone = await db
		.deleteFrom('invitations')
		.where('id', '=', id)
		.where('studio_id', '=', studioId)
		.where('used_at', 'is', null)
		.returning('id')
		.executeTakeFirst();
	if (gone) return 'withdrawn';
	const used = await db.selectFrom('invitations').select('id').where('id', '=', id).where('studio_id', '=', studioId).executeTakeFirst();
	return used ? 'used' : 'missing';
}
