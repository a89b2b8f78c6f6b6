import { z } from 'zod';

/** The body of an account deletion: the person types their own e-mail address and their password. */
export function accountDeleteSchema(ownEmail: string) {
	return z.object({
		email: z
			.string('Type your e-mail address to confirm.')
			.trim()
			.refine((e) => e.toLowerCase() === ownEmail.toLowerCase(), `Type your own e-mail address, ${ownEmail}, to confirm.`),
		password: z.string('Type your password to confirm.').min(1, 'Type your password to confirm.').max(256)
	});
}

/** How each refusal of an account deletion is answered. */
export const accountDeleteStatus = { wrong_password: 403, throttled: 429, last_owner: 409 } as const;
