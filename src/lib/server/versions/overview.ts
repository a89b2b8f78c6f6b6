import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { piecesOfStyleWithShown, piecesOfStyleWithShownText } from '../repositories/pieces';
import { seamPairsOfStyle } from '../repositories/seam-pairs';
import { versionsById, versionsOfPiece, type VersionRow, type VersionSummary } from '../repositories/versions';
import { pieceOr404, seesOnlySignedOff, styleOr404 } from './access';

/** The version a role works from: the head, or for the sample room the latest signed-off one. */
export async function versionShown(db: DbOrTx, pieceId: string, headVersionId: string | null, role: Role): Promise<VersionRow | null> {
	if (!seesOnlySignedOff(role)) return headVersionId ? ((await versionsById(db, pieceId, headVersionId)) ?? null) : null;
	const [signed] = await versionsOfPiece(db, pieceId, true);
	return signed ? ((await versionsById(db, pieceId, signed.id)) ?? null) : null;
}

/**
 * A style with its pieces, each with the version the role is shown (pieces with none are left out for
 * the sample room), and its seam pairs: three queries however many pieces it has, run side by side
 * (the style's own check answers 404 before anything is returned).
 */
export async function styleOverview(db: DbOrTx, studioId: string, styleId: string, role: Role) {
	const onlySignedOff = seesOnlySignedOff(role);
	const [style, rows, seamPairs] = await Promise.all([styleOr404(db, studioId, styleId), piecesOfStyleWithShown(db, styleId, onlySignedOff), seamPairsOfStyle(db, styleId)]);
	const pieces = onlySignedOff ? rows.filter((p) => p.shown) : rows;
	return { style, pieces, seamPairs };
}

/**
 * styleOverview as the API sends it, JSON text: the shown versions' geometry, metrics and checks go from
 * the database's text into the answer without being parsed and written again (most of the answer's bytes).
 * The same fields in the same order; numbers as the database stores them, spaces as it writes them.
 */
export async function styleOverviewJson(db: DbOrTx, studioId: string, styleId: string, role: Role): Promise<string> {
	const onlySignedOff = seesOnlySignedOff(role);
	const [style, rows, seamPairs] = await Promise.all([styleOr404(db, studioId, styleId), piecesOfStyleWithShownText(db, styleId, onlySignedOff), seamPairsOfStyle(db, styleId)]);
	const pieces = rows
		.filter((r) => r.vId !== null || !onlySignedOff)
		.map(({ vId, vNumber, vState, vGeometry, vMetrics, vChecks, ...piece }) => {
			const shown =
				vId === null
					? 'null'
					: `{"id":${JSON.stringify(vId)},"number":${vNumber},"state":${JSON.stringify(vState)},"geometry":${vGeometry ?? 'null'},"metrics":${vMetrics ?? 'null'},"checks":${vChecks ?? 'null'}}`;
			return `${JSON.stringify(piece).slice(0, -1)},"shown":${shown}}`;
		});
	return `{"style":${JSON.stringify(style)},"pieces":[${pieces.join(',')}],"seamPairs":${JSON.stringify(seamPairs)}}`;
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
