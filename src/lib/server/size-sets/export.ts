import { z } from 'zod';
import type { PieceLabelMeta } from '$lib/export/piece-drawing';
import { cutQuantity } from '$lib/export/cutting-list';
import { styleDxf } from '$lib/export/dxf-writer';
import { pdfFonts } from '$lib/export/pdf-fonts';
import { printPdf } from '$lib/export/pdf-writer';
import { printSheet } from '$lib/export/print-sheet';
import { styleSvg } from '$lib/pattern/export/svg';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { printQuerySchema } from '../exports/print';
import { fileSlug } from '../exports/style-pieces';
import { sizeSetSizesOf, sizeSetsById, sizeSetVersionsWithGeometry, type SizeSetRow } from '../repositories/size-sets';
import type { StyleRow } from '../repositories/styles';
import { styleOr404 } from '../versions/access';
import { sizesShown } from './view';

/** Which sizes of the set to export: `?sizes=id,id` (or repeated), else every size the role sees. */
const sizesQuery = z
	.string()
	.optional()
	.transform((s) => (s ? s.split(',').filter(Boolean) : undefined))
	.pipe(z.array(z.uuid('Not a valid size id.')).max(100).optional());
export const sizeSetFileQuerySchema = z.object({ sizes: sizesQuery });
export const sizeSetPrintQuerySchema = printQuerySchema.omit({ pieces: true }).extend({ sizes: sizesQuery });

/** One piece of one size as the exporters take it: the geometry kept for that size, labelled with the size. */
export interface SizeSetExportPiece {
	readonly piece: Piece;
	readonly meta: PieceLabelMeta;
	readonly sizeName: string;
}

/** The query of an export request, repeated `sizes` fields joined (the page's checkboxes). */
export function exportQuery(search: URLSearchParams): Record<string, string | undefined> {
	return { ...Object.fromEntries(search), sizes: search.getAll('sizes').join(',') || undefined };
}

/**
 * The pieces of a size set for export, size by size in the set's order: each piece the version kept for
 * that size, its label naming the size (the sample room: signed-off sizes only). A piece's id in the file
 * is its kept version's id, so the same piece of two sizes never shares one. 404 when nothing is left.
 */
export async function sizeSetExportPieces(
	db: DbOrTx,
	studioId: string,
	sizeSetId: string,
	role: Role,
	only?: readonly string[]
): Promise<{ set: SizeSetRow; style: StyleRow; pieces: SizeSetExportPiece[] }> {
	const set = await sizeSetsById(db, studioId, sizeSetId);
	if (!set) throw new ApiError(404, 'not_found', 'No such size set in this studio.');
	const style = await styleOr404(db, studioId, set.styleId);
	let sizes = sizesShown(await sizeSetSizesOf(db, [set.id]), role);
	if (only) {
		const unknown = only.filter((id) => !sizes.some((s) => s.id === id));
		if (unknown.length) throw new ApiError(400, 'invalid_params', 'Some sizes asked for are not sizes of this set you can export.', { sizes: unknown });
		sizes = sizes.filter((s) => only.includes(s.id));
	}
	const versions = await sizeSetVersionsWithGeometry(db, sizes.map((s) => s.id));
	const pieces: SizeSetExportPiece[] = [];
	for (const size of sizes) {
		for (const v of versions.filter((x) => x.sizeId === size.id)) {
			const piece = { ...pieceSchema.parse(v.geometry), id: v.id, name: v.name, cut: v.cut };
			pieces.push({
				piece,
				sizeName: size.name,
				meta: { styleName: style.name, styleCode: style.code || undefined, sizeLabel: size.name, versionNumber: v.baseVersionNumber, versionState: size.state, fabric: v.fabric }
			});
		}
	}
	if (pieces.length === 0) throw new ApiError(404, 'not_found', 'This size set has no pieces you can export.');
	return { set, style, pieces };
}

const baseName = (style: StyleRow, set: SizeSetRow) => `${fileSlug(style.code || style.name)}-${fileSlug(set.name)}`;

/** The set as one SVG at true scale: every piece of every size, each labelled with its size. */
export async function sizeSetSvgExport(db: DbOrTx, studioId: string, sizeSetId: string, role: Role, only?: readonly string[]) {
	const { set, style, pieces } = await sizeSetExportPieces(db, studioId, sizeSetId, role, only);
	const svg = styleSvg(pieces.map((p) => ({ piece: p.piece, meta: p.meta })));
	return { svg, fileName: `${baseName(style, set)}.svg` };
}

/** The set as DXF (the pattern-exchange layout the style export follows): one block per piece and size, its size in the Size field. */
export async function sizeSetDxfExport(db: DbOrTx, studioId: string, sizeSetId: string, role: Role, only?: readonly string[]) {
	const { set, style, pieces } = await sizeSetExportPieces(db, studioId, sizeSetId, role, only);
	const styleName = style.code ? `${style.code} ${style.name}` : style.name;
	const text = styleDxf(
		pieces.map((p) => ({ piece: p.piece, blockName: `${p.piece.name} ${p.sizeName}`, styleName, sizeLabel: p.sizeName, quantity: cutQuantity(p.piece.cut), category: p.meta.fabric }))
	);
	return { text, fileName: `${baseName(style, set)}.dxf` };
}

/** The set as a print PDF at true scale (tiled pages or large sheets), every piece labelled with its size. */
export async function sizeSetPrintPdf(db: DbOrTx, studioId: string, sizeSetId: string, role: Role, q: z.output<typeof sizeSetPrintQuerySchema>) {
	const { set, style, pieces } = await sizeSetExportPieces(db, studioId, sizeSetId, role, q.sizes);
	const title = `${style.code ? `${style.code} ${style.name}` : style.name} · ${set.name}`;
	const sheet = printSheet(
		pieces.map((p) => ({ piece: p.piece, meta: p.meta })),
		{ paper: q.paper, allowanceShown: q.allowance === 'shown', pairs: q.pairs },
		title
	);
	const bytes = await printPdf(sheet, pdfFonts());
	return { bytes, fileName: `${baseName(style, set)}-${q.paper}.pdf` };
}
