import type { OperationResult } from '$lib/pattern/operation-result';
import type { SeparateParams } from '$lib/pattern/panels/separate';
import type { PiecesResult } from '$lib/pattern/panels/panel-types';
import type { Piece } from '$lib/pattern/piece-schema';
import { piecesStepApply, recipeStepApply } from '$lib/pattern/recipe/registry';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * The editor applies steps with the very functions the server replays (the recipe registry), so a
 * preview is what the server will compute. Separate makes new pieces: a style change.
 */
export function editorApply(piece: Piece, step: RecipeStepData): OperationResult {
	return recipeStepApply(piece, step);
}

export function editorSeparate(piece: Piece, params: SeparateParams): PiecesResult {
	return piecesStepApply([piece], { op: 'separate', params });
}
