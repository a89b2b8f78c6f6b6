import type { Vec } from '$lib/pattern/kernel';
import { vecAdd, vecNormalize, vecPerp, vecScale, vecSub } from '$lib/pattern/kernel';
import { labelPlacement } from '$lib/pattern/export/label-place';
import { outlinePleatsAcross, pleatMarks } from '$lib/pattern/export/pleat-marks';
import { pieceMirror } from '$lib/pattern/panels/piece-tools';
import type { Piece } from '$lib/pattern/piece-schema';
import { polyline, type DrawItem } from './drawing';
import { dartPressArrows, notchSlits } from './marks';

/** What a piece's label says besides its geometry. */
export interface PieceLabelMeta {
	readonly styleName: string;
	readonly styleCode?: string;
	/** Size or measurement set the block was drafted for. */
	readonly sizeLabel: string;
	readonly versionNumber: number;
	readonly versionState: string;
	readonly fabric: string;
}

/** How a piece is cut, as printed on its label. */
export function cutInstructionLabel(cut: Piece['cut'], drawnAsPair = false): string {
	if (cut === 'pair') return drawnAsPair ? 'cut 1 of each half (a mirrored pair)' : 'cut 2, mirrored (a pair)';
	if (cut === 'on_fold') return 'cut 1 on the fold';
	return 'cut 1, right side up';
}

/** The lines of text printed on a piece. */
export function pieceLabelLines(piece: Piece, meta: PieceLabelMeta, options: { drawnAsPair?: boolean; allowanceShown: boolean }): string[] {
	const allowance = piece.seamAllowance
		? options.allowanceShown
			? `seam allowance included (${piece.seamAllowance.defaultWidthMm} mm unless marked)`
			: `net: add seam allowance (${piece.seamAllowance.defaultWidthMm} mm unless marked)`
		: 'net pattern: no seam allowance';
	return [
		meta.styleCode ? `${meta.styleCode} · ${meta.styleName}` : meta.styleName,
		piece.name,
		meta.sizeLabel,
		`version ${meta.versionNumber} · ${meta.versionState.replace('_', ' ')}`,
		`${cutInstructionLabel(piece.cut, options.drawnAsPair)} · fabric: ${meta.fabric}`,
		allowance
	];
}

/** A piece mirrored left to right about its own vertical centre (the other half of a pair). */
export function pieceMirrored(piece: Piece): Piece {
	const xs = piece.outline.segments.map((s) => s.p0.x);
	const mid = (Math.min(...xs) + Math.max(...xs)) / 2;
	const mirrored = pieceMirror(piece, (p) => ({ x: 2 * mid - p.x, y: p.y }));
	const cutLine = piece.seamAllowance?.cutLine;
	if (!cutLine || !mirrored.seamAllowance) return mirrored;
	const segs = cutLine.segments.map((s) =>
		s.kind === 'line'
			? { kind: 'line' as const, p0: { x: 2 * mid - s.p1.x, y: s.p1.y }, p1: { x: 2 * mid - s.p0.x, y: s.p0.y } }
			: {
					kind: 'cubic' as const,
					p0: { x: 2 * mid - s.p3.x, y: s.p3.y },
					p1: { x: 2 * mid - s.p2.x, y: s.p2.y },
					p2: { x: 2 * mid - s.p1.x, y: s.p1.y },
					p3: { x: 2 * mid - s.p0.x, y: s.p0.y }
				}
	);
	return { ...mirrored, seamAllowance: { ...mirrored.seamAllowance, cutLine: { segments: segs.reverse() } } };
}

function arrowHead(tip: Vec, from: Vec, sizeMm: number): DrawItem {
	const dir = vecNormalize(vecSub(tip, from));
	const back = vecSub(tip, vecScale(dir, sizeMm));
	const side = vecScale(vecPerp(dir), sizeMm * 0.4);
	return { ...polyline([vecAdd(back, side), tip, vecSub(back, side)], 'mark', true), fill: true };
}

/**
 * Every line, mark and label of one piece in its own coordinates (mm, y down): the cut line solid,
 * the stitching line dashed (only when the allowance is shown: otherwise the stitching line is cut),
 * darts with their pressing direction, pleats with their fold and placement lines and fold arrow,
 * notches as slits square to the seam, grainline with
 * arrowheads, fold line, internal lines, drill holes and the label.
 */
export function pieceDrawing(piece: Piece, lines: readonly string[]): DrawItem[] {
	const items: DrawItem[] = [];
	const stitching = outlinePleatsAcross(piece);
	if (piece.seamAllowance) {
		items.push({ kind: 'path', segments: piece.seamAllowance.cutLine.segments, closed: true, stroke: 'cut' });
		items.push({ kind: 'path', segments: stitching.segments, closed: true, stroke: 'stitch' });
	} else {
		items.push({ kind: 'path', segments: stitching.segments, closed: true, stroke: 'cut' });
	}
	for (const d of piece.darts) {
		const apex = piece.apexes.find((a) => a.id === d.apexId);
		if (!apex) continue;
		const tip = d.pullBack?.sewnPoint ?? apex.point;
		items.push(polyline([d.leg1End, tip, d.leg2End], 'mark'));
	}
	for (const p of piece.pleats) {
		const m = pleatMarks(p);
		items.push(polyline([...m.fold], 'mark'), polyline([...m.placement], 'placement'));
		items.push(polyline([m.arrow.from, m.arrow.to], 'fine'), arrowHead(m.arrow.to, m.arrow.from, 2.5));
	}
	items.push(...dartPressArrows(piece), ...notchSlits(piece, stitching));
	for (const h of piece.drillHoles) items.push({ kind: 'dot', at: h.at, radiusMm: Math.max(0.5, h.diameterMm / 2) });
	for (const l of piece.internalLines) items.push({ kind: 'path', segments: l.path.segments, closed: false, stroke: 'mark' });
	if (piece.grainline) {
		const g = piece.grainline;
		items.push(polyline([g.from, g.to], 'mark'), arrowHead(g.to, g.from, 4));
		if (g.arrowheads === 'both') items.push(arrowHead(g.from, g.to, 4));
	}
	if (piece.foldLine) items.push(polyline([piece.foldLine.from, piece.foldLine.to], 'fold'));
	const l = labelPlacement(piece, lines);
	const first = l.fontSizeMm * 0.85;
	lines.forEach((text, i) => {
		const b = first + i * l.lineHeightMm;
		const at = l.turned ? { x: l.at.x + b, y: l.at.y } : { x: l.at.x, y: l.at.y + b };
		items.push({ kind: 'text', at, text, sizeMm: l.fontSizeMm, turned: l.turned, bold: i === 1 });
	});
	return items;
}

/** The piece as it is printed: allowance shown or dropped. */
export function pieceAsPrinted(piece: Piece, allowanceShown: boolean): Piece {
	return allowanceShown ? piece : { ...piece, seamAllowance: null };
}
