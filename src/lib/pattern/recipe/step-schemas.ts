import { z } from 'zod';
import { allowanceCornerSchema, lineMarkSchema, pathSchema, vecSchema } from '../piece-schema';

/**
 * Parameters of the recipe steps that are not dart operations (those keep their schemas beside their
 * functions in ../operations). Params are validated because a recipe comes from outside; the registry
 * (./registry.ts) names which schema belongs to which step.
 */
const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });
const id = z.string().min(1).max(64);
const label = z.string().max(200);

export const styleLineParamsSchema = z.object({ id, path: pathSchema, label: z.string().max(80).optional() });
export const notchParamsSchema = z.object({ id, at: vecSchema, count: z.union([z.literal(1), z.literal(2)]).optional() });
export const divergencePointParamsSchema = z
	.object({ apexId: id.optional(), at: vecSchema.optional(), id: id.optional(), label: z.string().max(80).optional() })
	.refine((p) => p.apexId !== undefined || (p.at !== undefined && p.id !== undefined), { message: 'give the apex to mark, or a point and an id' });
export const grainParamsSchema = z.object({
	through: vecSchema,
	lengthMm: finite(),
	direction: z.enum(['lengthwise', 'crosswise', 'bias']).optional(),
	centreLine: lineMarkSchema.optional(),
	arrowheads: z.enum(['both', 'one']).optional()
});
export const foldParamsSchema = z.object({ from: vecSchema, to: vecSchema });
export const unfoldParamsSchema = z.object({}).optional();
export const allowanceParamsSchema = z.object({
	defaultWidthMm: finite().optional(),
	widthsMm: z.record(z.string(), finite()).optional(),
	corners: z.record(z.string(), allowanceCornerSchema).optional(),
	defaultCorner: allowanceCornerSchema.optional()
});

/** Origin steps: what made a piece's first version (drafting, an import, a style change). */
export const draftParamsSchema = z.looseObject({});
export const importParamsSchema = z.looseObject({});
/** Made by a style change before changes were recomputed on the server (kept for stored histories). */
export const separateResultParamsSchema = z.looseObject({});
/** Made by a style change: which change, which of its steps, which result of that step. */
export const changeResultParamsSchema = z.object({
	changeId: z.string().max(64).optional(),
	step: z.number().int().min(0).max(199),
	result: z.number().int().min(0).max(199)
});

// ---- steps that span pieces: their seams carry the edges as paths, both running the same way -------
const seamEdgeSchema = z.object({ pieceId: id, edge: pathSchema });
export const seamPairParamsSchema = z.object({
	id: label.min(1),
	a: seamEdgeSchema,
	b: seamEdgeSchema,
	allowedEaseMm: finite(),
	toleranceMm: finite().refine((n) => n > 0, { message: 'must be positive' }),
	/** The style's stored seam pair this seam is (its lengths are checked with it), if any. */
	storedId: z.string().max(64).optional()
});
export type SeamPairParams = z.infer<typeof seamPairParamsSchema>;

export const separateParamsSchema = z
	.object({
		styleLineId: id.optional(),
		path: pathSchema.optional(),
		pieceIds: z.tuple([id, id]).optional(),
		pieceNames: z.tuple([label.min(1), label.min(1)]).optional(),
		seamPairId: id.optional(),
		notchFractions: z.array(finite()).max(20).optional()
	})
	.refine((p) => p.styleLineId !== undefined || p.path !== undefined, { message: 'give styleLineId or path' });

export const joinParamsSchema = z.object({
	seam: seamPairParamsSchema,
	pieceId: id.optional(),
	name: label.min(1).optional(),
	wedge: z.enum(['close', 'keep_as_dart']).optional(),
	carriedBy: label.optional(),
	dartId: id.optional()
});

export const carryParamsSchema = z.object({
	seams: z.array(seamPairParamsSchema).min(1).max(40),
	styleLine: pathSchema,
	fuse: z.enum(['above', 'below']),
	residualAs: z.enum(['dart', 'pleats']).optional(),
	pieceId: id.optional(),
	name: label.min(1).optional(),
	styleSeamId: id.optional(),
	walkLegs: z.boolean().optional()
});
