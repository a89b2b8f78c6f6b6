import type { Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import type { Db } from '../db';
import { piecesCreate, piecesDelete, piecesOfStyle, type PieceRow } from '../repositories/pieces';
import { styleOr404 } from './access';
import { versionSave, type SaveOutcome } from './save';

/**
 * A new piece in a style with its first version (from drafting or an import). The piece row and its
 * version are created together: if the version is refused, the piece is removed again.
 */
export async function pieceCreateWithFirstVersion(
	db: Db,
	input: { studioId: string; styleId: string; authorId: string; name: string; message: string; geometry: Piece; origin: RecipeStepData }
): Promise<(Extract<SaveOutcome, { ok: true }> & { piece: PieceRow }) | Extract<SaveOutcome, { ok: false }>> {
	await styleOr404(db, input.studioId, input.styleId);
	const order = (await piecesOfStyle(db, input.styleId)).length;
	const piece = await piecesCreate(db, {
		styleId: input.styleId,
		name: input.name,
		cut: input.geometry.cut,
		fabric: input.geometry.fabric,
		sortOrder: order
	});
	const r = await versionSave(db, {
		studioId: input.studioId,
		pieceId: piece.id,
		baseVersionId: null,
		message: input.message,
		geometry: input.geometry,
		recipe: [input.origin],
		authorId: input.authorId
	});
	if (!r.ok) {
		await piecesDelete(db, piece.id);
		return r;
	}
	return { ...r, piece: { ...piece, headVersionId: r.version.id, headNumber: r.version.number } };
}
