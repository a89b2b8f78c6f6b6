import { anchorSchema, type Anchor } from '$lib/pattern/anchors/anchor';
import { anchorPick } from '$lib/pattern/anchors/anchor-pick';
import { anchorText, stepAnchorsGiven } from '$lib/pattern/anchors/anchor-text';
import type { Vec } from '$lib/geometry';
import type { Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import { bodyOf } from './anchor-body';
import { editorApply } from './ops';

export { stepAnchorsGiven };

/**
 * What the points of a piece's steps are anchored to, said as the editor shows it: for a point, its own
 * anchor (or, for a point that carries none, the one it would be read as on the piece); for each step of
 * a recipe, the anchors its points carry, on the piece as it was before the step.
 */

/** "bust point", "side seam, 40 % from the waist", … for a point on a piece (null when nothing can be read). */
export function pointAnchorText(piece: Piece, p: Vec & { anchor?: unknown }, length: (mm: number) => string): string | null {
	const body = bodyOf(piece);
	const given = p.anchor !== undefined ? anchorSchema.safeParse(p.anchor) : null;
	const anchor: Anchor | null = given?.success ? given.data : (anchorPick(body, p)?.anchor ?? null);
	return anchor ? anchorText(anchor, body, length) : null;
}

/** For each step of a recipe made on `base`: the words for the anchors of its points (each said once, at most `most`). */
export function recipeAnchorTexts(base: Piece | null, steps: readonly RecipeStepData[], length: (mm: number) => string, most = 4): string[][] {
	let piece: Piece | null = base;
	return steps.map((step) => {
		const before = piece;
		const texts = before ? [...new Set(stepAnchorsGiven(step.params).map((a) => anchorText(a, bodyOf(before), length)))] : [];
		if (piece) {
			const r = editorApply(piece, step);
			piece = r.ok ? r.piece : null;
		}
		return texts.length > most ? [...texts.slice(0, most), `${texts.length - most} more`] : texts;
	});
}
