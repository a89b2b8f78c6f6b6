import { boundingBoxUnion, BOUNDING_BOX_EMPTY, pathBoundingBox, type BoundingBox } from '$lib/geometry';
import type { StylePiece } from '../api';
import type { PieceEdit } from '../doc';
import { pieceDrawing } from '../drawing';

const GAP_MM = 60;

/**
 * The shown pieces of a style laid on the table in rows (about 1.6 times as many across as down),
 * each at its shown version; a piece is read-only for a role that may not edit or when the version
 * shown is not the head.
 */
export function piecesLaidOut(list: readonly StylePiece[], canEdit: boolean): PieceEdit[] {
	let x = 0;
	let y = 0;
	let rowHeight = 0;
	const pieces: PieceEdit[] = [];
	const shown = list.filter((p) => p.shown);
	const perRow = Math.max(1, Math.ceil(Math.sqrt(shown.length * 1.6)));
	for (const [i, sp] of shown.entries()) {
		if (!sp.shown) continue;
		if (i > 0 && i % perRow === 0) {
			x = 0;
			y += rowHeight + GAP_MM;
			rowHeight = 0;
		}
		const g = sp.shown.geometry;
		const box = pieceDrawing(g).outerBox;
		const offset = { x: x - box.minX, y: y - box.minY };
		x += box.maxX - box.minX + GAP_MM;
		rowHeight = Math.max(rowHeight, box.maxY - box.minY);
		pieces.push({
			key: sp.id,
			name: sp.name,
			cut: sp.cut,
			fabric: sp.fabric,
			baseVersionId: sp.shown.id,
			baseNumber: sp.shown.number,
			base: g,
			geometry: g,
			steps: [],
			offset,
			origin: null,
			retired: false,
			readOnly: !canEdit || sp.shown.id !== sp.headVersionId
		});
	}
	return pieces;
}

/** A world-space bounding box of the pieces: their cut lines (`outer`, for fitting the view) or their stitching lines. */
export function piecesBoxOf(pieces: readonly PieceEdit[], outer: boolean): BoundingBox {
	let box = BOUNDING_BOX_EMPTY;
	for (const p of pieces) {
		const b = outer ? pieceDrawing(p.geometry).outerBox : pathBoundingBox(p.geometry.outline);
		box = boundingBoxUnion(box, { minX: b.minX + p.offset.x, minY: b.minY + p.offset.y, maxX: b.maxX + p.offset.x, maxY: b.maxY + p.offset.y });
	}
	return box;
}
