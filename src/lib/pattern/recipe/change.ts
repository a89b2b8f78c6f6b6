import { z } from 'zod';
import { ledgerEntrySchema, type LedgerEntry } from '../ledger';
import type { PiecesResult } from '../panels';
import { cutInstructionSchema, pieceSchema, type Piece } from '../piece-schema';
import { stepAnchorProblems } from '../anchors/anchor-check';
import { PIECES_STEP_NAMES, piecesForStep, piecesStepApply, recipeStepApply, recipeStepSchema } from './registry';

/**
 * A style change: the multi-piece steps (separate, join, carry) of one save, stored as one record that
 * names its source piece versions and its parameters, so the server (and any later replay) recomputes
 * every new piece from its sources with the same pure operations.
 *
 * A step's source is a stored piece (its base version is given with the change) or a result of an
 * earlier step of the same change; single-piece steps made on a source before the multi-piece step
 * (`recipe`) are replayed on it first. Every result no later step uses is a new piece of the style.
 */

const id = z.string().min(1).max(64);
export const changeSourceSchema = z.union([
	z.object({ pieceId: id, recipe: z.array(recipeStepSchema).max(200).optional() }),
	z.object({ step: z.number().int().min(0).max(199), result: z.number().int().min(0).max(199), recipe: z.array(recipeStepSchema).max(200).optional() })
]);
export type ChangeSource = z.infer<typeof changeSourceSchema>;

export const changeStepSchema = z.object({
	op: z.enum(PIECES_STEP_NAMES as [(typeof PIECES_STEP_NAMES)[number], ...(typeof PIECES_STEP_NAMES)[number][]]),
	sources: z.array(changeSourceSchema).min(1).max(40),
	params: z.unknown(),
	/** Labelled changes the pattern cutter declares with this step (added fullness, removed ease). */
	declared: z.array(ledgerEntrySchema).max(50).optional()
});
export type ChangeStep = z.infer<typeof changeStepSchema>;

/** A new piece as the client computed it: which step and result made it, its own name and cut. */
export const changePieceSchema = z.object({
	step: z.number().int().min(0).max(199),
	result: z.number().int().min(0).max(199),
	name: z.string().trim().min(1).max(120),
	cut: cutInstructionSchema,
	geometry: pieceSchema
});
export type ChangePiece = z.infer<typeof changePieceSchema>;

export interface StepOutcome {
	/** The sources as the operation saw them (recipes replayed, step ids given). */
	readonly sources: readonly Piece[];
	/** Each source before its recipe, with what the recipe posted (for the single-piece checks). */
	readonly sourceRecipes: readonly { readonly before: Piece; readonly ledger: readonly LedgerEntry[] }[];
	readonly result: Extract<PiecesResult, { ok: true }>;
}

export type ChangeRecompute =
	| { readonly ok: true; readonly steps: readonly StepOutcome[]; readonly unused: readonly { step: number; result: number }[] }
	| { readonly ok: false; readonly step: number; readonly code: 'change_invalid' | 'replay_refused'; readonly message: string };

const key = (step: number, result: number) => `${step}:${result}`;

/**
 * Recomputes every step of a change from the base versions of its stored sources (pieceId → geometry):
 * the same pure functions the editor ran. Says which step cannot be recomputed and why.
 */
export function changeRecompute(bases: ReadonlyMap<string, Piece>, steps: readonly ChangeStep[]): ChangeRecompute {
	const outcomes: StepOutcome[] = [];
	const used = new Set<string>();
	const usedPieces = new Set<string>();
	for (const [i, step] of steps.entries()) {
		const fail = (code: 'change_invalid' | 'replay_refused', message: string): ChangeRecompute => ({ ok: false, step: i, code, message: `Step ${i + 1} (${step.op}): ${message}` });
		const given: Piece[] = [];
		const recipes: { before: Piece; ledger: LedgerEntry[] }[] = [];
		for (const [k, src] of step.sources.entries()) {
			let piece: Piece | undefined;
			if ('pieceId' in src) {
				piece = bases.get(src.pieceId);
				if (!piece) return fail('change_invalid', `source ${k + 1} names a piece whose base version was not given.`);
				if (usedPieces.has(src.pieceId)) return fail('change_invalid', `source ${k + 1} is a piece an earlier step already used.`);
				usedPieces.add(src.pieceId);
			} else {
				const earlier = outcomes[src.step];
				if (src.step >= i || !earlier) return fail('change_invalid', `source ${k + 1} names step ${src.step + 1}, which does not come before it.`);
				piece = earlier.result.pieces[src.result];
				if (!piece) return fail('change_invalid', `source ${k + 1} names result ${src.result + 1} of step ${src.step + 1}, which gave ${earlier.result.pieces.length}.`);
				if (used.has(key(src.step, src.result))) return fail('change_invalid', `source ${k + 1} is a result an earlier step already used.`);
				used.add(key(src.step, src.result));
			}
			const before = piece;
			const ledger: LedgerEntry[] = [];
			for (const [n, s] of (src.recipe ?? []).entries()) {
				const anchors = stepAnchorProblems(s.params, [piece], false);
				if (anchors.length > 0) return fail('replay_refused', `step ${n + 1} (${s.op}) made on source ${k + 1}: ${anchors[0]}.`);
				const r = recipeStepApply(piece, s);
				if (!r.ok) return fail('replay_refused', `step ${n + 1} (${s.op}) made on source ${k + 1} cannot be replayed: ${r.error.message}`);
				piece = r.piece;
				ledger.push(...r.ledgerEntries);
			}
			given.push(piece);
			recipes.push({ before, ledger });
		}
		const sources = piecesForStep(given);
		const anchors = stepAnchorProblems(step.params, sources, true);
		if (anchors.length > 0) return fail('replay_refused', `${anchors[0]}.`);
		const r = piecesStepApply(sources, step);
		if (!r.ok) return fail(r.error.code === 'invalid_params' ? 'change_invalid' : 'replay_refused', r.error.message);
		outcomes.push({ sources, sourceRecipes: recipes, result: r });
	}
	const unused: { step: number; result: number }[] = [];
	for (const [i, o] of outcomes.entries()) for (let r = 0; r < o.result.pieces.length; r++) if (!used.has(key(i, r))) unused.push({ step: i, result: r });
	return { ok: true, steps: outcomes, unused };
}
