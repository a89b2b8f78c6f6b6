import type { OperationResult } from '$lib/pattern/operation-result';
import { separate, type SeparateParams } from '$lib/pattern/panels/separate';
import { styleLine, type StyleLineParams } from '$lib/pattern/panels/style-line';
import type { PiecesResult } from '$lib/pattern/panels/panel-types';
import type { Piece } from '$lib/pattern/piece-schema';
import { recipeReplayStep } from '$lib/pattern/verify/replay';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * The editor applies steps with the same functions the server replays (recipeReplayStep). Panel steps
 * that replay does not map yet (style_line) call the panel function directly; separate makes new pieces.
 */
export function editorApply(piece: Piece, step: RecipeStepData): OperationResult {
	if (step.op === 'style_line') {
		const r = styleLine(piece, step.params as StyleLineParams);
		return r.ok ? r : { ok: false, error: { code: 'invalid_params', message: r.error.message } };
	}
	return recipeReplayStep(piece, step);
}

export function editorSeparate(piece: Piece, params: SeparateParams): PiecesResult {
	return separate(piece, params);
}
