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

export const versionStateSchema = z.object({ state: z.enum(['proposed', 'signed_off']) });

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
