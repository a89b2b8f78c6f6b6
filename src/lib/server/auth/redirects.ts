import { db } from '../db';
import { membershipsForUser } from '../repositories/memberships';

/** A local path to go back to after sign-in, or null for anything that could leave the site. */
export function safeNext(value: string | null | undefined): string | null {
	if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return null;
	if (/[\u0000-\u001f]/.test(value)) return null;
	return value;
}

/** Where a signed-in user lands: their first studio, or the page that creates one. */
export async function homePath(userId: string): Promise<string> {
	const m = await membershipsForUser(db(), userId);
	return m.length > 0 ? `/studios/${m[0].studioId}` : '/studios/new';
}
