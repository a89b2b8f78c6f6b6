import { planLimitReserve } from '../billing/plan';
import type { Db } from '../db';
import type { Role } from '../db/schema';
import { invitationMail, mailSend, passwordResetMail } from '../mail/send';
import {
	invitationsConsume,
	invitationsCreate,
	invitationsDelete,
	invitationsOpenByTokenHash,
	invitationsOpenForEmail
} from '../repositories/invitations';
import { membershipsAddIfAbsent, membershipsCreate, membershipsIsMemberByEmail } from '../repositories/memberships';
import {
	passwordResetsCloseForUser,
	passwordResetsConsume,
	passwordResetsCreate,
	passwordResetsOpenByTokenHash
} from '../repositories/password-resets';
import { sessionsDeleteForUser } from '../repositories/sessions';
import { studiosById, studiosCreate } from '../repositories/studios';
import {
	emailNormalize,
	isUniqueViolation,
	usersByEmail,
	usersCreate,
	usersPasswordSet,
	type UserRow
} from '../repositories/users';
import { passwordHash, passwordVerify, passwordVerifyDummy } from './password';
import { signInBlocked, signInFailed, signInSucceeded } from './throttle';
import { INVITATION_TTL_MS, linkTokenCreate, PASSWORD_RESET_TTL_MS, sha256Hex } from './tokens';

export type Outcome<T, E extends string> = { ok: true; value: T } | { ok: false; reason: E; message: string };

const ok = <T>(value: T) => ({ ok: true as const, value });
const no = <E extends string>(reason: E, message: string) => ({ ok: false as const, reason, message });

export const EMAIL_TAKEN = 'An account with this e-mail address exists already. Sign in instead.';
export const SIGN_IN_WRONG = 'That e-mail and password do not match an account.';

/** A new user and a new studio with that user as its owner. */
export async function signUp(
	db: Db,
	input: { email: string; name: string; password: string; studioName: string }
): Promise<Outcome<{ user: UserRow; studioId: string }, 'email_taken'>> {
	const hash = await passwordHash(input.password);
	try {
		return ok(
			await db.transaction().execute(async (tx) => {
				const user = await usersCreate(tx, { email: input.email, name: input.name, passwordHash: hash });
				const studio = await studiosCreate(tx, input.studioName);
				await membershipsCreate(tx, { studioId: studio.id, userId: user.id, role: 'owner' });
				return { user, studioId: studio.id };
			})
		);
	} catch (e) {
		if (isUniqueViolation(e)) return no('email_taken', EMAIL_TAKEN);
		throw e;
	}
}

/**
 * Checks a sign-in, with throttling per e-mail and per client address. Unknown e-mail and wrong
 * password get the same answer (and take the same time).
 */
export async function signInCheck(
	db: Db,
	input: { email: string; password: string; address: string }
): Promise<Outcome<UserRow, 'wrong' | 'throttled'> & { retryAfterSeconds?: number }> {
	const email = emailNormalize(input.email);
	const blocked = await signInBlocked(email, input.address);
	if (blocked) return { ...no('throttled', blocked.message), retryAfterSeconds: blocked.retryAfterSeconds };
	const user = await usersByEmail(db, email);
	const good = user ? await passwordVerify(user.password_hash, input.password) : await passwordVerifyDummy(input.password);
	if (!user || !good) {
		const now = await signInFailed(email, input.address);
		if (now) return { ...no('throttled', now.message), retryAfterSeconds: now.retryAfterSeconds };
		return no('wrong', SIGN_IN_WRONG);
	}
	await signInSucceeded(email);
	return ok({ id: user.id, email: user.email, name: user.name });
}

// ── invitations ────────────────────────────────────────────────────────────────────────────────

export async function invitationSend(
	db: Db,
	input: { studioId: string; email: string; role: Role; inviter: { id: string; name: string }; origin: string }
) {
	const email = emailNormalize(input.email);
	if (await membershipsIsMemberByEmail(db, input.studioId, email)) {
		return no('already_member', `${email} is already a member of this studio.`);
	}
	const studio = await studiosById(db, input.studioId);
	if (!studio) return no('no_studio', 'No such studio.');
	const token = linkTokenCreate();
	// A pending invitation takes a seat: the count and the insert are one transaction under the studio's
	// lock, so two invitations racing for the last seat cannot both pass (402 for the second). Inviting
	// the same address again replaces its open invitation and takes no further seat.
	const invitation = await db.transaction().execute(async (tx) => {
		const again = await invitationsOpenForEmail(tx, input.studioId, email);
		await planLimitReserve(tx, input.studioId, 'seats', again ? 0 : 1);
		return invitationsCreate(tx, {
			studioId: input.studioId,
			email,
			role: input.role,
			tokenHash: sha256Hex(token),
			invitedBy: input.inviter.id,
			expiresAt: new Date(Date.now() + INVITATION_TTL_MS)
		});
	});
	try {
		await mailSend(
			invitationMail({
				to: email,
				studioName: studio.name,
				inviterName: input.inviter.name,
				role: input.role,
				link: `${input.origin}/invite/${token}`
			})
		);
	} catch (e) {
		// Nobody can use an invitation whose mail never left: do not list it as pending.
		await invitationsDelete(db, invitation.id);
		throw e;
	}
	return ok(invitation);
}

