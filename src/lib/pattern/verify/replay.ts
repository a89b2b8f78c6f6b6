import { applyOperation } from '../operations';
import { refuse, type OperationResult } from '../operation-result';
import type { Piece } from '../piece-schema';
import { reshape } from './reshape';
import type { RecipeStepData } from './version-verify';

/**
 * Replays one recipe step: the single place that maps a stored operation name to its pure function,
 * the same in the browser (preview) and on the server (verification).
 */
export function recipeReplayStep(piece: Piece, step: RecipeStepData): OperationResult {
	if (step.op === 'reshape') return reshape(piece, step.params);
	if (step.op === 'draft' || step.op === 'import') {
		return refuse('invalid_params', `"${step.op}" starts a piece's history; it cannot be applied to an existing version.`);
	}
	return applyOperation(piece, step as Parameters<typeof applyOperation>[1]);
}
