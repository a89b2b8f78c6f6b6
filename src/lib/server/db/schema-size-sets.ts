import type { ColumnType, Generated } from 'kysely';

type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
type Json = ColumnType<unknown, string, string>;

/** Size sets: a size run's results kept (migration 2026-12-04-0080). */
export type SizeSetSizeState = 'draft' | 'signed_off';

export interface SizeSetsTable {
	id: Generated<string>;
	studio_id: string;
	style_id: string;
	size_run_id: string | null;
	name: string;
	created_by: string | null;
	created_at: CreatedAt;
}

export interface SizeSetSizesTable {
	id: Generated<string>;
	size_set_id: string;
	measurement_set_id: string | null;
	name: string;
	position: number;
	checks: Json;
	state: ColumnType<SizeSetSizeState, SizeSetSizeState | undefined, SizeSetSizeState>;
	signed_off_by: string | null;
	signed_off_at: Date | null;
	sign_off_comment: Generated<string>;
}

export interface SizeSetVersionsTable {
	id: Generated<string>;
	size_id: string;
	base_piece_id: string | null;
	base_version_id: string | null;
	base_version_number: number;
	name: string;
	cut: 'pair' | 'single' | 'on_fold';
	fabric: Generated<string>;
	position: number;
	geometry: Json;
	metrics: Json;
	checks: Json;
	created_at: CreatedAt;
}

/** The tables above, merged into `Database` (schema.ts). */
export interface SizeSetsDatabase {
	size_sets: SizeSetsTable;
	size_set_sizes: SizeSetSizesTable;
	size_set_versions: SizeSetVersionsTable;
}
