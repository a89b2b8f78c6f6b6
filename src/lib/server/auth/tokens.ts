import { createHash, randomBytes } from 'node:crypto';

/** SHA-256 hex digest: what the database keeps instead of session ids and link tokens. */
export function sha256Hex(value: string): string {
	return createHash('sha256').update(value, 'utf8').digest('hex');
}

/** An unguessable token for a link sent by e-mail (256 bits, URL-safe). */
export function linkTokenCreate(): string {
	return randomBytes(32).toString('base64url');
}

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;
