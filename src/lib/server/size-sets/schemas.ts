import { z } from 'zod';
import { SIZE_RUN_MAX_SIZES } from '../size-runs/service';

/** POST …/size-runs/{id}/keep: which of the run's sizes to keep (default: every size made whole), and a name. */
export const sizeSetKeepSchema = z.object({
	measurementSetIds: z
		.array(z.uuid('Not a valid measurement set id.'), { message: 'List the sizes to keep by their measurement set ids.' })
		.min(1, 'Pick at least one size to keep, or leave the list out to keep every size made whole.')
		.max(SIZE_RUN_MAX_SIZES, `A size run holds at most ${SIZE_RUN_MAX_SIZES} sizes.`)
		.refine((ids) => new Set(ids).size === ids.length, { message: 'A size is listed twice.' })
		.optional(),
	name: z.string('Name the size set with text.').trim().min(1, 'Give the size set a name, or leave it out.').max(120, 'Keep the name under 120 characters.').optional()
});
export type SizeSetKeep = z.output<typeof sizeSetKeepSchema>;

/** POST …/size-sets/{id}/sign-off: some sizes by id, or all that are not signed off yet. */
export const sizeSetSignOffSchema = z.object({
	sizes: z.union(
		[
			z.literal('all'),
			z
				.array(z.uuid('Not a valid size id.'))
				.min(1, 'Pick at least one size to sign off.')
				.max(SIZE_RUN_MAX_SIZES, `A size set holds at most ${SIZE_RUN_MAX_SIZES} sizes.`)
				.refine((ids) => new Set(ids).size === ids.length, { message: 'A size is listed twice.' })
		],
		{ message: 'Say which sizes to sign off: a list of size ids, or "all".' }
	),
	comment: z.string('Write the comment as text.').trim().max(2000, 'Keep the comment under 2000 characters.').default(''),
	/** A size with checks that did not pass is signed off only when the signer says they have read them. */
	acknowledgeChecks: z.boolean('Answer true or false.').default(false)
});
export type SizeSetSignOff = z.output<typeof sizeSetSignOffSchema>;
