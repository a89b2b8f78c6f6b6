import { z } from 'zod';
import { refuse, type OperationResult } from '../operation-result';
import { pieceStructureProblems } from '../piece';
import type { Piece } from '../piece-schema';
import { cap, capParamsSchema } from './cap';
import { pivot, pivotParamsSchema } from './pivot';
import { pleat, pleatParamsSchema } from './pleat';
import { pullBack, pullBackParamsSchema } from './pull-back';
import { share, shareParamsSchema } from './share';
import { spread, spreadParamsSchema } from './spread';

export { cap, capParamsSchema, type CapParams } from './cap';
export { pivot, pivotParamsSchema, type PivotParams } from './pivot';
export { pleat, pleatParamsSchema, equalIntakeAngles, SUBSTITUTE_PIVOT_MAX_RADIUS_MM, type PleatParams } from './pleat';
export { pullBack, pullBackParamsSchema, sewnPointFor, type PullBackParams } from './pull-back';
export { share, shareParamsSchema, resolveShares, type ShareParams } from './share';
export { spread, spreadParamsSchema, type SpreadParams } from './spread';

/** One recipe step: operation name and its parameters (validated). */
export const recipeStepSchema = z.discriminatedUnion('op', [
	z.object({ op: z.literal('pivot'), params: pivotParamsSchema }),
	z.object({ op: z.literal('share'), params: shareParamsSchema }),
	z.object({ op: z.literal('spread'), params: spreadParamsSchema }),
	z.object({ op: z.literal('pleat'), params: pleatParamsSchema }),
	z.object({ op: z.literal('pull_back'), params: pullBackParamsSchema }),
	z.object({ op: z.literal('cap'), params: capParamsSchema })
]);
export type RecipeStep = z.infer<typeof recipeStepSchema>;
export type RecipeStepInput = z.input<typeof recipeStepSchema>;
export type OperationName = RecipeStep['op'];
export const OPERATION_NAMES: readonly OperationName[] = ['pivot', 'share', 'spread', 'pleat', 'pull_back', 'cap'];

/**
 * Apply one recipe step to a piece (browser preview and server replay use this same function).
 * The step is validated first; a piece whose darts or pleats are not in its outline is refused.
 */
export function applyOperation(piece: Piece, step: RecipeStepInput | unknown): OperationResult {
	const parsed = recipeStepSchema.safeParse(step);
	if (!parsed.success) return refuse('invalid_params', `This step cannot be read: ${z.prettifyError(parsed.error)}`);
	const problems = pieceStructureProblems(piece);
	if (problems.length > 0) return refuse('invalid_piece', `The piece is not in a state operations can work on: ${problems.join('; ')}`);
	const s = parsed.data;
	switch (s.op) {
		case 'pivot':
			return pivot(piece, s.params);
		case 'share':
			return share(piece, s.params);
		case 'spread':
			return spread(piece, s.params);
		case 'pleat':
			return pleat(piece, s.params);
		case 'pull_back':
			return pullBack(piece, s.params);
		case 'cap':
			return cap(piece, s.params);
	}
}
