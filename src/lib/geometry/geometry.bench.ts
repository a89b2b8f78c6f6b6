import { bench, describe } from 'vitest';
import { outlineLineIntersections } from './intersect';
import { outlineSignedArea } from './outline-area';
import { outlinePerimeter } from './outline-length';
import { outlineFromPolyline } from './path';
import { outlineContainsPoint } from './point-in';
import { outlineRotateAbout } from './transform';
import type { Outline, Segment } from './types';
import { starPolygon } from './test-support/arbitraries';

/** Outline of n/3 cubics through the star polygon's vertices (n vertices counting control points). */
function cubicOutline(n: number): Outline {
	const pts = starPolygon(Math.max(3, Math.round(n / 3)), 7);
	const segs: Segment[] = pts.map((p0, i) => {
		const p3 = pts[(i + 1) % pts.length];
		return {
			kind: 'cubic',
			p0,
			p1: { x: p0.x + (p3.x - p0.x) / 3 + 2, y: p0.y + (p3.y - p0.y) / 3 - 2 },
			p2: { x: p0.x + (2 * (p3.x - p0.x)) / 3 - 2, y: p0.y + (2 * (p3.y - p0.y)) / 3 + 2 },
			p3
		};
	});
	return { segments: segs };
}

let sink = 0;
for (const n of [200, 2000, 20000]) {
	const poly = outlineFromPolyline(starPolygon(n, 42));
	const curves = cubicOutline(n);
	describe(`${n} vertices`, () => {
		bench('area (lines)', () => { sink += outlineSignedArea(poly); });
		bench('perimeter (lines)', () => { sink += outlinePerimeter(poly); });
		bench('rotate (lines)', () => { sink += outlineRotateAbout(poly, { x: 10, y: 20 }, 0.1).segments.length; });
		bench('point-in (lines)', () => { sink += outlineContainsPoint(poly, { x: 12.5, y: -3.25 }) ? 1 : 0; });
		bench('line intersection (lines)', () => { sink += outlineLineIntersections(poly, { x: 0, y: 0 }, { x: 0.6, y: 0.8 }).length; });
		bench('area (cubics)', () => { sink += outlineSignedArea(curves); });
		bench('perimeter (cubics)', () => { sink += outlinePerimeter(curves); });
		bench('rotate (cubics)', () => { sink += outlineRotateAbout(curves, { x: 10, y: 20 }, 0.1).segments.length; });
		bench('point-in (cubics)', () => { sink += outlineContainsPoint(curves, { x: 12.5, y: -3.25 }) ? 1 : 0; });
		bench('line intersection (cubics)', () => { sink += outlineLineIntersections(curves, { x: 0, y: 0 }, { x: 0.6, y: 0.8 }).length; });
	});
}
export { sink };
