import { DxfWriter, LWPolylineFlags, Units, point3d } from '@tarikjabiri/dxf';
import type { Vec } from '$lib/pattern/kernel';
import { outlineFlatten, pathBoundingBox, pathFlatten } from '$lib/pattern/kernel';
import { outlinePleatsAcross, pleatMarks } from '$lib/pattern/export/pleat-marks';
import type { Piece } from '$lib/pattern/piece-schema';
import { shelfPack } from './pack';
import { PIECE_GAP_MM } from './paper';
import { notchSlits } from './marks';

/**
 * DXF in the layout of the open pattern-exchange format (ASTM D6673), in millimetres: one block per
 * piece, inserted side by side in model space. Notches are written as slits (short lines in from the cut
 * edge, two side by side for a double notch). Layer numbers as recalled from the standard (status M,
 * memory; not checked against the text of ASTM D6673):
 */
export const DXF_LAYERS = {
	boundary: '1',
	sewLine: '14',
	grainLine: '7',
	notches: '4',
	internalLines: '8',
	drillHoles: '13',
	annotation: '15'
} as const;

/** Curves are written as polylines within this distance of the exact curve (mm). */
export const DXF_FLATTEN_TOLERANCE_MM = 0.02;

export interface DxfPieceInput {
	readonly piece: Piece;
	/** The block's name when it is not the piece's own (the same piece in several sizes); made unique either way. */
	readonly blockName?: string;
	readonly styleName: string;
	readonly sizeLabel: string;
	readonly quantity: number;
	/** Material category (the fabric). */
	readonly category: string;
}

/** The file is y up; the product's pieces are y down: flip so that a piece reads the same way up. */
const flip = (p: Vec) => point3d(p.x, -p.y, 0);
const flip2 = (p: Vec) => ({ x: p.x, y: -p.y });

/** A block name DXF accepts: no < > / \ " : ; ? * | = ` and unique within the file. */
export function dxfBlockName(name: string, taken: Set<string>): string {
	const base = name.replace(/[<>/\\":;?*|=`,]/g, '_').trim().slice(0, 200) || 'piece';
	let n = base;
	for (let i = 2; taken.has(n.toLowerCase()); i++) n = `${base} (${i})`;
	taken.add(n.toLowerCase());
	return n;
}

/** A DXF text value: one line, no control characters. */
const textValue = (s: string) => s.replace(/[\u0000-\u001f]/g, ' ');

export function styleDxf(pieces: readonly DxfPieceInput[]): string {
	const dxf = new DxfWriter();
	dxf.setUnits(Units.Millimeters);
	const L = DXF_LAYERS;
	dxf.addLayer(L.boundary, 7);
	dxf.addLayer(L.sewLine, 3);
	dxf.addLayer(L.grainLine, 5);
	dxf.addLayer(L.notches, 1);
	dxf.addLayer(L.internalLines, 4);
	dxf.addLayer(L.drillHoles, 6);
	dxf.addLayer(L.annotation, 2);
	const taken = new Set<string>();
	const boxes = pieces.map(({ piece }) => pathBoundingBox(piece.seamAllowance?.cutLine ?? piece.outline));
	const packed = shelfPack(
		boxes.map((b) => ({ widthMm: b.maxX - b.minX, heightMm: b.maxY - b.minY })),
		2000,
		PIECE_GAP_MM
	);
	pieces.forEach(({ piece, blockName, styleName, sizeLabel, quantity, category }, i) => {
		const name = dxfBlockName(blockName ?? piece.name, taken);
		const block = dxf.addBlock(name);
		const closed = (pts: Vec[], layerName: string) =>
			block.addLWPolyline(
				pts.map((p) => ({ point: flip2(p) })),
				{ flags: LWPolylineFlags.Closed, layerName }
			);
		const open = (pts: Vec[], layerName: string) => block.addLWPolyline(pts.map((p) => ({ point: flip2(p) })), { layerName });
		const stitching = outlinePleatsAcross(piece);
		closed(outlineFlatten(piece.seamAllowance?.cutLine ?? stitching, DXF_FLATTEN_TOLERANCE_MM), L.boundary);
		if (piece.seamAllowance) closed(outlineFlatten(stitching, DXF_FLATTEN_TOLERANCE_MM), L.sewLine);
		if (piece.grainline) block.addLine(flip(piece.grainline.from), flip(piece.grainline.to), { layerName: L.grainLine });
		// notches as the slits a cutter snips (marks.ts): one line each, in from the cut edge; a double notch is two
		for (const slit of notchSlits(piece, stitching)) {
			if (slit.kind === 'path') block.addLine(flip(slit.segments[0].p0), flip(slit.segments[0].p1), { layerName: L.notches });
		}
		for (const h of piece.drillHoles) block.addPoint(h.at.x, -h.at.y, 0, { layerName: L.drillHoles });
		for (const d of piece.darts) {
			const apex = piece.apexes.find((a) => a.id === d.apexId);
			if (apex) open([d.leg1End, d.pullBack?.sewnPoint ?? apex.point, d.leg2End], L.internalLines);
		}
		for (const p of piece.pleats) {
			const m = pleatMarks(p);
			open([...m.fold], L.internalLines);
			open([...m.placement], L.internalLines);
		}
		if (piece.foldLine) block.addLine(flip(piece.foldLine.from), flip(piece.foldLine.to), { layerName: L.internalLines });
		for (const l of piece.internalLines) open(pathFlatten(l.path, DXF_FLATTEN_TOLERANCE_MM), L.internalLines);
		const b = boxes[i];
		const texts = [
			`Piece Name: ${piece.name}`,
			`Style Name: ${styleName}`,
			`Size: ${sizeLabel}`,
			`Quantity: ${quantity}`,
			`Category: ${category}`,
			`Cut: ${piece.cut}`
		];
		texts.forEach((t, k) => block.addText(point3d(b.minX + 10, -(b.minY + 15 + k * 6), 0), 4, textValue(t), { layerName: L.annotation }));
		dxf.addInsert(name, point3d(packed.at[i].x - b.minX, -(packed.at[i].y - b.minY), 0), { layerName: '0' });
	});
	return dxf.stringify();
}
