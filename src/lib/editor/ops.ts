import type { OperationResult } from '$lib/pattern/operation-result';
import { separate, type SeparateParams } from '$lib/pattern/panels/separate';
import type { PiecesResult } from '$lib/pattern/panels/panel-types';
import type { Piece } from '$lib/pattern/piece-schema';
import { recipeReplayStep } from '$lib/pattern/verify/replay';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * The editor applies steps with the very function the server replays (recipeReplayStep), so a preview
 * is what the server will compute. Separate makes new pieces and starts their histories instead.
 */
export function editorApply(piece: Piece, step: RecipeStepData): OperationResult {
	return recipeReplayStep(piece, step);
}

export function editorSeparate(piece: Piece, params: SeparateParams): PiecesResult {
	return separate(piece, params);
}
