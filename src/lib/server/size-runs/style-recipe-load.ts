import type { StyleRecipe, RecipePiece } from '$lib/pattern/grading/style-recipe';
import { pieceSchema } from '$lib/pattern/piece-schema';
import type { ChangeStep } from '$lib/pattern/recipe/change';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import type { DbOrTx } from '../db';
import { piecesOfStyle } from '../repositories/pieces';
import { seamPairsOfStyle } from '../repositories/seam-pairs';
import { styleChangesOfStyle } from '../repositories/style-changes';
import { versionsById, versionsOfPiece } from '../repositories/versions';

/**
 * A stored style as a size run reads it: every piece's versions up to its head (recipe and geometry),
 * the style's changes and seam pairs.
 */
export async function styleRecipeLoad(db: DbOrTx, styleId: string): Promise<StyleRecipe> {
	const pieces: RecipePiece[] = [];
	for (const p of await piecesOfStyle(db, styleId)) {
		if (!p.headVersionId) continue;
		const list = (await versionsOfPiece(db, p.id)).filter((v) => v.number <= p.headNumber).sort((a, b) => a.number - b.number);
		const versions: RecipePiece['versions'][number][] = [];
		for (const s of list) {
			const v = await versionsById(db, p.id, s.id);
			if (!v) break;
			versions.push({ id: v.id, number: v.number, recipe: v.recipe as RecipeStepData[], geometry: pieceSchema.parse(v.geometry) });
		}
		pieces.push({ id: p.id, name: p.name, versions });
	}
	const changes = (await styleChangesOfStyle(db, styleId)).map((c) => ({ id: c.id, bases: c.bases, steps: c.steps as ChangeStep[] }));
	const seamPairs = (await seamPairsOfStyle(db, styleId)).map((s) => ({
		id: s.id,
		label: s.label,
		a: s.aEdge,
		b: s.bEdge,
		aPieceId: s.aPieceId,
		bPieceId: s.bPieceId,
		allowedEaseMm: s.allowedEaseMm,
		toleranceMm: s.toleranceMm
	}));
	return { pieces, changes, seamPairs };
}
