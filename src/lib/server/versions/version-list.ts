import { keptReads } from '../cache/kept';
import type { DbOrTx } from '../db';
import { versionsOfPieceInStudio, type VersionSummary } from '../repositories/versions';

interface VersionList {
	styleId: string;
	versions: VersionSummary[];
}

/**
 * Version lists read lately, by piece, studio and view, until the database says the piece's style
 * changed or one of the lists' authors did (a new name, an account deleted: "former member"); see
 * cache/change-feed.ts.
 */
const keptLists = keptReads<VersionList>({
	max: 5_000,
	ttlMs: 10 * 60_000,
	kinds: ['style', 'user'],
	names: (list, kind, id) => (kind === 'style' ? list.styleId === id : list.versions.some((v) => v.authorId === id))
});

/** A piece's versions, newest first (signed-off ones only for the sample room); undefined when the piece is not the studio's. */
export function versionListOfPiece(db: DbOrTx, studioId: string, pieceId: string, onlySignedOff: boolean): Promise<VersionList | undefined> {
	return keptLists.get(`${pieceId}|${studioId}|${onlySignedOff}`, () => versionsOfPieceInStudio(db, studioId, pieceId, onlySignedOff));
}
