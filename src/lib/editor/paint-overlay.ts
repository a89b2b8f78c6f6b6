import { segmentFlatten, type Vec } from '$lib/geometry';
import type { Hit, Snap } from './hit';
import { PALETTE } from './palette';
import type { OverlayItem } from './moves/types';

/** Hover, selection, snap marker and the tool's overlay, painted in world millimetres. */
export interface OverlayData {
	readonly scale: number;
	readonly hover: { hit: Hit; offset: Vec; segment: Parameters<typeof segmentFlatten>[0] | null } | null;
	readonly selectedEdge: { offset: Vec; segment: Parameters<typeof segmentFlatten>[0] } | null;
	readonly selectedPoint: Vec | null;
	readonly snap: Snap | null;
	/** What is selected (a dart, a seam pair, panels), in world mm. */
	readonly selectionItems: readonly OverlayItem[];
	readonly items: readonly OverlayItem[];
	readonly itemsOffset: Vec;
}

const tones: Record<string, string> = {
	preview: PALETTE.ochre,
	select: PALETTE.indigo,
	reach: PALETTE.madder,
	measure: PALETTE.indigo,
	bad: PALETTE.madder
};

function poly(ctx: CanvasRenderingContext2D, pts: readonly Vec[], o: Vec) {
	ctx.beginPath();
	pts.forEach((p, i) => (i ? ctx.lineTo(p.x + o.x, p.y + o.y) : ctx.moveTo(p.x + o.x, p.y + o.y)));
	ctx.stroke();
}

export function paintOverlay(ctx: CanvasRenderingContext2D, d: OverlayData): void {
	const px = 1 / d.scale;
	ctx.save();
	ctx.lineCap = 'round';
	if (d.selectedEdge) {
		ctx.strokeStyle = PALETTE.indigo;
		ctx.globalAlpha = 0.45;
		ctx.lineWidth = 6 * px;
		poly(ctx, segmentFlatten(d.selectedEdge.segment, 0.2), d.selectedEdge.offset);
		ctx.globalAlpha = 1;
	}
	if (d.hover) {
		const { hit, offset } = d.hover;
		ctx.strokeStyle = PALETTE.indigo;
		ctx.lineWidth = 3 * px;
		if (d.hover.segment && hit.kind === 'edge') poly(ctx, segmentFlatten(d.hover.segment, 0.2), offset);
		if (hit.kind === 'point' || hit.kind === 'apex') {
			ctx.beginPath();
			ctx.arc(hit.local.x + offset.x, hit.local.y + offset.y, 5 * px, 0, Math.PI * 2);
			ctx.stroke();
		}
	}
	if (d.selectedPoint) {
		ctx.fillStyle = PALETTE.indigo;
		ctx.fillRect(d.selectedPoint.x - 3.5 * px, d.selectedPoint.y - 3.5 * px, 7 * px, 7 * px);
	}
	paintItems(ctx, d.selectionItems, { x: 0, y: 0 }, px);
	paintItems(ctx, d.items, d.itemsOffset, px);
	paintSnap(ctx, d.snap, px);
	ctx.restore();
}

function paintItems(ctx: CanvasRenderingContext2D, items: readonly OverlayItem[], o: Vec, px: number) {
	for (const it of items) {
		if (it.kind === 'line') {
			ctx.strokeStyle = tones[it.tone];
			ctx.lineWidth = 1.5 * px;
			ctx.setLineDash(it.dashed ? [5 * px, 4 * px] : []);
			poly(ctx, it.points, o);
			ctx.setLineDash([]);
		} else if (it.kind === 'point') {
			ctx.fillStyle = tones[it.tone];
			ctx.beginPath();
			ctx.arc(it.at.x + o.x, it.at.y + o.y, 4 * px, 0, Math.PI * 2);
			ctx.fill();
		} else if (it.kind === 'handle') {
			ctx.fillStyle = it.active ? PALETTE.ochre : PALETTE.paper;
			ctx.strokeStyle = PALETTE.indigo;
			ctx.lineWidth = 1.5 * px;
			ctx.beginPath();
			ctx.arc(it.at.x + o.x, it.at.y + o.y, 5 * px, 0, Math.PI * 2);
			ctx.fill();
			ctx.stroke();
		} else {
			ctx.font = `600 ${13 * px}px "Source Sans 3", sans-serif`;
			ctx.textAlign = 'center';
			ctx.textBaseline = 'bottom';
			const w = ctx.measureText(it.text).width;
			ctx.fillStyle = PALETTE.paper;
			ctx.fillRect(it.at.x + o.x - w / 2 - 3 * px, it.at.y + o.y - 18 * px, w + 6 * px, 16 * px);
			ctx.fillStyle = PALETTE.ink;
			ctx.fillText(it.text, it.at.x + o.x, it.at.y + o.y - 3 * px);
		}
	}
}

function paintSnap(ctx: CanvasRenderingContext2D, snap: Snap | null, px: number) {
	if (snap && snap.kind !== 'free') {
		const p = snap.world;
		ctx.strokeStyle = PALETTE.indigo;
		ctx.lineWidth = 1.5 * px;
		const r = 6 * px;
		ctx.beginPath();
		if (snap.kind === 'grid') {
			ctx.moveTo(p.x - r, p.y);
			ctx.lineTo(p.x + r, p.y);
			ctx.moveTo(p.x, p.y - r);
			ctx.lineTo(p.x, p.y + r);
		} else if (snap.kind === 'midpoint') {
			ctx.moveTo(p.x, p.y - r);
			ctx.lineTo(p.x + r, p.y + r);
			ctx.lineTo(p.x - r, p.y + r);
			ctx.closePath();
		} else if (snap.kind === 'angle') {
			ctx.moveTo(p.x + r, p.y - r);
			ctx.lineTo(p.x - r, p.y + r);
			ctx.lineTo(p.x + r, p.y + r);
		} else if (snap.kind === 'edge') {
			ctx.moveTo(p.x - r, p.y - r);
			ctx.lineTo(p.x + r, p.y + r);
			ctx.moveTo(p.x + r, p.y - r);
			ctx.lineTo(p.x - r, p.y + r);
		} else {
			ctx.rect(p.x - r, p.y - r, 2 * r, 2 * r);
		}
		ctx.stroke();
		ctx.font = `600 ${11 * px}px "Source Sans 3", sans-serif`;
		ctx.fillStyle = PALETTE.indigo;
		ctx.textAlign = 'left';
		ctx.textBaseline = 'top';
		ctx.fillText(snap.kind, p.x + r + 2 * px, p.y + r);
	}
}
