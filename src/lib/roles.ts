/**
 * The roles a member has in a studio: the stored value, the name people read, and what the role
 * may do. The one home of the concept, shared by the server (authz table, validation, e-mails) and
 * the pages (header badge, members table, invitations): people never see the stored value.
 */
export const ROLES = ['owner', 'patterncutter', 'designer', 'sampleroom'] as const;
export type Role = (typeof ROLES)[number];

const LABELS: Record<Role, string> = {
	owner: 'owner',
	patterncutter: 'pattern cutter',
	designer: 'designer',
	sampleroom: 'sample room'
};

const DUTIES: Record<Role, string> = {
	owner: 'manages the studio and its members, and does everything a pattern cutter and a designer do',
	patterncutter: 'drafts, edits and proposes versions of pieces',
	designer: 'compares versions and signs them off',
	sampleroom: 'sees the signed-off versions, ready to cut'
};

export function isRole(value: unknown): value is Role {
	return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

/** The role's name as people read it ("pattern cutter"); an unknown value is shown as it is. */
export function roleLabel(role: string): string {
	return isRole(role) ? LABELS[role] : role;
}

/** One sentence part on what the role may do, e.g. for confirming a change of role. */
export function roleDuties(role: Role): string {
	return DUTIES[role];
}

/** The roles in their usual order, each with its label, for choosers. */
export const ROLE_OPTIONS: readonly { value: Role; label: string }[] = ROLES.map((value) => ({ value, label: LABELS[value] }));
