import type { BoundingBox, Segment, Vec } from '$lib/pattern/kernel';
import { BOUNDING_BOX_EMPTY, boundingBoxUnion, pathBoundingBox, pointsBoundingBox, segmentMapPoints } from '$lib/pattern/kernel';

/**
 * A drawing as the print and plot exports lay it out: paths, dots and text in millimetres, y down,
 * independent of the file format that writes it. Line kinds follow the screen: cut line solid, stitching
 * line dashed, fold lines dash-dot.
 */
export type StrokeKind = 'cut' | 'stitch' | 'mark' | 'fold' | 'placement' | 'fine' | 'trim' | 'overlap';

export interface DrawPath {
	readonly kind: 'path';
	readonly segments: readonly Segment[];
	readonly closed: boolean;
	readonly stroke: StrokeKind;
	/** Filled with ink (arrowheads). */
	readonly fill?: boolean;
}

export interface DrawDot {
	readonly kind: 'dot';
	readonly at: Vec;
	readonly radiusMm: number;
}

export interface DrawText {
	readonly kind: 'text';
	/** Left end of the baseline. */
	readonly at: Vec;
	readonly text: string;
	readonly sizeMm: number;
	/** Reads upward (a quarter turn anticlockwise on the paper). */
	readonly turned?: boolean;
	readonly bold?: boolean;
}

export type DrawItem = DrawPath | DrawDot | DrawText;

/** Line width and dash pattern of each stroke kind (mm). */
export const STROKE_STYLE: Record<StrokeKind, { widthMm: number; dashMm: readonly number[] }> = {
	cut: { widthMm: 0.5, dashMm: [] },
	stitch: { widthMm: 0.3, dashMm: [2, 1.5] },
	mark: { widthMm: 0.35, dashMm: [] },
	fold: { widthMm: 0.4, dashMm: [6, 2, 1, 2] },
	placement: { widthMm: 0.3, dashMm: [3, 1.5] },
	fine: { widthMm: 0.2, dashMm: [] },
	trim: { widthMm: 0.25, dashMm: [] },
	overlap: { widthMm: 0.2, dashMm: [1, 1] }
};

export function lineSegments(points: readonly Vec[]): Segment[] {
	const out: Segment[] = [];
	for (let i = 0; i + 1 < points.length; i++) out.push({ kind: 'line', p0: points[i], p1: points[i + 1] });
	return out;
}

export function polyline(points: readonly Vec[], stroke: StrokeKind, closed = false): DrawPath {
	const pts = closed ? [...points, points[0]] : points;
	return { kind: 'path', segments: lineSegments(pts), closed, stroke };
}

export function rectPath(x: number, y: number, w: number, h: number, stroke: StrokeKind): DrawPath {
	return polyline(
		[
			{ x, y },
			{ x: x + w, y },
			{ x: x + w, y: y + h },
			{ x, y: y + h }
		],
		stroke,
		true
	);
}

/** Every point of a drawing moved by `f` (text keeps its direction). */
export function drawingMap(items: readonly DrawItem[], f: (p: Vec) => Vec): DrawItem[] {
	return items.map((it) => {
		if (it.kind === 'path') return { ...it, segments: it.segments.map((s) => segmentMapPoints(s, f)) };
		return { ...it, at: f(it.at) };
	});
}

export function drawingTranslate(items: readonly DrawItem[], dx: number, dy: number): DrawItem[] {
	return drawingMap(items, (p) => ({ x: p.x + dx, y: p.y + dy }));
}

/** Width of a character of Source Sans 3, generously, as a share of the type size (layout only). */
const CHAR_WIDTH_EM = 0.56;

/** The extent of a drawing (text by an estimate of its width). */
export function drawingBoundingBox(items: readonly DrawItem[]): BoundingBox {
	let b: BoundingBox = BOUNDING_BOX_EMPTY;
	for (const it of items) {
		if (it.kind === 'path') b = boundingBoxUnion(b, pathBoundingBox({ segments: it.segments }));
		else if (it.kind === 'dot') b = boundingBoxUnion(b, pointsBoundingBox([{ x: it.at.x - it.radiusMm, y: it.at.y - it.radiusMm }, { x: it.at.x + it.radiusMm, y: it.at.y + it.radiusMm }]));
		else {
			const len = it.text.length * CHAR_WIDTH_EM * it.sizeMm;
			const far = it.turned ? { x: it.at.x - it.sizeMm * 0.85, y: it.at.y - len } : { x: it.at.x + len, y: it.at.y - it.sizeMm * 0.85 };
			b = boundingBoxUnion(b, pointsBoundingBox([it.at, far]));
		}
	}
	return b;
}
