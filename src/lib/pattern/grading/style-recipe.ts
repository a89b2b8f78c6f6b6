import type { ChangeStep } from '../recipe/change';
import type { Piece } from '../piece-schema';
import type { StoredSeamPair } from '../verify/change-verify';
import type { RecipeStepData } from '../verify/version-verify';

/** A style as a size run reads it: every piece's versions up to its head, the style changes, the seam pairs. */
export interface RecipeVersion {
	readonly id: string;
	readonly number: number;
	readonly recipe: readonly RecipeStepData[];
	/** The stored geometry on the base size (where each step's points are read as anchors). */
	readonly geometry: Piece;
}

export interface RecipePiece {
	readonly id: string;
	readonly name: string;
	/** Versions 1 … head, in order. */
	readonly versions: readonly RecipeVersion[];
}

export interface RecipeChange {
	readonly id: string;
	readonly bases: readonly { readonly pieceId: string; readonly versionId: string }[];
	readonly steps: readonly ChangeStep[];
}

export interface StyleRecipe {
	readonly pieces: readonly RecipePiece[];
	readonly changes: readonly RecipeChange[];
	readonly seamPairs: readonly StoredSeamPair[];
}

/** A step's name in the trade's words, for messages ("the pleat", "the dart turned"). */
export const STEP_WORDS: Readonly<Record<string, string>> = {
	draft: 'the drafted block',
	pivot: 'the dart turned',
	share: 'the dart shared out',
	spread: 'the slash and spread',
	pleat: 'the pleats',
	pull_back: 'the dart point pulled back',
	cap: 'the dart cap',
	reshape: 'the reshaped line',
	style_line: 'the style line',
	notch: 'the notch',
	divergence_point: 'the divergence point',
	grain: 'the grainline',
	fold: 'the fold line',
	unfold: 'the unfolding',
	allowance: 'the seam allowance',
	separate: 'the cut along the style line',
	join: 'the join of the panels',
	carry: 'the shaping carried into the style seam'
};
export const stepWords = (op: string) => STEP_WORDS[op] ?? `the ${op.replace(/_/g, ' ')}`;

/** How many steps a run of one size replays (progress: steps done of steps total). */
export function styleRecipeStepCount(style: StyleRecipe): number {
	let n = 0;
	for (const p of style.pieces) for (const v of p.versions) n += v.number === 1 ? 1 : v.recipe.length;
	for (const c of style.changes) for (const s of c.steps) n += 1 + s.sources.reduce((t, src) => t + (src.recipe?.length ?? 0), 0);
	return n;
}
