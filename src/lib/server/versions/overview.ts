import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { piecesOfStyle } from '../repositories/pieces';
import { seamPairsOfStyle } from '../repositories/seam-pairs';
import { versionsById, versionsOfPiece, type VersionRow, type VersionSummary } from '../repositories/versions';
import { pieceOr404, seesOnlySignedOff, styleOr404 } from './access';

/** The version a role works from: the head, or for the sample room the latest signed-off one. */
export async function versionShown(db: DbOrTx, pieceId: string, headVersionId: string | null, role: Role): Promise<VersionRow | null> {
	if (!seesOnlySignedOff(role)) return headVersionId ? ((await versionsById(db, pieceId, headVersionId)) ?? null) : null;
	const [signed] = await versionsOfPiece(db, pieceId, true);
	return signed ? ((await versionsById(db, pieceId, signed.id)) ?? null) : null;
}

export async function styleOverview(db: DbOrTx, studioId: string, styleId: string, role: Role) {
	const style = await styleOr404(db, studioId, styleId);
	const pieces = [];
	for (const p of await piecesOfStyle(db, styleId)) {
		const shown = await versionShown(db, p.id, p.headVersionId, role);
		if (!shown && seesOnlySignedOff(role)) continue;
		pieces.push({ ...p, shown: shown && { id: shown.id, number: shown.number, state: shown.state, geometry: shown.geometry, metrics: shown.metrics, checks: shown.checks } });
	}
	return { style, pieces, seamPairs: await seamPairsOfStyle(db, styleId) };
}

export async function pieceOverview(
	db: DbOrTx,
	studioId: string,
	pieceId: string,
	role: Role
): Promise<{ piece: Awaited<ReturnType<typeof pieceOr404>>; versions: VersionSummary[]; shown: VersionRow | null }> {
	const piece = await pieceOr404(db, studioId, pieceId);
	const versions = await versionsOfPiece(db, pieceId, seesOnlySignedOff(role));
	return { piece, versions, shown: await versionShown(db, pieceId, piece.headVersionId, role) };
}
