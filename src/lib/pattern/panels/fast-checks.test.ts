import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { outlineFromPolyline, outlineSelfIntersectionsByGrid, type Vec } from '../kernel';
import { gridSelfIntersection } from './fast-checks';

describe('grid self-intersection check', () => {
	it('agrees with the kernel’s general search (outlineSelfIntersectionsByGrid) on random 400–800-vertex polygons, crossing or not', () => {
		fc.assert(
			fc.property(fc.integer({ min: 400, max: 800 }), fc.double({ min: 0, max: 0.6, noNaN: true }), fc.integer({ min: 2, max: 9 }), (n, wobble, lobes) => {
				const pts: Vec[] = [];
				for (let i = 0; i < n; i++) {
					const a = (2 * Math.PI * i) / n;
					// wobble > ~0.5 with a sharp spike makes some polygons cross themselves
					const r = 100 * (1 + wobble * Math.sin(lobes * a)) + (i === Math.floor(n / 3) ? 250 * wobble : 0);
					pts.push({ x: r * Math.cos(a), y: r * Math.sin(a) });
				}
				const o = outlineFromPolyline(pts);
				expect(gridSelfIntersection(o).length > 0).toBe(outlineSelfIntersectionsByGrid(o).length > 0);
			}),
			{ numRuns: 40, seed: 7 }
		);
	});

	it('finds a figure-eight crossing', () => {
		const pts: Vec[] = [];
		for (let i = 0; i < 500; i++) {
			const a = (2 * Math.PI * i) / 500;
			pts.push({ x: 100 * Math.sin(a), y: 60 * Math.sin(2 * a) });
		}
		expect(gridSelfIntersection(outlineFromPolyline(pts)).length).toBeGreaterThan(0);
	});
});
