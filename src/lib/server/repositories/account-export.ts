import type { DbOrTx } from '../db';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/**
 * What a person may download about themselves (GET /api/me/export): their profile, memberships, e-mail
 * settings, the number of their open sessions, and what they authored, as metadata and their own words
 * (version messages, comments, review remarks, fit notes). Never another person's data: no geometry, no
 * measurements, no names of clients or fit models, no other author's text.
 */
export async function accountExport(db: DbOrTx, userId: string) {
	const profile = await db.selectFrom('users').select(['id', 'email', 'name', 'created_at']).where('id', '=', userId).executeTakeFirstOrThrow();
	const [memberships, notifications, sessions, versions, signedOff, changes, comments, reviews, fittings, photos, notes, styles, sets, runs] =
		await Promise.all([
			db.selectFrom('memberships').innerJoin('studios', 'studios.id', 'memberships.studio_id')
				.select(['studios.id as studioId', 'studios.name as studioName', 'memberships.role', 'memberships.created_at'])
				.where('memberships.user_id', '=', userId).orderBy('memberships.created_at').execute(),
			db.selectFrom('notification_preferences').select(['kind', 'enabled']).where('user_id', '=', userId).orderBy('kind').execute(),
			db.selectFrom('sessions').select(['created_at', 'expires_at']).where('user_id', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('piece_versions').innerJoin('pieces', 'pieces.id', 'piece_versions.piece_id').innerJoin('styles', 'styles.id', 'pieces.style_id')
				.select(['piece_versions.id', 'styles.studio_id as studioId', 'pieces.style_id as styleId', 'piece_versions.piece_id as pieceId',
					'piece_versions.number', 'piece_versions.message', 'piece_versions.state', 'piece_versions.created_at'])
				.where('piece_versions.author_id', '=', userId).orderBy('piece_versions.created_at').execute(),
			db.selectFrom('piece_versions').select(['id', 'piece_id as pieceId', 'number', 'signed_off_at'])
				.where('signed_off_by', '=', userId).orderBy('signed_off_at').execute(),
			db.selectFrom('style_changes').select(['id', 'style_id as styleId', 'message', 'created_at'])
				.where('author_id', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('version_comments').select(['id', 'version_id as versionId', 'body', 'created_at'])
				.where('author_id', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('version_reviews').select(['id', 'version_id as versionId', 'kind', 'comment', 'created_at'])
				.where('actor_id', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('fittings').select(['id', 'style_id as styleId', 'fitted_on as fittedOn', 'title', 'created_at'])
				.where('created_by', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('fitting_photos').select(['id', 'fitting_id as fittingId', 'created_at'])
				.where('created_by', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('fit_notes').select(['id', 'fitting_id as fittingId', 'version_id as versionId', 'category', 'amount_mm', 'body', 'status', 'created_at'])
				.where('created_by', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('styles').select(['id', 'studio_id as studioId', 'created_at'])
				.where('created_by', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('measurement_sets').select(['id', 'studio_id as studioId', 'kind', 'created_at'])
				.where('created_by', '=', userId).orderBy('created_at').execute(),
			db.selectFrom('size_runs').select(['id', 'style_id as styleId', 'status', 'created_at'])
				.where('created_by', '=', userId).orderBy('created_at').execute()
		]);
	return {
		profile: { id: profile.id, email: profile.email, name: profile.name, createdAt: iso(profile.created_at) },
		memberships: memberships.map((m) => ({ studioId: m.studioId, studioName: m.studioName, role: m.role, joinedAt: iso(m.created_at) })),
		emailSettings: notifications,
		sessions: sessions.map((s) => ({ startedAt: iso(s.created_at), expiresAt: iso(s.expires_at) })),
		authored: {
			versions: versions.map(({ created_at, ...v }) => ({ ...v, createdAt: iso(created_at) })),
			versionsSignedOff: signedOff.map(({ signed_off_at, ...v }) => ({ ...v, signedOffAt: iso(signed_off_at) })),
			styleChanges: changes.map(({ created_at, ...c }) => ({ ...c, createdAt: iso(created_at) })),
			comments: comments.map(({ created_at, ...c }) => ({ ...c, createdAt: iso(created_at) })),
			reviews: reviews.map(({ created_at, ...r }) => ({ ...r, createdAt: iso(created_at) })),
			fittings: fittings.map(({ created_at, ...f }) => ({ ...f, createdAt: iso(created_at) })),
			fittingPhotos: photos.map(({ created_at, ...p }) => ({ ...p, createdAt: iso(created_at) })),
			fitNotes: notes.map(({ created_at, amount_mm, ...n }) => ({ ...n, amountMm: amount_mm, createdAt: iso(created_at) })),
			styles: styles.map(({ created_at, ...s }) => ({ ...s, createdAt: iso(created_at) })),
			measurementSets: sets.map(({ created_at, ...s }) => ({ ...s, createdAt: iso(created_at) })),
			sizeRuns: runs.map(({ created_at, ...r }) => ({ ...r, createdAt: iso(created_at) }))
		}
	};
}
