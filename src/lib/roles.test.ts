import { describe, expect, it } from 'vitest';
import { ROLE_OPTIONS, ROLES, roleDuties, roleLabel } from './roles';

describe('role names as people read them', () => {
	it('names every role in words, never as its stored value', () => {
		expect(roleLabel('patterncutter')).toBe('pattern cutter');
		expect(roleLabel('sampleroom')).toBe('sample room');
		expect(roleLabel('owner')).toBe('owner');
		expect(roleLabel('designer')).toBe('designer');
		for (const o of ROLE_OPTIONS) expect(o.label).toMatch(/^[a-z]+( [a-z]+)?$/);
	});

	it('offers every role once, in the usual order, each with what it may do', () => {
		expect(ROLE_OPTIONS.map((o) => o.value)).toEqual([...ROLES]);
		for (const r of ROLES) expect(roleDuties(r).length).toBeGreaterThan(10);
	});
});
