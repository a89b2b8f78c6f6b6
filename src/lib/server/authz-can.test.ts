import { describe, expect, it } from 'vitest';
import { ROLES, type Can, type Role } from '$lib/roles';
import { AUTHZ, roleCan, roleMay, type Method } from './authz';

const allowed = (routeId: string, method: Method, role: Role) => {
	const rule = AUTHZ[routeId][method];
	return rule === 'public' || rule === 'signed_in' || (Array.isArray(rule) && rule.includes(role));
};

describe('what a member may do, decided once from the authorization table', () => {
	it('matches the table for every role: each capability is the rule of the request it leads to', () => {
		const s = '/api/studios/[studioId]';
		for (const role of ROLES) {
			const can = roleCan(role);
			expect(can.edit).toBe(allowed(`${s}/pieces/[pieceId]/versions`, 'POST', role));
			expect(can.edit).toBe(allowed(`${s}/styles/[styleId]/changes`, 'POST', role));
			expect(can.createStyles).toBe(allowed('/studios/[studioId]/styles/new', 'POST', role));
			expect(can.editMeasurements).toBe(allowed(`${s}/measurement-sets`, 'POST', role));
			expect(can.editMeasurements).toBe(allowed('/studios/[studioId]/measurements/new', 'GET', role));
			expect(can.manageMembers).toBe(allowed(`${s}/members/[userId]`, 'PATCH', role));
			expect(can.invite).toBe(allowed(`${s}/invitations`, 'POST', role));
			expect(can.manageStudio).toBe(allowed(s, 'PATCH', role));
			expect(can.manageBilling).toBe(allowed(`${s}/billing`, 'GET', role));
			expect(can.manageBilling).toBe(allowed('/studios/[studioId]/billing', 'GET', role));
			expect(can.recordFittings).toBe(allowed(`${s}/styles/[styleId]/fittings`, 'POST', role));
			expect(can.recordFittings).toBe(allowed(`${s}/fittings/[fittingId]/photos`, 'POST', role));
			expect(can.pinNotes).toBe(allowed(`${s}/fittings/[fittingId]/notes`, 'POST', role));
			expect(can.resolveNotes).toBe(allowed(`${s}/fittings/[fittingId]/notes/[noteId]/done`, 'POST', role));
			expect(can.comment).toBe(allowed(`${s}/pieces/[pieceId]/versions/[versionId]/comments`, 'POST', role));
			expect(can.runSizes).toBe(allowed(`${s}/styles/[styleId]/size-runs`, 'POST', role));
			// proposing and signing off go through the state route; whoever may do either is let through it
			expect(can.propose || can.signOff).toBe(allowed(`${s}/pieces/[pieceId]/versions/[versionId]/state`, 'POST', role));
		}
	});

	// The product's roles (docs/product.md, src/lib/roles.ts duties): the owner does everything, the
	// pattern cutter drafts and proposes, the designer signs off, the sample room sees signed-off versions.
	// Fittings (issue 15): the sample room records fittings and uploads photos; everyone who reads a
	// fitting may pin a note on it; only the pattern cutter or the owner marks a note done.
	it('gives each role what the product says it does', () => {
		const expected: Record<Role, Can> = {
			owner: { edit: true, propose: true, signOff: true, seeDrafts: true, createStyles: true, editMeasurements: true, manageMembers: true, invite: true, manageStudio: true, manageBilling: true, recordFittings: true, pinNotes: true, resolveNotes: true, comment: true, runSizes: true, keepSizeSets: true, signOffSizes: true },
			patterncutter: { edit: true, propose: true, signOff: false, seeDrafts: true, createStyles: true, editMeasurements: true, manageMembers: false, invite: false, manageStudio: false, manageBilling: false, recordFittings: false, pinNotes: true, resolveNotes: true, comment: true, runSizes: true, keepSizeSets: true, signOffSizes: false },
			designer: { edit: false, propose: false, signOff: true, seeDrafts: true, createStyles: false, editMeasurements: false, manageMembers: false, invite: false, manageStudio: false, manageBilling: false, recordFittings: false, pinNotes: true, resolveNotes: false, comment: true, runSizes: false, keepSizeSets: false, signOffSizes: true },
			sampleroom: { edit: false, propose: false, signOff: false, seeDrafts: false, createStyles: false, editMeasurements: false, manageMembers: false, invite: false, manageStudio: false, manageBilling: false, recordFittings: true, pinNotes: true, resolveNotes: false, comment: false, runSizes: false, keepSizeSets: false, signOffSizes: false }
		};
		for (const role of ROLES) expect(roleCan(role)).toEqual(expected[role]);
	});

	it('answers no for a route or method the table does not have', () => {
		expect(roleMay('owner', '/no/such/route', 'GET')).toBe(false);
		expect(roleMay('owner', '/api/studios/[studioId]/members', 'DELETE')).toBe(false);
		expect(roleMay('sampleroom', '/', 'GET')).toBe(true);
	});
});
