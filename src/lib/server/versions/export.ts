import { pieceSchema } from '$lib/pattern/piece-schema';
import { pieceSvg, styleSvg, type SvgExportMeta } from '$lib/pattern/export/svg';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { piecesOfStyleWithShown } from '../repositories/pieces';
import { measurementSetName } from '../repositories/measurement-set-names';
import type { StyleRow } from '../repositories/styles';
import { pieceOr404, seesOnlySignedOff, styleOr404, versionOr404 } from './access';
import { versionShown } from './overview';

const slug = (s: string) =>
	s
		.toLowerCase()
		.normalize('NFKD')
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, 60) || 'piece';

async function metaOf(db: DbOrTx, style: StyleRow, versionNumber: number): Promise<SvgExportMeta> {
	const setName = style.measurementSetId ? await measurementSetName(db, style.measurementSetId) : undefined;
	return { styleName: style.name, styleCode: style.code || undefined, sizeLabel: setName ?? 'no measurement set', versionNumber };
}

export function svgDownload(svg: string, fileName: string): Response {
	return new Response(svg, {
		headers: {
			'content-type': 'image/svg+xml; charset=utf-8',
			'content-disposition': `attachment; filename="${fileName}"`,
			'cache-control': 'private, no-store'
		}
	});
}

export async function pieceSvgExport(db: DbOrTx, studioId: string, pieceId: string, versionId: string | null, role: Role) {
	const piece = await pieceOr404(db, studioId, pieceId);
	const style = await styleOr404(db, studioId, piece.styleId);
	const v = versionId ? await versionOr404(db, pieceId, versionId, role) : await versionShown(db, pieceId, piece.headVersionId, role);
	if (!v) throw new ApiError(404, 'not_found', 'This piece has no version you can export yet.');
	const svg = pieceSvg({ ...pieceSchema.parse(v.geometry), name: piece.name, cut: piece.cut }, await metaOf(db, style, v.number));
	return { svg, fileName: `${slug(style.code || style.name)}-${slug(piece.name)}-v${v.number}.svg` };
}

export async function styleSvgExport(db: DbOrTx, studioId: string, styleId: string, role: Role) {
	const style = await styleOr404(db, studioId, styleId);
	const items = [];
	for (const p of await piecesOfStyleWithShown(db, styleId, seesOnlySignedOff(role))) {
		const v = p.shown;
		if (v) items.push({ piece: { ...pieceSchema.parse(v.geometry), name: p.name, cut: p.cut }, meta: await metaOf(db, style, v.number) });
	}
	if (items.length === 0) throw new ApiError(404, 'not_found', 'This style has no pieces you can export yet.');
	return { svg: styleSvg(items), fileName: `${slug(style.code || style.name)}-all-pieces.svg` };
}
