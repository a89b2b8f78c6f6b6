import { cuttingList } from '$lib/export/cutting-list';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { fileSlug, styleExportPieces } from './style-pieces';

/** The style's cutting list from the versions the role sees (the sample room: signed-off ones). */
export async function styleCuttingList(db: DbOrTx, studioId: string, styleId: string, role: Role) {
	const { style, pieces } = await styleExportPieces(db, studioId, styleId, role, undefined, true);
	const list = cuttingList(
		pieces.map((p) => ({ pieceId: p.row.id, piece: p.piece, fabric: p.row.fabric, versionNumber: p.meta.versionNumber, versionState: p.meta.versionState }))
	);
	return {
		style: { id: style.id, name: style.name, code: style.code },
		list,
		fileName: `${fileSlug(style.code || style.name)}-cutting-list.csv`
	};
}
