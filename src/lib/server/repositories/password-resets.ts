import type { DbOrTx } from '../db';

export async function passwordResetsCreate(
	db: DbOrTx,
	input: { userId: string; tokenHash: string; expiresAt: Date }
): Promise<void> {
	await db
		.insertInto('password_resets')
		.values({ user_id: input.userId, token_hash: input.tokenHash, expires_at: input.expiresAt })
		.execute();
}

/** A reset that can still be used, with the e-mail it is for. */
export async function passwordResetsOpenByTokenHash(db: DbOrTx, tokenHash: string) {
	return db
		.selectFrom('password_resets')
		.innerJoin('users', 'users.id', 'password_resets.user_id')
		.select(['password_resets.id', 'password_resets.user_id', 'users.email'])
		.where('password_resets.token_hash', '=', tokenHash)
		.where('password_resets.used_at', 'is', null)
		.where('password_resets.expires_at', '>', new Date())
		.executeTakeFirst();
}

/** Marks the reset used, atomically: only one caller ever gets the row back. */
export async function passwordResetsConsume(db: DbOrTx, tokenHash: string) {
	return db
		.updateTable('password_resets')
		.set({ used_at: new Date() })
		.where('token_hash', '=', tokenHash)
		.where('used_at', 'is', null)
		.where('expires_at', '>', new Date())
		.returning(['id', 'user_id'])
		.executeTakeFirst();
}

/** After a successful reset, the user's other open reset links stop working too. */
export async function passwordResetsCloseForUser(db: DbOrTx, userId: string): Promise<void> {
	await db
		.updateTable('password_resets')
		.set({ used_at: new Date() })
		.where('user_id', '=', userId)
		.where('used_at', 'is', null)
		.execute();
}
