import { LRUCache } from 'lru-cache';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { piecesOfStyleWithShown } from '../repositories/pieces';
import { seamPairsOfStyle } from '../repositories/seam-pairs';
import { keptReads } from '../cache/kept';
import { styleOverviewRows, type StyleOverviewRows } from '../repositories/style-overview';
import { versionsById, versionsOfPiece, type VersionRow, type VersionSummary } from '../repositories/versions';
import { pieceOr404, seesOnlySignedOff, styleOr404 } from './access';
import { versionsShownJson } from './style-read-cache';

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
 * The style reads' first query, kept by style, studio and view until the database says the style, its
 * pieces, their versions or its seam pairs changed (cache/change-feed.ts): a style read that was
 * answered before and has not changed since is answered without a round trip.
 */
const keptStyleReads = keptReads<StyleOverviewRows>({ max: 2_000, ttlMs: 10 * 60_000, kinds: ['style'], names: (rows, _kind, styleId) => rows.style.id === styleId });

/**
 * The answer made from each kept first query (a kept value is never changed, only forgotten), up to
 * STYLE_READ_ANSWERS_MB of answers (default 64), the least recently sent going first.
 */
const answers = new LRUCache<StyleOverviewRows, Uint8Array<ArrayBuffer>>({
	maxSize: Math.max(1, Number(process.env.STYLE_READ_ANSWERS_MB ?? 64) * 1024 * 1024),
	sizeCalculation: (bytes) => Math.max(1, bytes.byteLength)
});

/**
 * styleOverview as the API sends it, JSON bytes: the style, its pieces with the id and stamp of each
 * shown version, and its seam pairs in one query (none of the versions' large columns), kept until the
 * style changes, with the answer made from them; the versions' geometry, metrics and checks (most of
 * the bytes) as JSON text, kept by id and stamp or read in one more query, never parsed and written
 * again (style-read-cache.ts). The same fields in the same order as styleOverview; numbers as the
 * database stores them, spaces as it writes them.
 */
export async function styleOverviewJsonBytes(db: DbOrTx, studioId: string, styleId: string, role: Role): Promise<Uint8Array<ArrayBuffer>> {
	const onlySignedOff = seesOnlySignedOff(role);
	const found = await keptStyleReads.get(`${styleId}|${studioId}|${onlySignedOff}`, () => styleOverviewRows(db, studioId, styleId, onlySignedOff));
	if (!found) throw new ApiError(404, 'not_found', 'No such style in this studio.');
	const made = answers.get(found);
	if (made) return made;
	const rows = found.pieces.filter((r) => r.vId !== null || !onlySignedOff);
	const shown = await versionsShownJson(
		db,
		rows.flatMap((r) => (r.vId !== null && r.vStamp !== null ? [{ id: r.vId, stamp: r.vStamp }] : []))
	);
	const pieces = rows.map(({ vId, vStamp: _stamp, ...piece }) => `${JSON.stringify(piece).slice(0, -1)},"shown":${(vId !== null && shown.get(vId)) || 'null'}}`);
	const answer = Buffer.from(`{"style":${JSON.stringify(found.style)},"pieces":[${pieces.join(',')}],"seamPairs":${JSON.stringify(found.seamPairs)}}`);
	if (answer.byteLength <= answers.maxSize / 4) answers.set(found, answer);
	return answer;
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
