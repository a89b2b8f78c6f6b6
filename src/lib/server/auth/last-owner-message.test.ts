import { describe, expect, it } from 'vitest';
import { lastOwnerMessage } from './last-owner-message';

describe('the refusal of an account deletion by a last owner', () => {
	it('says nothing when no studio would be left without an owner', () => {
		expect(lastOwnerMessage([])).toBe('');
	});

	it('asks to make another member owner first where the studio has other members', () => {
		expect(lastOwnerMessage([{ studioName: 'Linden Row', otherMembers: 3 }])).toBe(
			'You are the last owner of "Linden Row", and a studio needs an owner. Make another member owner first (on its Members page), then delete your account. Nothing was deleted.'
		);
	});

	it('explains, for a studio whose only member the person is, that it is not deleted and needs someone invited as owner', () => {
		const m = lastOwnerMessage([
			{ studioName: 'Willow Yard', otherMembers: 1 },
			{ studioName: 'Own room', otherMembers: 0 },
			{ studioName: 'Night class', otherMembers: 0 }
		]);
		expect(m).toBe(
			'You are the last owner of "Willow Yard", and a studio needs an owner. Make another member owner first (on its Members page), then delete your account. ' +
				'You are the only member of "Own room" and "Night class". Studios are not deleted in the app, and each needs an owner: invite someone as owner on each one\'s Members page and, once they have joined, delete your account. Nothing was deleted.'
		);
	});

	it('leaves out the closing words when the account page says it before any attempt', () => {
		expect(lastOwnerMessage([{ studioName: 'Own room', otherMembers: 0 }], '')).toMatch(/delete your account\.$/);
	});
});
