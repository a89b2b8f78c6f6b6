import { log } from '../log';
import type { DbOrTx } from '../db';
import type { NotificationKind } from '../db/schema';
import { mailSend, type Mail } from '../mail/send';
import { notificationRecipients } from '../repositories/notification-preferences';

/**
 * Sends one kind of e-mail to those of these users who have not turned it off (never to the one who
 * acted). A mail server that does not answer is logged, not the request's failure: the action is done.
 */
export async function notify(
	db: DbOrTx,
	kind: NotificationKind,
	userIds: readonly (string | null)[],
	actorId: string,
	make: (to: { email: string; name: string }) => Mail
): Promise<number> {
	const ids = [...new Set(userIds.filter((u): u is string => !!u && u !== actorId))];
	const recipients = await notificationRecipients(db, ids, kind);
	let sent = 0;
	for (const r of recipients) {
		try {
			await mailSend(make(r));
			sent += 1;
		} catch (e) {
			log.error({ kind, userId: r.id, err: e }, 'notification could not be sent');
		}
	}
	return sent;
}
