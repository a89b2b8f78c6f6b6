import type { BoundingBox, Outline, Path, Segment, Vec } from '../kernel';
import { boundingBoxUnion, pathBoundingBox, vecAdd, vecNormalize, vecPerp, vecScale, vecSub } from '../kernel';
import { COLORS } from '../../palette';
import type { Piece } from '../piece-schema';
import { labelPlacement, type LabelPlacement } from './label-place';
import { outlinePleatsAcross, pleatMarks } from './pleat-marks';

/** Every line and label is drawn in the palette's ink. */
const INK = COLORS.ink.DEFAULT;

/** What the labels of an exported piece say besides the geometry. */
export interface SvgExportMeta {
	readonly styleName: string;
	readonly styleCode?: string;
	/** Size or measurement set the block was drafted for. */
	readonly sizeLabel: string;
	readonly versionNumber: number;
}

/** Blank paper kept round each piece (mm). */
export const SVG_MARGIN_MM = 20;
/** Gap between pieces in a style sheet (mm). */
export const SVG_GAP_MM = 30;

const n = (v: number) => (Math.abs(v) < 5e-7 ? '0' : v.toFixed(6).replace(/\.?0+$/, ''));
const pt = (p: Vec) => `${n(p.x)} ${n(p.y)}`;
const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function segmentData(s: Segment): string {
	return s.kind === 'line' ? `L ${pt(s.p1)}` : `C ${pt(s.p1)} ${pt(s.p2)} ${pt(s.p3)}`;
}

/** SVG path data of an outline (closed) or path (open), with the exact cubic curves. */
export function svgPathData(chain: Outline | Path, closed: boolean): string {
	if (chain.segments.length === 0) return '';
	const parts = [`M ${pt(chain.segments[0].p0)}`, ...chain.segments.map(segmentData)];
	if (closed) parts.push('Z');
	return parts.join(' ');
}

function line(a: Vec, b: Vec, attrs = ''): string {
	return `<line x1="${n(a.x)}" y1="${n(a.y)}" x2="${n(b.x)}" y2="${n(b.y)}"${attrs}/>`;
}

function arrowHead(tip: Vec, from: Vec, sizeMm = 4): string {
	const dir = vecNormalize(vecSub(tip, from));
	const back = vecSub(tip, vecScale(dir, sizeMm));
	const side = vecScale(vecPerp(dir), sizeMm * 0.4);
	return `<path d="M ${pt(vecAdd(back, side))} L ${pt(tip)} L ${pt(vecSub(back, side))}"/>`;
}

export function cutInstructionText(cut: Piece['cut']): string {
	if (cut === 'pair') return 'cut 2 (mirror)';
	if (cut === 'on_fold') return 'cut 1 on fold';
	return 'cut 1, right side up';
}

/** The text block printed on a piece. */
function labelLines(piece: Piece, meta: SvgExportMeta): string[] {
	return [
		meta.styleCode ? `${meta.styleName} · ${meta.styleCode}` : meta.styleName,
		piece.name,
		meta.sizeLabel,
		cutInstructionText(piece.cut),
		piece.seamAllowance
			? `seam allowance included (${piece.seamAllowance.defaultWidthMm} mm unless marked)`
			: 'net pattern: no seam allowance',
		`version ${meta.versionNumber}`
	];
}

/** A piece laid out for export: its label's place and the page area it needs (cut line and label). */
interface PieceLayout {
	readonly lines: string[];
	readonly label: LabelPlacement;
	readonly extent: BoundingBox;
}

function pieceLayout(piece: Piece, meta: SvgExportMeta): PieceLayout {
	const lines = labelLines(piece, meta);
	const label = labelPlacement(piece, lines);
	const extent = boundingBoxUnion(pathBoundingBox(piece.seamAllowance?.cutLine ?? piece.outline), label.box);
	return { lines, label, extent };
}

function labelGroup(lines: readonly string[], l: LabelPlacement): string {
	const first = l.fontSizeMm * 0.85;
	const texts = (x: number, y: number) =>
		lines.map((t, i) => `<text x="${n(x)}" y="${n(y + first + i * l.lineHeightMm)}">${esc(t)}</text>`).join('');
	const font = `font-family="Source Sans 3, sans-serif" font-size="${n(l.fontSizeMm)}" fill="${INK}"`;
	if (l.turned) return `<g id="labels" ${font} transform="translate(${n(l.at.x)} ${n(l.at.y)}) rotate(-90)">${texts(0, 0)}</g>`;
	return `<g id="labels" ${font}>${texts(l.at.x, l.at.y)}</g>`;
}

/**
 * The layers of one piece, as SVG groups in piece coordinates (mm). Pleats are marked as a cutter
 * marks them: the seam runs across the pleat, and the fold line, placement line and fold arrow are
 * drawn from the seam over the pleat's stitched length (pleat-marks.ts), not down to the apex.
 */
