import type { ColumnType, Generated } from 'kysely';

type CreatedAt = ColumnType<Date, Date | string | undefined, never>;

/** Fittings, fit notes, reviews, comments and e-mail settings (migration 2026-12-03-0060). */
export type FitNoteCategory = 'too_tight' | 'too_loose' | 'length' | 'balance' | 'seam_placement' | 'other';
export type FitNoteStatus = 'open' | 'in_hand' | 'done';
export type ReviewKind = 'proposed' | 'withdrawn' | 'sent_back' | 'signed_off';
export type NotificationKind = 'version_proposed' | 'version_reviewed' | 'fit_note_assigned';

export interface FittingsTable {
	id: Generated<string>;
	style_id: string;
	fitted_on: ColumnType<string, string, string>;
	title: string;
	measurement_set_id: string | null;
	fit_model: Generated<string>;
	fabric: Generated<string>;
	notes: Generated<string>;
	created_by: string | null;
	created_at: CreatedAt;
}

export interface FittingVersionsTable {
	fitting_id: string;
	version_id: string;
}

export interface FittingPhotosTable {
	id: Generated<string>;
	fitting_id: string;
	display_key: string;
	thumb_key: string;
	content_type: string;
	width: number;
	height: number;
	thumb_width: number;
	thumb_height: number;
	bytes: number;
	caption: Generated<string>;
	created_by: string | null;
	created_at: CreatedAt;
}

export interface FitNotesTable {
	id: Generated<string>;
	fitting_id: string;
	piece_id: string;
	version_id: string;
	x_mm: number;
	y_mm: number;
	category: FitNoteCategory;
	amount_mm: number | null;
	body: string;
	status: Generated<FitNoteStatus>;
	resolved_version_id: string | null;
	assigned_to: string | null;
	created_by: string | null;
	created_at: CreatedAt;
	updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

export interface VersionCommentsTable {
	id: Generated<string>;
	version_id: string;
	author_id: string | null;
	body: string;
	created_at: CreatedAt;
}

export interface VersionReviewsTable {
	id: Generated<string>;
	version_id: string;
	kind: ReviewKind;
	actor_id: string | null;
	comment: Generated<string>;
	acknowledged: ColumnType<unknown, string | undefined, string>;
	created_at: CreatedAt;
}

export interface NotificationPreferencesTable {
	user_id: string;
	kind: NotificationKind;
	enabled: boolean;
}

/** The tables above, merged into `Database` (schema.ts). */
export interface FittingsDatabase {
	fittings: FittingsTable;
	fitting_versions: FittingVersionsTable;
	fitting_photos: FittingPhotosTable;
	fit_notes: FitNotesTable;
	version_comments: VersionCommentsTable;
	version_reviews: VersionReviewsTable;
	notification_preferences: NotificationPreferencesTable;
}
