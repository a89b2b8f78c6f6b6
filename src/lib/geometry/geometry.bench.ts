import { bench, describe } from 'vitest';
import { outlineLineIntersections } from './intersect';
import { outlineSignedArea } from './outline-area';
import { outlinePerimeter } from './outline-length';
import { outlineFromPolyline } from './path';
import { outlineContainsPoint } from './point-in';
import { outlineProblems } from './checks';
import { outlineNearestPoint } from './nearest';
import { outlineSplitAt } from './split';
import { outlineRotateAbout } from './transform';
import type { Outline, Segment } from './types';
import { starPolygon } from './test-support/arbitraries';

/**
 * Outline of n/3 cubics through the star polygon's vertices (n vertices counting control points);
 * each cubic bulges sideways by 10 % of its chord.
 */
function cubicOutline(n: number, rMin = 50): Outline {
	const pts = starPolygon(Math.max(3, Math.round(n / 3)), 7, { x: 0, y: 0 }, rMin, 150);
	const segs: Segment[] = pts.map((p0, i) => {
		const p3 = pts[(i + 1) % pts.length];
		const dx = p3.x - p0.x, dy = p3.y - p0.y;
		return {
			kind: 'cubic',
			p0,
			p1: { x: p0.x + dx / 3 - 0.1 * dy, y: p0.y + dy / 3 + 0.1 * dx },
			p2: { x: p0.x + (2 * dx) / 3 - 0.1 * dy, y: p0.y + (2 * dy) / 3 + 0.1 * dx },
			p3
		};
	});
	return { segments: segs };
}

let sink = 0;
for (const n of [200, 2000, 20000]) {
	const poly = outlineFromPolyline(starPolygon(n, 42));
	const curves = cubicOutline(n);
	// piece-like (smooth) outlines for the checks: radii within 1 mm, so segment boxes rarely overlap
	const smoothPoly = outlineFromPolyline(starPolygon(n, 42, { x: 0, y: 0 }, 149, 150));
	const smoothCurves = cubicOutline(n, 149);
	describe(`${n} vertices`, () => {
		bench('area (lines)', () => { sink += outlineSignedArea(poly); });
		bench('perimeter (lines)', () => { sink += outlinePerimeter(poly); });
		bench('rotate (lines)', () => { sink += outlineRotateAbout(poly, { x: 10, y: 20 }, 0.1).segments.length; });
		bench('point-in (lines)', () => { sink += outlineContainsPoint(poly, { x: 12.5, y: -3.25 }) ? 1 : 0; });
		bench('line intersection (lines)', () => { sink += outlineLineIntersections(poly, { x: 0, y: 0 }, { x: 0.6, y: 0.8 }).length; });
		bench('problems (checks, smooth lines)', () => { sink += outlineProblems(smoothPoly).length; });
		bench('nearest point (lines)', () => { sink += outlineNearestPoint(poly, { x: 170, y: 3 }).distance; });
		bench('split at 2 places (lines)', () => { sink += outlineSplitAt(poly, [{ segmentIndex: 3, t: 0.5 }, { segmentIndex: Math.floor(n / 2), t: 0.25 }]).length; });
		bench('area (cubics)', () => { sink += outlineSignedArea(curves); });
		bench('perimeter (cubics)', () => { sink += outlinePerimeter(curves); });
		bench('rotate (cubics)', () => { sink += outlineRotateAbout(curves, { x: 10, y: 20 }, 0.1).segments.length; });
		bench('point-in (cubics)', () => { sink += outlineContainsPoint(curves, { x: 12.5, y: -3.25 }) ? 1 : 0; });
		bench('problems (checks, smooth cubics)', () => { sink += outlineProblems(smoothCurves).length; });
		bench('nearest point (cubics)', () => { sink += outlineNearestPoint(curves, { x: 170, y: 3 }).distance; });
		bench('line intersection (cubics)', () => { sink += outlineLineIntersections(curves, { x: 0, y: 0 }, { x: 0.6, y: 0.8 }).length; });
	});
}
export { sink };
