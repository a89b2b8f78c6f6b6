/** A studio that would be left without an owner, and how many other members it has. */
export interface SoleOwnedStudio {
	studioName: string;
	otherMembers: number;
}

function names(studios: readonly SoleOwnedStudio[]): string {
	const quoted = studios.map((s) => `"${s.studioName}"`);
	return quoted.length <= 1 ? quoted.join('') : `${quoted.slice(0, -1).join(', ')} and ${quoted.at(-1)}`;
}

/**
 * Why an account cannot be deleted while its person is the only owner of studios, and what to do: where
 * the studio has other members, make one of them owner first; where the person is its only member, the
 * studio cannot be left without anyone (studios are not deleted in the app), so someone must be invited
 * as owner first. Empty when there is no such studio. `after` ends a refusal (the account page's notice
 * before any attempt leaves it out).
 */
export function lastOwnerMessage(studios: readonly SoleOwnedStudio[], after = ' Nothing was deleted.'): string {
	if (studios.length === 0) return '';
	const shared = studios.filter((s) => s.otherMembers > 0);
	const alone = studios.filter((s) => s.otherMembers === 0);
	const parts: string[] = [];
	if (shared.length > 0) {
		const one = shared.length === 1;
		parts.push(
			`You are the last owner of ${names(shared)}, and a studio needs an owner. Make another member owner first ` +
				`(on ${one ? 'its' : 'each one\'s'} Members page), then delete your account.`
		);
	}
	if (alone.length > 0) {
		const one = alone.length === 1;
		parts.push(
			`You are the only member of ${names(alone)}. Studios are not deleted in the app, and ${one ? 'it' : 'each'} needs an owner: ` +
				`invite someone as owner on ${one ? 'its' : 'each one\'s'} Members page and, once they have joined, delete your account.`
		);
	}
	return `${parts.join(' ')}${after}`;
}
