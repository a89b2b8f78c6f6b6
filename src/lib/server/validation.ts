import { z } from 'zod';
import { ROLES } from '../roles';

/** Field rules shared by forms and the JSON API. */
export const roleSchema = z.enum(ROLES, 'Choose one of the roles: owner, pattern cutter, designer or sample room.');

export const emailSchema = z
	.string()
	.trim()
	.toLowerCase()
	.max(254, 'That e-mail address is too long.')
	.pipe(z.email('Enter an e-mail address like name@studio.com.'));

export const passwordSchema = z
	.string()
	.min(10, 'Use at least 10 characters.')
	.max(256, 'Use at most 256 characters.');

export const personNameSchema = z.string().trim().min(1, 'Enter your name.').max(120, 'Keep it under 120 characters.');

export const studioNameSchema = z
	.string()
	.trim()
	.min(1, 'Enter a studio name.')
	.max(120, 'Keep it under 120 characters.');

export const uuidSchema = z.uuid('Not a valid id.');

/** Field errors in the `{ field: [messages] }` form that forms and the API both use. */
export function fieldErrors(error: z.ZodError): Record<string, string[] | undefined> {
	return z.flattenError(error).fieldErrors as Record<string, string[] | undefined>;
}

/** FormData → plain object of its string fields (files are not expected on these forms). */
export function formObject(form: FormData): Record<string, string> {
	const out: Record<string, string> = {};
	for (const [k, v] of form.entries()) if (typeof v === 'string') out[k] = v;
	return out;
}
