import type { ColumnType, Generated } from 'kysely';

/** Database tables as Kysely sees them. Keep in step with `migrations/`. */
export type Role = 'owner' | 'patterncutter' | 'designer' | 'sampleroom';

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

export interface Database {
	users: UsersTable;
	sessions: SessionsTable;
	studios: StudiosTable;
	memberships: MembershipsTable;
	invitations: InvitationsTable;
	password_resets: PasswordResetsTable;
}
