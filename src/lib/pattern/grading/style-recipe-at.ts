import type { StyleRecipe } from './style-recipe';

/**
 * A style as it stood when a size run was made: only the pieces the run made, each up to the version the
 * run replayed (its head then). Later versions, and pieces made since, are left out, so replaying this
 * gives what the run gave as long as the recipe up to there is unchanged. Pure.
 */
export type StyleRecipeAt = { ok: true; style: StyleRecipe } | { ok: false; message: string };

export function styleRecipeAt(style: StyleRecipe, versions: ReadonlyMap<string, number>): StyleRecipeAt {
	const pieces: StyleRecipe['pieces'][number][] = [];
	for (const [pieceId, number] of versions) {
		const piece = style.pieces.find((p) => p.id === pieceId);
		if (!piece) return { ok: false, message: 'A piece the run made is no longer in the style.' };
		const kept = piece.versions.filter((v) => v.number <= number);
		if (kept.length !== number || kept.at(-1)?.number !== number) {
			return { ok: false, message: `${piece.name} no longer has the version ${number} the run was made from.` };
		}
		pieces.push({ ...piece, versions: kept });
	}
	// the style's own order of pieces
	pieces.sort((a, b) => style.pieces.findIndex((p) => p.id === a.id) - style.pieces.findIndex((p) => p.id === b.id));
	return { ok: true, style: { ...style, pieces } };
}
