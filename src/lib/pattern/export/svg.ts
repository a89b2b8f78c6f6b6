import type { Outline, Path, Segment, Vec } from '../kernel';
import { pathBoundingBox, vecAdd, vecLength, vecNormalize, vecPerp, vecScale, vecSub } from '../kernel';
import type { Piece } from '../piece-schema';

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

/** The layers of one piece, as SVG groups in piece coordinates (mm). */
function pieceLayers(piece: Piece, meta: SvgExportMeta, labelAt: Vec): string {
	const layers: string[] = [];
	const cut = piece.seamAllowance?.cutLine ?? piece.outline;
	layers.push(`<g id="cut-line" fill="none" stroke="#1F2A37" stroke-width="0.5"><path d="${svgPathData(cut, true)}"/></g>`);
	layers.push(
		`<g id="stitching-line" fill="none" stroke="#1F2A37" stroke-width="0.3" stroke-dasharray="2 1.5"><path d="${svgPathData(piece.outline, true)}"/></g>`
	);
	const dartLines: string[] = [];
	for (const d of piece.darts) {
		const apex = piece.apexes.find((a) => a.id === d.apexId);
		if (!apex) continue;
		const tip = d.pullBack?.sewnPoint ?? apex.point;
		dartLines.push(line(d.leg1End, tip), line(d.leg2End, tip));
	}
	for (const p of piece.pleats) {
		dartLines.push(line(p.foldLine.from, p.foldLine.to), line(p.placementLine.from, p.placementLine.to, ' stroke-dasharray="3 1.5"'));
		dartLines.push(line(p.foldArrow.from, p.foldArrow.to), arrowHead(p.foldArrow.to, p.foldArrow.from, 3));
	}
	layers.push(`<g id="darts-pleats" fill="none" stroke="#1F2A37" stroke-width="0.3">${dartLines.join('')}</g>`);
	const notches = piece.notches.map((k) => {
		const marks = [];
		for (let i = 0; i < k.count; i++) marks.push(`<circle cx="${n(k.at.x + (i - (k.count - 1) / 2) * 3)}" cy="${n(k.at.y)}" r="1"/>`);
		return marks.join('');
	});
	layers.push(`<g id="notches" fill="#1F2A37">${notches.join('')}</g>`);
	if (piece.grainline) {
		const g = piece.grainline;
		const heads = arrowHead(g.to, g.from) + (g.arrowheads === 'both' ? arrowHead(g.from, g.to) : '');
		layers.push(`<g id="grainline" fill="none" stroke="#1F2A37" stroke-width="0.4">${line(g.from, g.to)}${heads}</g>`);
	}
	if (piece.foldLine) {
		layers.push(
			`<g id="fold-line" fill="none" stroke="#1F2A37" stroke-width="0.4" stroke-dasharray="6 2 1 2">${line(piece.foldLine.from, piece.foldLine.to)}</g>`
		);
	}
	const texts = [
		meta.styleCode ? `${meta.styleName} · ${meta.styleCode}` : meta.styleName,
		piece.name,
		meta.sizeLabel,
		cutInstructionText(piece.cut),
		piece.seamAllowance
			? `seam allowance included (${piece.seamAllowance.defaultWidthMm} mm unless marked)`
			: 'net pattern: no seam allowance',
		`version ${meta.versionNumber}`
	];
	const label = texts
		.map((t, i) => `<text x="${n(labelAt.x)}" y="${n(labelAt.y + i * 7)}">${esc(t)}</text>`)
		.join('');
	layers.push(`<g id="labels" font-family="Source Sans 3, sans-serif" font-size="5" fill="#1F2A37">${label}</g>`);
	return layers.join('\n');
}

function labelPoint(piece: Piece): Vec {
	if (piece.grainline) {
		const g = piece.grainline;
		const mid = vecScale(vecAdd(g.from, g.to), 0.5);
		const len = vecLength(vecSub(g.to, g.from));
		return vecAdd(mid, vecScale(vecPerp(vecNormalize(vecSub(g.to, g.from))), Math.min(25, len / 4)));
	}
	const b = pathBoundingBox(piece.outline);
	return { x: (b.minX + b.maxX) / 2 - 20, y: (b.minY + b.maxY) / 2 };
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
	return `<g id="test-square" fill="none" stroke="#1F2A37" stroke-width="0.3"><rect x="${n(at.x)}" y="${n(at.y)}" width="50" height="50"/><text x="${n(at.x + 2)}" y="${n(at.y + 8)}" font-size="4" stroke="none" fill="#1F2A37">50 mm test square</text></g>`;
}

/** One piece at true scale: width/height in mm and a viewBox in mm, one group per layer. */
export function pieceSvg(piece: Piece, meta: SvgExportMeta): string {
	const b = pathBoundingBox(piece.seamAllowance?.cutLine ?? piece.outline);
	const x = b.minX - SVG_MARGIN_MM;
	const y = b.minY - SVG_MARGIN_MM;
	const w = b.maxX - b.minX + 2 * SVG_MARGIN_MM + 60;
	const h = Math.max(b.maxY - b.minY + 2 * SVG_MARGIN_MM, 80);
	const body = `<g id="piece-${esc(piece.id)}">${pieceLayers(piece, meta, labelPoint(piece))}</g>\n${testSquare({ x: b.maxX + 10, y: b.minY })}`;
	return svgDocument(w, h, x, y, body);
}

/** All pieces of a style side by side at true scale, each in its own group. */
export function styleSvg(pieces: readonly { piece: Piece; meta: SvgExportMeta }[]): string {
	let cursor = 0;
	let height = 80;
	const groups: string[] = [];
	for (const { piece, meta } of pieces) {
		const b = pathBoundingBox(piece.seamAllowance?.cutLine ?? piece.outline);
		const dx = cursor - b.minX;
		const dy = -b.minY;
		groups.push(
			`<g id="piece-${esc(piece.id)}" transform="translate(${n(dx)} ${n(dy)})">${pieceLayers(piece, meta, labelPoint(piece))}</g>`
		);
		cursor += b.maxX - b.minX + SVG_GAP_MM;
		height = Math.max(height, b.maxY - b.minY);
	}
	groups.push(testSquare({ x: cursor, y: 0 }));
	const width = cursor + 60;
	return svgDocument(width + 2 * SVG_MARGIN_MM, height + 2 * SVG_MARGIN_MM, -SVG_MARGIN_MM, -SVG_MARGIN_MM, groups.join('\n'));
}
