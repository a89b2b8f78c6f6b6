import { bench, describe } from 'vitest';
import { outlineProblems } from './checks';
import { outlineSelfIntersections, outlineSelfIntersectionsByGrid } from './self-intersect';
import type { Outline, Segment, Vec } from './types';

/**
 * The self-crossing check of a large curved outline. "Piece-like": a smooth wavy oval (a bodice-sized
 * 500 × 700 mm outline with five gentle lobes) through m points, each span a cubic Bézier
 * (Catmull–Rom handles); n vertices counts control points as in geometry.bench.ts, so 20,000 vertices
 * are 6,667 cubics. The chain search (outlineSelfIntersections) runs beside the general grid search it
 * replaced for such outlines (outlineSelfIntersectionsByGrid), on the same outline in the same run.
 */
export function pieceLikeCurvedOutline(cubics: number): Outline {
	const pts: Vec[] = [];
	for (let i = 0; i < cubics; i++) {
		const a = (2 * Math.PI * i) / cubics;
		const r = 1 + 0.04 * Math.sin(5 * a);
		pts.push({ x: 400 + 250 * r * Math.cos(a), y: 400 + 350 * r * Math.sin(a) });
	}
	const segs: Segment[] = pts.map((p0, i) => {
		const p3 = pts[(i + 1) % cubics];
		const pm = pts[(i - 1 + cubics) % cubics];
		const pn = pts[(i + 2) % cubics];
		return {
			kind: 'cubic',
			p0,
			p1: { x: p0.x + (p3.x - pm.x) / 6, y: p0.y + (p3.y - pm.y) / 6 },
			p2: { x: p3.x - (pn.x - p0.x) / 6, y: p3.y - (pn.y - p0.y) / 6 },
			p3
		};
	});
	return { segments: segs };
}

let sink = 0;
for (const n of [2000, 20000, 60000]) {
	const o = pieceLikeCurvedOutline(Math.round(n / 3));
	describe(`curved outline, ${n} vertices (${Math.round(n / 3)} cubics)`, () => {
		bench('self-crossing check (chains)', () => {
			sink += outlineSelfIntersections(o).length;
		});
		bench('self-crossing check (general grid search)', () => {
			sink += outlineSelfIntersectionsByGrid(o).length;
		});
		bench('all outline checks (outlineProblems)', () => {
			sink += outlineProblems(o).length;
		});
	});
}
export { sink };
