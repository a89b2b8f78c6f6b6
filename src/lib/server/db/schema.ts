import type { ColumnType, Generated } from 'kysely';
import type { Role } from '../../roles';
import type { FittingsDatabase } from './schema-fittings';
import type { SizeSetsDatabase } from './schema-size-sets';

/** Database tables as Kysely sees them. Keep in step with `migrations/`. */
export type { Role };

type CreatedAt = ColumnType<Date, Date | string | undefined, never>;

export interface UsersTable {
	id: Generated<string>;
	email: string;
	name: string;
	password_hash: string;
	created_at: CreatedAt;
}

export interface SessionsTable {
	id_hash: string;
	user_id: string;
	expires_at: Date;
	created_at: CreatedAt;
}

export interface StudiosTable {
	id: Generated<string>;
	name: string;
	created_at: CreatedAt;
}

export interface MembershipsTable {
	studio_id: string;
	user_id: string;
	role: Role;
	created_at: CreatedAt;
}

export interface InvitationsTable {
	id: Generated<string>;
	studio_id: string;
	email: string;
	role: Role;
	token_hash: string;
	invited_by: string | null;
	expires_at: Date;
	used_at: Date | null;
	created_at: CreatedAt;
}

export interface PasswordResetsTable {
	id: Generated<string>;
	user_id: string;
	token_hash: string;
	expires_at: Date;
	used_at: Date | null;
	created_at: CreatedAt;
}

export type VersionState = 'draft' | 'proposed' | 'signed_off' | 'superseded';
export type StyleStatus = 'in_work' | 'in_review' | 'signed_off' | 'archived';
type Json = ColumnType<unknown, string, string>;

export interface MeasurementSetsTable {
	id: Generated<string>;
	studio_id: string;
	name: string;
	kind: 'chart' | 'client';
	source: Generated<string>;
	client_ref: Generated<string>;
	notes: Generated<string>;
	unit: Generated<'mm' | 'cm' | 'in'>;
	read_only: Generated<boolean>;
	values: Json;
	created_by: string | null;
	created_at: CreatedAt;
}

export interface StylesTable {
	id: Generated<string>;
	studio_id: string;
	name: string;
	code: Generated<string>;
	season: Generated<string>;
	notes: Generated<string>;
	measurement_set_id: string | null;
	status: Generated<StyleStatus>;
	created_by: string | null;
	created_at: CreatedAt;
}

export interface PiecesTable {
	id: Generated<string>;
	style_id: string;
	name: string;
	cut: 'pair' | 'single' | 'on_fold';
	fabric: Generated<string>;
	sort_order: Generated<number>;
	head_version_id: string | null;
	head_number: Generated<number>;
	created_at: CreatedAt;
}

export interface PieceVersionsTable {
	id: Generated<string>;
	piece_id: string;
	number: number;
	parent_id: string | null;
	author_id: string | null;
	message: string;
	geometry: Json;
	recipe: Json;
	metrics: Json;
	checks: Json;
	state: Generated<VersionState>;
	signed_off_by: string | null;
	signed_off_at: Date | null;
	created_at: CreatedAt;
}

export interface SeamPairsTable {
	id: Generated<string>;
	style_id: string;
	label: Generated<string>;
	a_piece_id: string;
	a_edge: Json;
	b_piece_id: string;
	b_edge: Json;
	allowed_ease_mm: Generated<number>;
	tolerance_mm: Generated<number>;
	created_at: CreatedAt;
}

export interface Database {
	users: UsersTable;
	sessions: SessionsTable;
	studios: StudiosTable;
	memberships: MembershipsTable;
	invitations: InvitationsTable;
	password_resets: PasswordResetsTable;
	measurement_sets: MeasurementSetsTable;
	styles: StylesTable;
	pieces: PiecesTable;
	piece_versions: PieceVersionsTable;
	seam_pairs: SeamPairsTable;
	style_changes: StyleChangesTable;
	studio_billing: StudioBillingTable;
	billing_events: BillingEventsTable;
	billing_invoices: BillingInvoicesTable;
}

/** Multi-piece steps of one save (migration 2026-12-03-0040): recomputed from their sources' versions. */
export interface StyleChangesTable {
	id: Generated<string>;
	style_id: string;
	author_id: string | null;
	message: string;
	bases: Json;
	steps: Json;
	ledger: Json;
	checks: Json;
	created_at: CreatedAt;
}

/**
 * Columns added by migration 2026-12-01-0020 (measurement set charts). Declared by interface merging
 * so the table above stays as it was written.
 */
export interface MeasurementSetsTable {
	/** Stable key of a seeded chart row, e.g. "astm-d5585/curvy/12"; null for sets made by people. */
	chart_key: ColumnType<string | null, string | null | undefined, string | null>;
	/** The chart's source as data ({ standard, table, size, variant }); null for client sets. */
	chart_source: ColumnType<unknown, string | null | undefined, string | null>;
	sort_order: Generated<number>;
	updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

/** Studio billing (migration 2026-12-03-0050): the studio's state at the payment provider. */
export interface StudioBillingTable {
	studio_id: string;
	customer_id: string | null;
	subscription_id: string | null;
	status: string | null;
	price_id: string | null;
	interval: 'month' | 'year' | null;
	seats: Generated<number>;
	cancel_at_period_end: Generated<boolean>;
	current_period_end: Date | null;
	canceled_at: Date | null;
	ended_at: Date | null;
	provider_updated_at: Date | null;
	payment_failed_at: Date | null;
	updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

/** The provider's events already handled, by id: each is handled once. */
export interface BillingEventsTable {
	id: string;
	type: string;
	studio_id: string | null;
	provider_created_at: Date;
	outcome: 'applied' | 'stale' | 'unknown_studio' | 'ignored';
	received_at: CreatedAt;
}

/** The studio's invoices as the provider last showed them. */
export interface BillingInvoicesTable {
	id: string;
	studio_id: string;
	number: string | null;
	status: string;
	amount_due: number;
	amount_paid: number;
	currency: string;
	hosted_url: string | null;
	provider_created_at: Date;
	updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

/** Fittings, fit notes, reviews, comments and e-mail settings (migration 2026-12-03-0060), in their own file. */
export type { FitNoteCategory, FitNoteStatus, NotificationKind, ReviewKind } from './schema-fittings';
export interface Database extends FittingsDatabase {}

/** Size runs (migration 2026-12-03-0070): what a run was asked for, how far it got, what each size gave. */
export interface SizeRunsTable {
	id: Generated<string>;
	studio_id: string;
	style_id: string;
	created_by: string | null;
	status: ColumnType<'queued' | 'running' | 'done' | 'failed' | 'cancelled', 'queued' | 'running' | 'done' | 'failed' | 'cancelled' | undefined>;
	sizes: Json;
	results: ColumnType<unknown, string | undefined, string>;
	steps_done: ColumnType<number, number | undefined, number>;
	steps_total: ColumnType<number, number | undefined, number>;
	error: string | null;
	job_id: string | null;
	created_at: CreatedAt;
	updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
}
export interface Database {
	size_runs: SizeRunsTable;
}

/** Size sets (migration 2026-12-04-0080), in their own file. */
export type { SizeSetSizeState } from './schema-size-sets';
export interface Database extends SizeSetsDatabase {}
