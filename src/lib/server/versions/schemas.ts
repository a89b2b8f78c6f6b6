import { z } from 'zod';
import { ledgerEntrySchema } from '$lib/pattern/ledger';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { recipeStepSchema } from '$lib/pattern/recipe/registry';
import { uuidSchema } from '../validation';

export { recipeStepSchema };

/** Request bodies of the styles / pieces / versions API. */
export const styleCreateSchema = z.object({
	name: z.string().trim().min(1, 'Give the style a name.').max(120),
	code: z.string().trim().max(40).default(''),
	season: z.string().trim().max(40).default(''),
	notes: z.string().max(4000).default(''),
	measurementSetId: uuidSchema.nullable().default(null)
});

export const stylePatchSchema = z
	.object({
		name: z.string().trim().min(1).max(120),
		code: z.string().trim().max(40),
		season: z.string().trim().max(40),
		notes: z.string().max(4000),
		status: z.enum(['in_work', 'in_review', 'signed_off', 'archived'])
	})
	.partial();


export const pieceCreateSchema = z.object({
	name: z.string().trim().min(1).max(120),
	message: z.string().trim().min(1).max(500).default('First version'),
	geometry: pieceSchema,
	origin: recipeStepSchema
});

/** Upper bounds on what one version may hold (answered 413 beyond). */
export const VERSION_BODY_LIMIT_BYTES = 4 * 1024 * 1024;
export const VERSION_MAX_SEGMENTS = 50_000;

export const versionSaveSchema = z.object({
	baseVersionId: uuidSchema.nullable(),
	message: z.string().trim().min(1, 'Say what changed in a few words.').max(500),
	geometry: pieceSchema,
	recipe: z.array(recipeStepSchema).max(200),
	/** Labelled changes the pattern cutter declares (added fullness, removed ease): posted to the ledger. */
	declared: z.array(ledgerEntrySchema).max(50).default([]),
	/** Accepted and ignored: the server computes every metric itself. */
	metrics: z.unknown().optional()
});

/**
 * The review of a version (POST …/versions/{versionId}/state): the author proposes it or withdraws the
 * proposal; a signer signs a proposed version off (confirming, with an optional comment, acknowledging
 * each seam warning and open fit note by its id) or sends it back with a reason.
 */
export const versionStateSchema = z.discriminatedUnion(
	'action',
	[
		z.object({ action: z.literal('propose'), comment: z.string().trim().max(2000).default('') }),
		z.object({ action: z.literal('withdraw') }),
		z.object({
			action: z.literal('sign_off'),
			comment: z.string().trim().max(2000).default(''),
			acknowledged: z.array(z.string().max(100)).max(500).default([])
		}),
		z.object({ action: z.literal('send_back'), reason: z.string().trim().min(1, 'Say why the version goes back, so its author knows what to change.').max(2000) })
	],
	'Say what to do: propose, withdraw, sign_off or send_back.'
);

/** A message in a version's comment thread. */
export const versionCommentSchema = z.object({ body: z.string().trim().min(1, 'Write the comment first.').max(4000) });

const vecSchema = z.object({ x: z.number().finite(), y: z.number().finite() });
export const seamPairCreateSchema = z.object({
	label: z.string().trim().max(120).default(''),
	a: z.object({ pieceId: uuidSchema, from: vecSchema, to: vecSchema }),
	b: z.object({ pieceId: uuidSchema, from: vecSchema, to: vecSchema }),
	allowedEaseMm: z.number().finite().min(-50).max(100).default(0),
	toleranceMm: z.number().finite().positive().max(20).default(1.6)
});

/** Moving a seam pair's edge ends (after truing) or changing its ease and tolerance. */
export const seamPairPatchSchema = z
	.object({
		label: z.string().trim().max(120),
		a: z.object({ from: vecSchema, to: vecSchema }),
		b: z.object({ from: vecSchema, to: vecSchema }),
		allowedEaseMm: z.number().finite().min(-50).max(100),
		toleranceMm: z.number().finite().positive().max(20)
	})
	.partial();
