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

/**
 * What the signed-in member may do in a studio, decided once on the server from the authorization
 * table (`roleCan` in src/lib/server/authz.ts) and given to every page of the studio by its layout's
 * load as `data.can`. Pages ask `data.can.edit`, never compare role names.
 */
export interface Can {
	/** Draft, edit and save pieces and versions (the editor is read only without it). */
	readonly edit: boolean;
	/** Propose a draft version for sign-off. */
	readonly propose: boolean;
	/** Sign a version off. */
	readonly signOff: boolean;
	/** See versions that are not signed off (drafts, proposals); without it only signed-off versions show. */
	readonly seeDrafts: boolean;
	/** Start a style by drafting a block. */
	readonly createStyles: boolean;
	/** Create, edit and duplicate measurement sets. */
	readonly editMeasurements: boolean;
	/** Change members' roles and remove members. */
	readonly manageMembers: boolean;
	/** Invite people to the studio. */
	readonly invite: boolean;
	/** Rename the studio. */
	readonly manageStudio: boolean;
	/** See and change the studio's plan, seats and invoices (the Billing page). */
	readonly manageBilling: boolean;
	/** Record fittings of a toile and upload their photos. */
	readonly recordFittings: boolean;
	/** Pin fit notes on a piece version. */
	readonly pinNotes: boolean;
	/** Mark a fit note done, resolved by a version. */
	readonly resolveNotes: boolean;
	/** Write in a version's comment thread. */
	readonly comment: boolean;
	/** Start and cancel size runs (a style made again on other measurement sets). */
	readonly runSizes: boolean;
	/** Keep a done size run as a size set of the style. */
	readonly keepSizeSets: boolean;
	/** Sign sizes of a size set off. */
	readonly signOffSizes: boolean;
}

/** The roles in their usual order, each with its label, for choosers. */
export const ROLE_OPTIONS: readonly { value: Role; label: string }[] = ROLES.map((value) => ({ value, label: LABELS[value] }));
