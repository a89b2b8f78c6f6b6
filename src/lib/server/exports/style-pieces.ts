import type { PieceLabelMeta } from '$lib/export/piece-drawing';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { measurementSetName } from '../repositories/measurement-set-names';
import { piecesOfStyleWithShown, type PieceRow } from '../repositories/pieces';
import type { StyleRow } from '../repositories/styles';
import { seesOnlySignedOff, styleOr404 } from '../versions/access';

export interface ExportPiece {
	readonly row: PieceRow;
	readonly piece: Piece;
	readonly meta: PieceLabelMeta;
}

/** A file name part made of a name: lower case, dashes. */
export function fileSlug(s: string): string {
	return (
		s
			.toLowerCase()
			.normalize('NFKD')
			.replace(/[^a-z0-9]+/g, '-')
			.replace(/^-+|-+$/g, '')
			.slice(0, 60) || 'style'
	);
}

/**
 * The pieces of a style as the role sees them (each piece's shown version: the head, or for the
 * sample room the latest signed-off one), optionally only some of them. 404 for another studio's style
 * or when nothing is left to export.
 */
export async function styleExportPieces(
	db: DbOrTx,
	studioId: string,
	styleId: string,
	role: Role,
	only?: readonly string[],
	emptyOk = false
): Promise<{ style: StyleRow; pieces: ExportPiece[] }> {
	const style = await styleOr404(db, studioId, styleId);
	const sizeLabel = (style.measurementSetId ? await measurementSetName(db, style.measurementSetId) : undefined) ?? 'no measurement set';
	// every piece with its shown version in one query (not one per piece)
	const rows = await piecesOfStyleWithShown(db, styleId, seesOnlySignedOff(role));
	if (only) {
		const unknown = only.filter((id) => !rows.some((r) => r.id === id));
		if (unknown.length) throw new ApiError(400, 'invalid_params', 'Some pieces asked for are not in this style.', { pieces: unknown });
	}
	const pieces: ExportPiece[] = [];
	for (const { shown: v, ...row } of rows) {
		if (only && !only.includes(row.id)) continue;
		if (!v) continue;
		const piece = pieceSchema.parse(v.geometry);
		pieces.push({
			row,
			piece: { ...piece, name: row.name, cut: row.cut },
			meta: { styleName: style.name, styleCode: style.code || undefined, sizeLabel, versionNumber: v.number, versionState: v.state, fabric: row.fabric }
		});
	}
	if (pieces.length === 0 && !emptyOk) throw new ApiError(404, 'not_found', 'This style has no pieces you can export yet.');
	return { style, pieces };
}

export function fileDownload(body: Uint8Array | string, contentType: string, fileName: string): Response {
	return new Response(body as BodyInit, {
		headers: {
			'content-type': contentType,
			'content-disposition': `attachment; filename="${fileName}"`,
			'cache-control': 'private, no-store'
		}
	});
}