/** The invitation behind a link, if it can still be used. */
export async function invitationPeek(db: Db, token: string) {
	return invitationsOpenByTokenHash(db, sha256Hex(token));
}

const LINK_SPENT = 'This link does not work any more: it was used already or it has expired.';

/** Creates the invitee's account from the invitation and makes them a member. Uses the link up. */
export async function invitationAcceptNew(
	db: Db,
	input: { token: string; name: string; password: string }
): Promise<Outcome<{ user: UserRow; studioId: string }, 'spent' | 'email_taken'>> {
	const hash = await passwordHash(input.password);
	try {
		const r = await db.transaction().execute(async (tx) => {
			const inv = await invitationsConsume(tx, sha256Hex(input.token));
			if (!inv) return null;
			const user = await usersCreate(tx, { email: inv.email, name: input.name, passwordHash: hash });
			await membershipsCreate(tx, { studioId: inv.studio_id, userId: user.id, role: inv.role });
			return { user, studioId: inv.studio_id };
		});
		return r ? ok(r) : no('spent', LINK_SPENT);
	} catch (e) {
		if (isUniqueViolation(e)) {
			return no('email_taken', 'An account with this e-mail address exists already: sign in to join.');
		}
		throw e;
	}
}

/** A signed-in user with the invited address joins the studio. Uses the link up. */
export async function invitationAcceptExisting(
	db: Db,
	input: { token: string; user: { id: string; email: string } }
): Promise<Outcome<{ studioId: string }, 'spent' | 'other_email'>> {
	return db.transaction().execute(async (tx) => {
		const peek = await invitationsOpenByTokenHash(tx, sha256Hex(input.token));
		if (!peek) return no('spent', LINK_SPENT);
		if (peek.email !== input.user.email) {
			return no(
				'other_email',
				`This invitation is for ${peek.email}, and you are signed in as ${input.user.email}.`
			);
		}
		const inv = await invitationsConsume(tx, sha256Hex(input.token));
		if (!inv) return no('spent', LINK_SPENT);
		// Already a member (e.g. invited twice): keep the role they have.
		await membershipsAddIfAbsent(tx, { studioId: inv.studio_id, userId: input.user.id, role: inv.role });
		return ok({ studioId: inv.studio_id });
	});
}

// ── password reset ─────────────────────────────────────────────────────────────────────────────

/** Sends a reset link if the address has an account; says nothing either way. */
export async function passwordResetRequest(db: Db, input: { email: string; origin: string }): Promise<void> {
	const user = await usersByEmail(db, input.email);
	if (!user) return;
	const token = linkTokenCreate();
	await passwordResetsCreate(db, {
		userId: user.id,
		tokenHash: sha256Hex(token),
		expiresAt: new Date(Date.now() + PASSWORD_RESET_TTL_MS)
	});
	await mailSend(passwordResetMail({ to: user.email, link: `${input.origin}/reset/${token}` }));
}

export async function passwordResetPeek(db: Db, token: string) {
	return passwordResetsOpenByTokenHash(db, sha256Hex(token));
}

/** Sets the new password, uses the link up and ends every session of the user. */
export async function passwordResetComplete(
	db: Db,
	input: { token: string; password: string }
): Promise<Outcome<{ userId: string }, 'spent'>> {
	const hash = await passwordHash(input.password);
	const r = await db.transaction().execute(async (tx) => {
		const reset = await passwordResetsConsume(tx, sha256Hex(input.token));
		if (!reset) return null;
		await usersPasswordSet(tx, reset.user_id, hash);
		await passwordResetsCloseForUser(tx, reset.user_id);
		await sessionsDeleteForUser(tx, reset.user_id);
		return { userId: reset.user_id };
	});
	return r ? ok(r) : no('spent', LINK_SPENT);
}
