import { styleDxf } from '$lib/export/dxf-writer';
import { cutQuantity } from '$lib/export/cutting-list';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { fileSlug, styleExportPieces } from './style-pieces';

/** The style's pieces as DXF (pattern-exchange layout, mm), from the versions the role sees. */
export async function styleDxfExport(db: DbOrTx, studioId: string, styleId: string, role: Role) {
	const { style, pieces } = await styleExportPieces(db, studioId, styleId, role);
	const text = styleDxf(
		pieces.map((p) => ({ piece: p.piece, styleName: p.meta.styleCode ? `${p.meta.styleCode} ${p.meta.styleName}` : p.meta.styleName, sizeLabel: p.meta.sizeLabel, quantity: cutQuantity(p.piece.cut), category: p.row.fabric }))
	);
	return { text, fileName: `${fileSlug(style.code || style.name)}.dxf` };
}
