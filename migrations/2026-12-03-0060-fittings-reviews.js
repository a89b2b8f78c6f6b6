// Fittings of a style's toile (photos in the object store, fit notes pinned to a point of a piece
// version), the review of a version (proposed, withdrawn, sent back, signed off, each recorded with
// who, why and what was acknowledged), comment threads on versions, and which e-mails a user wants.
import { sql } from 'kysely';

/** @param {import('kysely').Kysely<any>} db */
export async function up(db) {
	await db.schema
		.createTable('fittings')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('style_id', 'uuid', (c) => c.notNull().references('styles.id').onDelete('cascade'))
		.addColumn('fitted_on', 'date', (c) => c.notNull())
		.addColumn('title', 'text', (c) => c.notNull())
		// who was fitted: a client's measurement set, or a named fit model (one of the two)
		.addColumn('measurement_set_id', 'uuid', (c) => c.references('measurement_sets.id').onDelete('set null'))
		.addColumn('fit_model', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('fabric', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('fittings_style').on('fittings').columns(['style_id', 'fitted_on']).execute();
	// the piece versions the toile was cut from
	await db.schema
		.createTable('fitting_versions')
		.addColumn('fitting_id', 'uuid', (c) => c.notNull().references('fittings.id').onDelete('cascade'))
		.addColumn('version_id', 'uuid', (c) => c.notNull().references('piece_versions.id').onDelete('cascade'))
		.addPrimaryKeyConstraint('fitting_versions_pk', ['fitting_id', 'version_id'])
		.execute();
	await db.schema
		.createTable('fitting_photos')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('fitting_id', 'uuid', (c) => c.notNull().references('fittings.id').onDelete('cascade'))
		// random object keys (never the uploaded file's name): the re-encoded display size and thumbnail
		.addColumn('display_key', 'text', (c) => c.notNull().unique())
		.addColumn('thumb_key', 'text', (c) => c.notNull().unique())
		.addColumn('content_type', 'text', (c) => c.notNull())
		.addColumn('width', 'integer', (c) => c.notNull())
		.addColumn('height', 'integer', (c) => c.notNull())
		.addColumn('thumb_width', 'integer', (c) => c.notNull())
		.addColumn('thumb_height', 'integer', (c) => c.notNull())
		.addColumn('bytes', 'integer', (c) => c.notNull())
		.addColumn('caption', 'text', (c) => c.notNull().defaultTo(''))
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('fitting_photos_fitting').on('fitting_photos').column('fitting_id').execute();
	await db.schema
		.createTable('fit_notes')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('fitting_id', 'uuid', (c) => c.notNull().references('fittings.id').onDelete('cascade'))
		.addColumn('piece_id', 'uuid', (c) => c.notNull().references('pieces.id').onDelete('cascade'))
		// the version the note was pinned on, and the point on it (mm, the piece's own frame)
		.addColumn('version_id', 'uuid', (c) => c.notNull().references('piece_versions.id').onDelete('cascade'))
		.addColumn('x_mm', 'double precision', (c) => c.notNull())
		.addColumn('y_mm', 'double precision', (c) => c.notNull())
		.addColumn('category', 'text', (c) =>
			c.notNull().check(sql`category in ('too_tight', 'too_loose', 'length', 'balance', 'seam_placement', 'other')`)
		)
		.addColumn('amount_mm', 'double precision')
		.addColumn('body', 'text', (c) => c.notNull())
		.addColumn('status', 'text', (c) => c.notNull().defaultTo('open').check(sql`status in ('open', 'in_hand', 'done')`))
		.addColumn('resolved_version_id', 'uuid', (c) => c.references('piece_versions.id').onDelete('set null'))
		.addColumn('assigned_to', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.addCheckConstraint('fit_notes_done_has_version', sql`(status = 'done') = (resolved_version_id is not null)`)
		.execute();
	await db.schema.createIndex('fit_notes_fitting').on('fit_notes').column('fitting_id').execute();
	await db.schema.createIndex('fit_notes_piece').on('fit_notes').columns(['piece_id', 'status']).execute();
	await db.schema
		.createTable('version_comments')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('version_id', 'uuid', (c) => c.notNull().references('piece_versions.id').onDelete('cascade'))
		.addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		.addColumn('body', 'text', (c) => c.notNull())
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('version_comments_version').on('version_comments').columns(['version_id', 'created_at']).execute();
	await db.schema
		.createTable('version_reviews')
		.addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
		.addColumn('version_id', 'uuid', (c) => c.notNull().references('piece_versions.id').onDelete('cascade'))
		.addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('proposed', 'withdrawn', 'sent_back', 'signed_off')`))
		.addColumn('actor_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
		// the comment of a sign-off, the reason of a sending back
		.addColumn('comment', 'text', (c) => c.notNull().defaultTo(''))
		// what the signer acknowledged: [{ kind: 'seam' | 'fit_note', id, message }]
		.addColumn('acknowledged', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
		.addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
		.execute();
	await db.schema.createIndex('version_reviews_version').on('version_reviews').columns(['version_id', 'created_at']).execute();
	await db.schema
		.createTable('notification_preferences')
		.addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
		.addColumn('kind', 'text', (c) =>
			c.notNull().check(sql`kind in ('version_proposed', 'version_reviewed', 'fit_note_assigned')`)
		)
		.addColumn('enabled', 'boolean', (c) => c.notNull())
		.addPrimaryKeyConstraint('notification_preferences_pk', ['user_id', 'kind'])
		.execute();
}

/** @param {import('kysely').Kysely<any>} db */
export async function down(db) {
	for (const t of ['notification_preferences', 'version_reviews', 'version_comments', 'fit_notes', 'fitting_photos', 'fitting_versions', 'fittings']) {
		await db.schema.dropTable(t).execute();
	}
}
