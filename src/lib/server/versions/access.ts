import type { Role } from '../db/schema';
import { DRAFT_READERS } from '../authz';
import type { DbOrTx } from '../db';
import { ApiError } from '../http-errors';
import { piecesInStudio, type PieceRow } from '../repositories/pieces';
import { stylesInStudio, type StyleRow } from '../repositories/styles';
import { versionsById, type VersionRow } from '../repositories/versions';

/** Who may write pieces and versions, and who may sign a version off (product roles, authz.ts). */
export { EDITORS, SIGNERS } from '../authz';

/** The sample room sees signed-off versions only (authz.ts `DRAFT_READERS`). */
export function seesOnlySignedOff(role: Role): boolean {
	return !(DRAFT_READERS as readonly Role[]).includes(role);
}

export async function styleOr404(db: DbOrTx, studioId: string, styleId: string): Promise<StyleRow> {
	const style = await stylesInStudio(db, studioId, styleId);
	if (!style) throw new ApiError(404, 'not_found', 'No such style in this studio.');
	return style;
}

export async function pieceOr404(db: DbOrTx, studioId: string, pieceId: string): Promise<PieceRow> {
	const piece = await piecesInStudio(db, studioId, pieceId);
	if (!piece) throw new ApiError(404, 'not_found', 'No such piece in this studio.');
	return piece;
}

/** A version of the piece the role may see (404 otherwise, e.g. a draft for the sample room). */
export async function versionOr404(db: DbOrTx, pieceId: string, versionId: string, role: Role): Promise<VersionRow> {
	const v = await versionsById(db, pieceId, versionId);
	if (!v || (seesOnlySignedOff(role) && v.state !== 'signed_off')) {
		throw new ApiError(404, 'not_found', 'No such version of this piece.');
	}
	return v;
}