function pieceLayers(piece: Piece, layout: PieceLayout): string {
	const layers: string[] = [];
	const stitching = outlinePleatsAcross(piece);
	const cut = piece.seamAllowance?.cutLine ?? stitching;
	layers.push(`<g id="cut-line" fill="none" stroke="${INK}" stroke-width="0.5"><path d="${svgPathData(cut, true)}"/></g>`);
	layers.push(
		`<g id="stitching-line" fill="none" stroke="${INK}" stroke-width="0.3" stroke-dasharray="2 1.5"><path d="${svgPathData(stitching, true)}"/></g>`
	);
	const dartLines: string[] = [];
	for (const d of piece.darts) {
		const apex = piece.apexes.find((a) => a.id === d.apexId);
		if (!apex) continue;
		const tip = d.pullBack?.sewnPoint ?? apex.point;
		dartLines.push(line(d.leg1End, tip), line(d.leg2End, tip));
	}
	for (const p of piece.pleats) {
		const m = pleatMarks(p);
		dartLines.push(
			`<g class="pleat" data-pleat="${esc(p.id)}">${line(m.fold[0], m.fold[1], ' class="fold"')}${line(m.placement[0], m.placement[1], ' class="placement" stroke-dasharray="3 1.5"')}${line(m.arrow.from, m.arrow.to, ' class="fold-arrow"')}${arrowHead(m.arrow.to, m.arrow.from, 2.5)}</g>`
		);
	}
	layers.push(`<g id="darts-pleats" fill="none" stroke="${INK}" stroke-width="0.3">${dartLines.join('')}</g>`);
	const notches = piece.notches.map((k) => {
		const marks = [];
		for (let i = 0; i < k.count; i++) marks.push(`<circle cx="${n(k.at.x + (i - (k.count - 1) / 2) * 3)}" cy="${n(k.at.y)}" r="1"/>`);
		return marks.join('');
	});
	layers.push(`<g id="notches" fill="${INK}">${notches.join('')}</g>`);
	if (piece.grainline) {
		const g = piece.grainline;
		const heads = arrowHead(g.to, g.from) + (g.arrowheads === 'both' ? arrowHead(g.from, g.to) : '');
		layers.push(`<g id="grainline" fill="none" stroke="${INK}" stroke-width="0.4">${line(g.from, g.to)}${heads}</g>`);
	}
	if (piece.foldLine) {
		layers.push(
			`<g id="fold-line" fill="none" stroke="${INK}" stroke-width="0.4" stroke-dasharray="6 2 1 2">${line(piece.foldLine.from, piece.foldLine.to)}</g>`
		);
	}
	layers.push(labelGroup(layout.lines, layout.label));
	return layers.join('\n');
}

function svgDocument(widthMm: number, heightMm: number, viewX: number, viewY: number, body: string): string {
	return [
		'<?xml version="1.0" encoding="UTF-8"?>',
		`<svg xmlns="http://www.w3.org/2000/svg" width="${n(widthMm)}mm" height="${n(heightMm)}mm" viewBox="${n(viewX)} ${n(viewY)} ${n(widthMm)} ${n(heightMm)}">`,
		'<desc>Dartelier export at true scale: 1 user unit = 1 mm. Print at 100 % and check the test square before cutting cloth.</desc>',
		body,
		'</svg>'
	].join('\n');
}

function testSquare(at: Vec): string {
	return `<g id="test-square" fill="none" stroke="${INK}" stroke-width="0.3"><rect x="${n(at.x)}" y="${n(at.y)}" width="50" height="50"/><text x="${n(at.x + 2)}" y="${n(at.y + 8)}" font-size="4" stroke="none" fill="${INK}">50 mm test square</text></g>`;
}

/** One piece at true scale: width/height in mm and a viewBox in mm, one group per layer. */
export function pieceSvg(piece: Piece, meta: SvgExportMeta): string {
	const layout = pieceLayout(piece, meta);
	const b = layout.extent;
	const x = b.minX - SVG_MARGIN_MM;
	const y = b.minY - SVG_MARGIN_MM;
	const w = b.maxX - b.minX + 2 * SVG_MARGIN_MM + 60;
	const h = Math.max(b.maxY - b.minY + 2 * SVG_MARGIN_MM, 80);
	const body = `<g id="piece-${esc(piece.id)}" data-name="${esc(piece.name)}" data-cut="${piece.cut}">${pieceLayers(piece, layout)}</g>\n${testSquare({ x: b.maxX + 10, y: b.minY })}`;
	return svgDocument(w, h, x, y, body);
}

/** All pieces of a style side by side at true scale, each in its own group. */
export function styleSvg(pieces: readonly { piece: Piece; meta: SvgExportMeta }[]): string {
	let cursor = 0;
	let height = 80;
	const groups: string[] = [];
	for (const { piece, meta } of pieces) {
		const layout = pieceLayout(piece, meta);
		const b = layout.extent;
		const dx = cursor - b.minX;
		const dy = -b.minY;
		groups.push(`<g id="piece-${esc(piece.id)}" data-name="${esc(piece.name)}" data-cut="${piece.cut}" transform="translate(${n(dx)} ${n(dy)})">${pieceLayers(piece, layout)}</g>`);
		cursor += b.maxX - b.minX + SVG_GAP_MM;
		height = Math.max(height, b.maxY - b.minY);
	}
	groups.push(testSquare({ x: cursor, y: 0 }));
	const width = cursor + 60;
	return svgDocument(width + 2 * SVG_MARGIN_MM, height + 2 * SVG_MARGIN_MM, -SVG_MARGIN_MM, -SVG_MARGIN_MM, groups.join('\n'));
}
