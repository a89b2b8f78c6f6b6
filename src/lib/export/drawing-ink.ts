import type { Segment, Vec } from '$lib/pattern/kernel';
import { segmentPointAt } from '$lib/pattern/kernel';
import { drawingBoundingBox, type DrawItem } from './drawing';
import type { Rect } from './tiles';

/** Longest stretch of a line or curve covered by one rectangle (mm). */
const STRETCH_MM = 20;
/** Longest chord of a curve between two sampled points (mm). */
const CURVE_STEP_MM = 10;
/** Added on every side: line width, and a curve's bulge between its sampled points (mm). */
const INK_MARGIN_MM = 1;

function pointsOf(s: Segment): Vec[] {
	if (s.kind === 'line') {
		const n = Math.max(1, Math.ceil(Math.hypot(s.p1.x - s.p0.x, s.p1.y - s.p0.y) / STRETCH_MM));
		return Array.from({ length: n + 1 }, (_, k) => ({ x: s.p0.x + ((s.p1.x - s.p0.x) * k) / n, y: s.p0.y + ((s.p1.y - s.p0.y) * k) / n }));
	}
	const hull = Math.hypot(s.p1.x - s.p0.x, s.p1.y - s.p0.y) + Math.hypot(s.p2.x - s.p1.x, s.p2.y - s.p1.y) + Math.hypot(s.p3.x - s.p2.x, s.p3.y - s.p2.y);
	// chords of at most CURVE_STEP_MM: on a curve of 15 mm radius they stay within 0.9 mm of it (c²/8r)
	const n = Math.max(2, Math.ceil(hull / CURVE_STEP_MM));
	return Array.from({ length: n + 1 }, (_, k) => segmentPointAt(s, k / n));
}

/**
 * Rectangles that together cover every mark of a drawing (each stretch of a line, each text and dot),
 * closer to its shape than its bounding box: a page that none of them reaches has nothing to print.
 */
export function drawingInkRects(items: readonly DrawItem[]): Rect[] {
	const out: Rect[] = [];
	const m = INK_MARGIN_MM;
	for (const it of items) {
		if (it.kind !== 'path') {
			const b = drawingBoundingBox([it]);
			out.push({ x: b.minX - m, y: b.minY - m, w: b.maxX - b.minX + 2 * m, h: b.maxY - b.minY + 2 * m });
			continue;
		}
		for (const s of it.segments) {
			const pts = pointsOf(s);
			for (let k = 0; k + 1 < pts.length; k++) {
				const [a, b] = [pts[k], pts[k + 1]];
				const x = Math.min(a.x, b.x) - m;
				const y = Math.min(a.y, b.y) - m;
				out.push({ x, y, w: Math.abs(a.x - b.x) + 2 * m, h: Math.abs(a.y - b.y) + 2 * m });
			}
		}
	}
	return out;
}
