import type { Vec } from '$lib/geometry';
import type { Arrow, PieceDrawing } from './drawing';
import { PALETTE } from './palette';

/**
 * Paints a piece drawing onto a 2D canvas context already transformed to the piece's millimetres.
 * Line widths and marks keep a constant size on screen (divided by the pixels per mm).
 */

export type PieceLook = 'normal' | 'selected' | 'preview' | 'ghost' | 'error';

interface Paths {
	stitch: Path2D;
	cut: Path2D;
	internal: Path2D;
	marks: Path2D;
	dotted: Path2D;
}

const pathCache = new WeakMap<PieceDrawing, Paths>();

function polyPath(p: Path2D, pts: readonly Vec[], closed: boolean) {
	if (pts.length === 0) return;
	p.moveTo(pts[0].x, pts[0].y);
	for (let i = 1; i < pts.length; i++) p.lineTo(pts[i].x, pts[i].y);
	if (closed) p.closePath();
}

function pathsOf(d: PieceDrawing): Paths {
	let p = pathCache.get(d);
	if (p) return p;
	const stitch = new Path2D();
	polyPath(stitch, d.stitch, true);
	const cut = new Path2D();
	for (const c of d.cut) polyPath(cut, c, true);
	const internal = new Path2D();
	for (const l of d.internal) polyPath(internal, l, false);
	const marks = new Path2D();
	for (const m of d.marks) polyPath(marks, m, false);
	const dotted = new Path2D();
	for (const m of d.dotted) polyPath(dotted, m, false);
	p = { stitch, cut, internal, marks, dotted };
	pathCache.set(d, p);
	return p;
}

function lineColour(look: PieceLook): string {
	if (look === 'selected') return PALETTE.indigo;
	if (look === 'preview') return PALETTE.ochre;
	if (look === 'error') return PALETTE.madder;
	return PALETTE.ink;
}

function arrowPath(ctx: CanvasRenderingContext2D, a: Arrow, head: number) {
	const dx = a.to.x - a.from.x;
	const dy = a.to.y - a.from.y;
	const len = Math.hypot(dx, dy) || 1;
	const ux = dx / len;
	const uy = dy / len;
	ctx.beginPath();
	ctx.moveTo(a.from.x, a.from.y);
	ctx.lineTo(a.to.x, a.to.y);
	const tip = (p: Vec, sx: number, sy: number) => {
		ctx.moveTo(p.x - sx * head + -sy * head * 0.45, p.y - sy * head + sx * head * 0.45);
		ctx.lineTo(p.x, p.y);
		ctx.lineTo(p.x - sx * head - -sy * head * 0.45, p.y - sy * head - sx * head * 0.45);
	};
	tip(a.to, ux, uy);
	if (a.heads === 'both') tip(a.from, -ux, -uy);
	ctx.stroke();
}

export function paintPiece(ctx: CanvasRenderingContext2D, d: PieceDrawing, look: PieceLook, pxPerMm: number, showCut = true, lifted = false): void {
	const px = 1 / pxPerMm;
	const p = pathsOf(d);
	const colour = lineColour(look);
	ctx.save();
	ctx.lineJoin = 'round';
	ctx.lineCap = 'round';
	// paper of the piece
	ctx.globalAlpha = look === 'ghost' ? 0.22 : 1;
	if (look !== 'ghost') {
		ctx.fillStyle = PALETTE.pieceFill;
		// a piece lying on the table casts a faint shadow, as paper does (only where it is drawn once, cached)
		if (lifted) {
			ctx.shadowColor = PALETTE.shadow;
			ctx.shadowBlur = 5;
			ctx.shadowOffsetX = 1;
			ctx.shadowOffsetY = 2;
		}
		ctx.fill(showCut && d.cut.length ? p.cut : p.stitch, 'nonzero');
		ctx.shadowColor = 'transparent';
		ctx.shadowBlur = 0;
	}
	// cut line: solid, only where the piece has a seam allowance (a net piece has none to draw)
	ctx.strokeStyle = colour;
	if (showCut && d.cut.length) {
		ctx.lineWidth = 1.4 * px;
		ctx.setLineDash([]);
		ctx.stroke(p.cut);
	}
	// stitching line: dashed
	ctx.lineWidth = (look === 'selected' ? 1.6 : 1.1) * px;
	ctx.setLineDash([6 * px, 4 * px]);
	ctx.stroke(p.stitch);
	ctx.setLineDash([]);
	// style lines and internal lines
	ctx.lineWidth = 1.3 * px;
	ctx.setLineDash([10 * px, 3 * px, 2 * px, 3 * px]);
	ctx.stroke(p.internal);
	// marks
	ctx.setLineDash([]);
	ctx.lineWidth = 1 * px;
	ctx.stroke(p.marks);
	ctx.setLineDash([1.5 * px, 3 * px]);
	ctx.stroke(p.dotted);
	ctx.setLineDash([]);
	// arrows: grainline, fold arrows, pressing
	ctx.lineWidth = 1.1 * px;
	const head = Math.max(3, 8 * px);
	for (const a of d.arrows) arrowPath(ctx, a, head);
	// fold line: long dash with bracket marks
	if (d.foldLine) {
		const [a, b] = d.foldLine;
		ctx.lineWidth = 2 * px;
		ctx.setLineDash([14 * px, 4 * px, 3 * px, 4 * px]);
		ctx.beginPath();
		ctx.moveTo(a.x, a.y);
		ctx.lineTo(b.x, b.y);
		ctx.stroke();
		ctx.setLineDash([]);
	}
	// drill holes
	for (const h of d.drill) {
		ctx.beginPath();
		ctx.arc(h.x, h.y, 1.5, 0, Math.PI * 2);
		ctx.stroke();
	}
	// apexes: small madder crosshairs
	ctx.strokeStyle = PALETTE.madder;
	ctx.lineWidth = 1.2 * px;
	const r = 6 * px;
	for (const a of d.apexes) {
		ctx.beginPath();
		ctx.moveTo(a.x - r, a.y);
		ctx.lineTo(a.x + r, a.y);
		ctx.moveTo(a.x, a.y - r);
		ctx.lineTo(a.x, a.y + r);
		ctx.moveTo(a.x + r * 0.55, a.y);
		ctx.arc(a.x, a.y, r * 0.55, 0, Math.PI * 2);
		ctx.stroke();
	}
	// labels: true size on the piece (5 mm type), the piece name at the centre if no labels
	ctx.fillStyle = colour;
	ctx.textAlign = 'center';
	ctx.textBaseline = 'middle';
	if (pxPerMm * 5 >= 5) {
		ctx.font = `600 5px "Source Sans 3", sans-serif`;
		const texts = d.labels.length ? d.labels : [{ text: d.title.text, at: d.title.at, angleRad: 0 }];
		for (const l of texts) {
			ctx.save();
			ctx.translate(l.at.x, l.at.y);
			if (l.angleRad) ctx.rotate(l.angleRad);
			ctx.fillText(l.text, 0, 0);
			ctx.restore();
		}
	}
	ctx.restore();
}
