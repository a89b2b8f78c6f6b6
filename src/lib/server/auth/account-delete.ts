import type { Db } from '../db';
import { membershipsOwnersLocked } from '../repositories/memberships';
import { usersByEmail, usersDelete, usersOwnedStudios } from '../repositories/users';
import type { Outcome } from './accounts';
import { passwordVerify } from './password';
import { signInBlocked, signInFailed } from './throttle';

/**
 * Deletes a person's account, asked for by the person with their password. The user row goes; with it
 * (ON DELETE CASCADE) their sessions, memberships, reset links and e-mail settings. What they made
 * (styles, versions, changes, fittings, photos, notes, comments, reviews, size runs, measurement sets)
 * stays with its studio, its author column set to NULL (ON DELETE SET NULL), shown as "former member".
 * The e-mail address is freed: it may sign up again, as a new person with none of the old work.
 * The last owner of a studio is refused: a studio always keeps an owner.
 * A wrong password counts as a failed sign-in (the same throttle).
 */
export async function accountDelete(
	db: Db,
	input: { userId: string; email: string; password: string; address: string }
): Promise<Outcome<{ studiosLeft: number }, 'wrong_password' | 'throttled' | 'last_owner'> & { retryAfterSeconds?: number }> {
	const blocked = await signInBlocked(input.email, input.address);
	if (blocked) return { ok: false, reason: 'throttled', message: blocked.message, retryAfterSeconds: blocked.retryAfterSeconds };
	const user = await usersByEmail(db, input.email);
	if (!user || user.id !== input.userId || !(await passwordVerify(user.password_hash, input.password))) {
		const now = await signInFailed(input.email, input.address);
		if (now) return { ok: false, reason: 'throttled', message: now.message, retryAfterSeconds: now.retryAfterSeconds };
		return { ok: false, reason: 'wrong_password', message: 'That password is not right. Nothing was deleted.' };
	}
	return db.transaction().execute(async (tx) => {
		const owned = await usersOwnedStudios(tx, input.userId);
		const alone: string[] = [];
		for (const s of owned) {
			// the owner rows are locked: nobody demotes or removes the other owner while this runs
			const owners = await membershipsOwnersLocked(tx, s.studioId);
			if (owners.length <= 1) alone.push(`"${s.studioName}"`);
		}
		if (alone.length > 0) {
			return {
				ok: false as const,
				reason: 'last_owner' as const,
				message:
					`You are the last owner of ${alone.join(', ')}, and a studio needs one. On ${alone.length === 1 ? 'its' : 'each one\'s'} Members page make another member owner ` +
					'(or, if you are its only member, invite someone as owner and wait until they join), then delete your account. Nothing was deleted.'
			};
		}
		const studiosLeft = await usersDelete(tx, input.userId);
		return { ok: true as const, value: { studiosLeft } };
	});
}
