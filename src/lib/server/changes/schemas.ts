import { z } from 'zod';
import { ledgerEntrySchema } from '$lib/pattern/ledger';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { changePieceSchema, changeStepSchema } from '$lib/pattern/recipe/change';
import { recipeStepSchema } from '$lib/pattern/recipe/registry';
import { uuidSchema } from '../validation';

/** The body of `POST /api/studios/{studioId}/styles/{styleId}/changes`: one style change, all or nothing. */

const vecSchema = z.object({ x: z.number().finite(), y: z.number().finite() });
const edgeEnds = { from: vecSchema, to: vecSchema };
/** A seam pair's side: a stored piece of the style, or a new piece of this change (index in `pieces`). */
const seamSideSchema = z.union([
	z.object({ pieceId: uuidSchema, ...edgeEnds }),
	z.object({ newPiece: z.number().int().min(0).max(199), ...edgeEnds })
]);

export const changeSeamPairCreateSchema = z.object({
	label: z.string().trim().max(120).default(''),
	a: seamSideSchema,
	b: seamSideSchema,
	allowedEaseMm: z.number().finite().min(-50).max(100).default(0),
	toleranceMm: z.number().finite().positive().max(20).default(1.6)
});
export type ChangeSeamPairCreate = z.infer<typeof changeSeamPairCreateSchema>;

export const changeSeamPairUpdateSchema = z.object({
	id: uuidSchema,
	label: z.string().trim().max(120).optional(),
	a: z.object(edgeEnds).optional(),
	b: z.object(edgeEnds).optional(),
	allowedEaseMm: z.number().finite().min(-50).max(100).optional(),
	toleranceMm: z.number().finite().positive().max(20).optional()
});
export type ChangeSeamPairUpdate = z.infer<typeof changeSeamPairUpdateSchema>;

/** A new piece, optionally with the edits made on it before the save (stored as its version 2). */
export const changeNewPieceSchema = changePieceSchema.extend({
	edits: z
		.object({
			message: z.string().trim().min(1).max(500).optional(),
			recipe: z.array(recipeStepSchema).min(1).max(200),
			geometry: pieceSchema,
			declared: z.array(ledgerEntrySchema).max(50).default([])
		})
		.optional()
});
export type ChangeNewPiece = z.infer<typeof changeNewPieceSchema>;

export const changeSaveSchema = z.object({
	message: z.string().trim().min(1, 'Say what changed in a few words.').max(500),
	/** The base (head) version of every stored piece the change touches. */
	bases: z.array(z.object({ pieceId: uuidSchema, versionId: uuidSchema })).min(1).max(40),
	steps: z.array(changeStepSchema).min(1).max(20),
	pieces: z.array(changeNewPieceSchema).min(1).max(40),
	seamPairs: z
		.object({
			create: z.array(changeSeamPairCreateSchema).max(100).default([]),
			update: z.array(changeSeamPairUpdateSchema).max(100).default([])
		})
		.default({ create: [], update: [] })
});
export type ChangeSaveBody = z.infer<typeof changeSaveSchema>;
