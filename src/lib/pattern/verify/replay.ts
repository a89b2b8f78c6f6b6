import { applyOperation } from '../operations';
import { refuse, type OperationResult } from '../operation-result';
import type { Piece } from '../piece-schema';
import { isPanelStep, panelStepApply } from './panel-steps';
import { reshape } from './reshape';
import type { RecipeStepData } from './version-verify';

function outlineSame(a: Piece, b: Piece): boolean {
	return a.outline === b.outline || JSON.stringify(a.outline) === JSON.stringify(b.outline);
}

/**
 * Replays one recipe step: the single place that maps a stored operation name to its pure function,
 * the same in the browser (preview) and on the server (verification). A step that changes the
 * stitching line drops a seam allowance added before it: allowance comes last, and is added again.
 */
export function recipeReplayStep(piece: Piece, step: RecipeStepData): OperationResult {
	let r: OperationResult;
	if (step.op === 'reshape') r = reshape(piece, step.params);
	else if (isPanelStep(step.op)) r = panelStepApply(piece, step.op, step.params ?? {});
	else if (step.op === 'draft' || step.op === 'import' || step.op === 'separate_result') {
		return refuse('invalid_params', `"${step.op}" starts a piece's history; it cannot be applied to an existing version.`);
	} else r = applyOperation(piece, step as Parameters<typeof applyOperation>[1]);
	if (r.ok && step.op !== 'allowance' && r.piece.seamAllowance && !outlineSame(piece, r.piece)) {
		r = {
			...r,
			piece: { ...r.piece, seamAllowance: null },
			report: { ...r.report, notes: [...r.report.notes, 'The seam allowance was removed because the stitching line changed; add it again last.'] }
		};
	}
	return r;
}
