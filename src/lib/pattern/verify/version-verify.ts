import type { LedgerEntry, ShapingCheck } from '../ledger';
import { LABELLED_KINDS, ledgerEntriesWithoutNote, shapingChecks } from '../ledger';
import { pieceMetrics, type PieceMetrics } from '../metrics';
import type { OperationResult } from '../operation-result';
import { resultProblems } from '../operation-result';
import type { Piece } from '../piece-schema';
import { CLIENT_ORIGIN_STEP_NAMES } from '../recipe/registry';
import { stepAnchorProblems } from '../anchors/anchor-check';
import { pieceGeometryDifference, REPLAY_TOLERANCE_MM } from './piece-compare';

/** One step of a recipe as stored: an operation name and its parameters. */
export interface RecipeStepData {
	readonly op: string;
	readonly params?: unknown;
}

export type ReplayStep = (piece: Piece, step: RecipeStepData) => OperationResult;

export type VerifyProblemCode = 'declaration_incomplete' | 'invalid_geometry' | 'recipe_missing' | 'replay_refused' | 'replay_mismatch' | 'shaping_not_kept';

export interface VerifyProblem {
	readonly code: VerifyProblemCode;
	readonly message: string;
	readonly details?: readonly string[];
}

export type VersionVerdict =
	| {
			readonly ok: true;
			/** The server's own piece: the replay's result (or the submitted origin for a first version). */
			readonly piece: Piece;
			readonly metrics: PieceMetrics;
			readonly ledger: readonly LedgerEntry[];
			readonly checks: readonly ShapingCheck[];
	  }
	| { readonly ok: false; readonly problem: VerifyProblem };


function fail(code: VerifyProblemCode, message: string, details?: readonly string[]): VersionVerdict {
	return { ok: false, problem: { code, message, details } };
}

/**
 * What the server does with a submitted version before storing it (pure, so the browser can run the
 * same check before saving): the geometry must be sound; for a version with a parent, replaying the
 * recipe on the parent must give the submitted geometry within 0.01 mm; and every shaping check must
 * pass (each apex balanced or the change declared as a labelled entry: added fullness, removed ease,
 * other with a note; area outside the darts and seam lengths kept or declared). Metrics come from the
 * server's own computation, never from the client.
 */
export function versionVerify(
	parent: Piece | null,
	submitted: Piece,
	recipe: readonly RecipeStepData[],
	replay: ReplayStep,
	declared: readonly LedgerEntry[] = []
): VersionVerdict {
	const undeclarable = declared.find((e) => !(LABELLED_KINDS as readonly string[]).includes(e.kind));
	if (undeclarable) {
		return fail('shaping_not_kept', `Only labelled changes (${LABELLED_KINDS.join(', ')}) can be declared; "${undeclarable.kind}" entries come from operations.`);
	}
	const unexplained = ledgerEntriesWithoutNote(declared);
	if (unexplained.length > 0) {
		return fail('declaration_incomplete', `A change declared as "other" needs a note saying what it is (${unexplained.map((e) => e.label || e.refId).join('; ')}).`);
	}
	const problems = resultProblems(submitted);
	if (problems.length > 0) {
		return fail('invalid_geometry', `The piece's geometry is not sound: ${problems.slice(0, 3).join(' ')}`, problems);
	}
	if (parent === null) {
		const origin = recipe.length === 1 && (CLIENT_ORIGIN_STEP_NAMES as readonly string[]).includes(recipe[0].op);
		if (!origin) {
			return fail(
				'recipe_missing',
				`A first version must come from ${CLIENT_ORIGIN_STEP_NAMES.join(' or ')}, as a single recipe step; a piece made by separate, join or carry is saved as a style change, recomputed from its sources.`
			);
		}
		return { ok: true, piece: submitted, metrics: pieceMetrics(submitted), ledger: [], checks: [] };
	}
	if (recipe.length === 0) {
		return fail('recipe_missing', 'A new version must say which operations made it from its base version (the recipe is empty).');
	}
	let current = parent;
	const ledger: LedgerEntry[] = [];
	for (const [i, step] of recipe.entries()) {
		const anchors = stepAnchorProblems(step.params, [current], false);
		if (anchors.length > 0) return fail('replay_refused', `Step ${i + 1} (${step.op}): ${anchors[0]}.`, anchors);
		const r = replay(current, step);
		if (!r.ok) return fail('replay_refused', `Step ${i + 1} (${step.op}) cannot be replayed on the base version: ${r.error.message}`);
		current = r.piece;
		ledger.push(...r.ledgerEntries);
	}
	ledger.push(...declared);
	const diff = pieceGeometryDifference(submitted, current);
	if (diff) {
		const far = Number.isFinite(diff.distanceMm) ? ` (${diff.distanceMm.toFixed(3)} mm off, ${REPLAY_TOLERANCE_MM} mm allowed)` : '';
		return fail(
			'replay_mismatch',
			`The submitted piece is not what its recipe gives: ${diff.where}${far}. Nothing was saved.`
		);
	}
	const metrics = pieceMetrics(current);
	const checks = shapingChecks(pieceMetrics(parent), metrics, ledger);
	const failed = checks.filter((c) => !c.passed);
	if (failed.length > 0) {
		return fail(
			'shaping_not_kept',
			`Shaping is not kept: ${failed.map((c) => c.message).join(' ')}`,
			failed.map((c) => c.message)
		);
	}
	return { ok: true, piece: current, metrics, ledger, checks };
}
