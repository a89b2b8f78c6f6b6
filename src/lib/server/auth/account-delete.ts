import type { Db } from '../db';
import { membershipsCount, membershipsOwnersLocked } from '../repositories/memberships';
import { usersByEmail, usersDelete, usersOwnedStudios } from '../repositories/users';
import type { Outcome } from './accounts';
import { lastOwnerMessage, type SoleOwnedStudio } from './last-owner-message';
import { passwordVerify } from './password';
import { signInBlocked, signInFailed } from './throttle';

/**
 * Deletes a person's account, asked for by the person with their password. The user row goes; with it
 * (ON DELETE CASCADE) their sessions, memberships, reset links and e-mail settings. What they made
 * (styles, versions, changes, fittings, photos, notes, comments, reviews, size runs, measurement sets)
 * stays with its studio, its author column set to NULL (ON DELETE SET NULL), shown as "former member".
 * The e-mail address is freed: it may sign up again, as a new person with none of the old work.
 * The last owner of a studio is refused: a studio always keeps an owner (and is never deleted here); the
 * message says, per studio, to make another member owner first, or, for a studio with no other member, to
 * invite someone as owner first. The studio's payment-provider customer (studio_billing) is not touched.
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
		const sole: SoleOwnedStudio[] = [];
		for (const s of owned) {
			// the owner rows are locked: nobody demotes or removes the other owner while this runs
			const owners = await membershipsOwnersLocked(tx, s.studioId);
			if (owners.length <= 1) sole.push({ studioName: s.studioName, otherMembers: (await membershipsCount(tx, s.studioId)) - 1 });
		}
		if (sole.length > 0) return { ok: false as const, reason: 'last_owner' as const, message: lastOwnerMessage(sole) };
		const studiosLeft = await usersDelete(tx, input.userId);
		return { ok: true as const, value: { studiosLeft } };
	});
}
