import type { DbOrTx } from '../db';
import type { NotificationKind } from '../db/schema';

export const NOTIFICATION_KINDS: readonly NotificationKind[] = ['version_proposed', 'version_reviewed', 'fit_note_assigned'];

/** Each kind of e-mail with whether the user receives it (on unless turned off). */
export async function notificationPreferencesOf(db: DbOrTx, userId: string): Promise<Record<NotificationKind, boolean>> {
	const rows = await db.selectFrom('notification_preferences').select(['kind', 'enabled']).where('user_id', '=', userId).execute();
	const out = Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, true])) as Record<NotificationKind, boolean>;
	for (const r of rows) out[r.kind] = r.enabled;
	return out;
}

export async function notificationPreferencesSet(db: DbOrTx, userId: string, prefs: Partial<Record<NotificationKind, boolean>>): Promise<void> {
	const rows = Object.entries(prefs)
		.filter((e): e is [NotificationKind, boolean] => typeof e[1] === 'boolean')
		.map(([kind, enabled]) => ({ user_id: userId, kind, enabled }));
	if (rows.length === 0) return;
	await db
		.insertInto('notification_preferences')
		.values(rows)
		.onConflict((oc) => oc.columns(['user_id', 'kind']).doUpdateSet((eb) => ({ enabled: eb.ref('excluded.enabled') })))
		.execute();
}

/** Of these users, the ones who receive this kind of e-mail: id, e-mail, name. */
export async function notificationRecipients(
	db: DbOrTx,
	userIds: readonly string[],
	kind: NotificationKind
): Promise<{ id: string; email: string; name: string }[]> {
	if (userIds.length === 0) return [];
	return db
		.selectFrom('users')
		.leftJoin('notification_preferences as p', (j) => j.onRef('p.user_id', '=', 'users.id').on('p.kind', '=', kind))
		.select(['users.id', 'users.email', 'users.name'])
		.where('users.id', 'in', userIds)
		.where((eb) => eb.or([eb('p.enabled', 'is', null), eb('p.enabled', '=', true)]))
		.execute();
}
