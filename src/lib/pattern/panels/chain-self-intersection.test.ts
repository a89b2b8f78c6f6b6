import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { outlineFromPolyline, outlineSelfIntersectionsByGrid, type Vec } from '../kernel';
import { chainSelfIntersection } from './chain-self-intersection';
import { straightCoords, straightSelfIntersection } from './fast-checks';

/**
 * The monotone-chain self-crossing search is checked against the kernel's general search
 * (outlineSelfIntersectionsByGrid, a box grid with exact segment tests) on random outlines, including
 * outlines snapped to a coarse grid so that they have flat runs, collinear overlaps and touching
 * vertices.
 */

function radialPolygon(n: number, wobble: number, lobes: number, spike: number): Vec[] {
	const pts: Vec[] = [];
	for (let i = 0; i < n; i++) {
		const a = (2 * Math.PI * i) / n;
		const r = 100 * (1 + wobble * Math.sin(lobes * a)) + (i === Math.floor(n / 3) ? spike : 0);
		pts.push({ x: r * Math.cos(a), y: r * Math.sin(a) });
	}
	return pts;
}

/** Points snapped to a grid of `step` mm, repeated points dropped. */
function snapped(pts: readonly Vec[], step: number): Vec[] {
	const out: Vec[] = [];
	for (const p of pts) {
		const q = { x: Math.round(p.x / step) * step, y: Math.round(p.y / step) * step };
		const last = out[out.length - 1];
		if (!last || last.x !== q.x || last.y !== q.y) out.push(q);
	}
	while (out.length > 1 && out[0].x === out[out.length - 1].x && out[0].y === out[out.length - 1].y) out.pop();
	return out;
}

describe('monotone-chain self-crossing search', () => {
	it('agrees with the kernel on random smooth outlines, crossing or not', () => {
		fc.assert(
			fc.property(fc.integer({ min: 50, max: 600 }), fc.double({ min: 0, max: 0.7, noNaN: true }), fc.integer({ min: 1, max: 9 }), fc.double({ min: 0, max: 250, noNaN: true }), (n, wobble, lobes, spike) => {
				const o = outlineFromPolyline(radialPolygon(n, wobble, lobes, spike));
				expect(straightSelfIntersection(o).length > 0).toBe(outlineSelfIntersectionsByGrid(o).length > 0);
			}),
			{ numRuns: 80, seed: 11 }
		);
	});

	it('agrees with the kernel on outlines snapped to a coarse grid (flat runs, overlaps, touching corners)', () => {
		fc.assert(
			fc.property(fc.integer({ min: 40, max: 300 }), fc.double({ min: 0, max: 0.7, noNaN: true }), fc.integer({ min: 1, max: 7 }), fc.constantFrom(2, 5, 10, 20), (n, wobble, lobes, step) => {
				const pts = snapped(radialPolygon(n, wobble, lobes, 0), step);
				fc.pre(pts.length >= 4);
				const o = outlineFromPolyline(pts);
				expect(straightSelfIntersection(o).length > 0).toBe(outlineSelfIntersectionsByGrid(o).length > 0);
			}),
			{ numRuns: 120, seed: 5 }
		);
	});

	it('agrees with the kernel on random polygons on a small integer grid (mostly crossing, many collinear and touching)', () => {
		const vertex = fc.record({ x: fc.integer({ min: 0, max: 12 }), y: fc.integer({ min: 0, max: 12 }) });
		fc.assert(
			fc.property(fc.array(vertex, { minLength: 4, maxLength: 40 }), (raw) => {
				const pts = snapped(raw.map((p) => ({ x: p.x * 5, y: p.y * 5 })), 5);
				fc.pre(pts.length >= 4);
				const o = outlineFromPolyline(pts);
				expect(straightSelfIntersection(o).length > 0).toBe(outlineSelfIntersectionsByGrid(o).length > 0);
			}),
			{ numRuns: 400, seed: 3 }
		);
	});

	it('agrees with the kernel on simple polygons made by sorting random points around their centre', () => {
		const vertex = fc.record({ x: fc.integer({ min: -40, max: 40 }), y: fc.integer({ min: -40, max: 40 }) });
		fc.assert(
			fc.property(fc.uniqueArray(vertex, { minLength: 5, maxLength: 60, selector: (p) => `${p.x},${p.y}` }), (raw) => {
				const pts = raw.filter((p) => p.x !== 0 || p.y !== 0).sort((p, q) => Math.atan2(p.y, p.x) - Math.atan2(q.y, q.x) || Math.hypot(p.x, p.y) - Math.hypot(q.x, q.y));
				fc.pre(pts.length >= 4);
				const o = outlineFromPolyline(pts);
				expect(straightSelfIntersection(o).length > 0).toBe(outlineSelfIntersectionsByGrid(o).length > 0);
			}),
			{ numRuns: 300, seed: 9 }
		);
	});

	it('finds two corners of a stepped outline that touch', () => {
		// two squares meeting corner to corner at (10, 10), travelled as one outline
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 10, y: 0 },
			{ x: 10, y: 10 },
			{ x: 20, y: 10 },
			{ x: 20, y: 20 },
			{ x: 10, y: 20 },
			{ x: 10, y: 10 },
			{ x: 0, y: 10 }
		]);
		expect(chainSelfIntersection(straightCoords(o)!)?.some((p) => Math.hypot(p.x - 10, p.y - 10) < 1e-9)).toBe(true);
	});

	it('finds a flat run that doubles back over an earlier one', () => {
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 30, y: 0 },
			{ x: 30, y: 10 },
			{ x: 20, y: 10 },
			{ x: 20, y: 0 },
			{ x: 10, y: 0 },
			{ x: 10, y: -10 },
			{ x: 0, y: -10 }
		]);
		expect(straightSelfIntersection(o).length).toBeGreaterThan(0);
		expect(outlineSelfIntersectionsByGrid(o).length).toBeGreaterThan(0);
	});

	it('finds a zero-width spike (a segment turning straight back)', () => {
		const o = outlineFromPolyline([
			{ x: 0, y: 0 },
			{ x: 40, y: 0 },
			{ x: 40, y: 40 },
			{ x: 20, y: 40 },
			{ x: 20, y: 60 },
			{ x: 20, y: 50 },
			{ x: 0, y: 40 }
		]);
		expect(straightSelfIntersection(o).length).toBeGreaterThan(0);
		expect(outlineSelfIntersectionsByGrid(o).length).toBeGreaterThan(0);
	});

	it('leaves outlines with very many chains to the grid search, which still finds a crossing', () => {
		// a star of 300 teeth (direction turns at every tooth, in x and in y), one tip pulled across the middle
		const pts: Vec[] = [];
		for (let i = 0; i < 600; i++) {
			const a = (2 * Math.PI * i) / 600;
			const r = i % 2 === 0 ? 100 : 80;
			pts.push({ x: r * Math.cos(a), y: r * Math.sin(a) });
		}
		pts[0] = { x: -150, y: 1 };
		const o = outlineFromPolyline(pts);
		expect(chainSelfIntersection(straightCoords(o)!)).toBeNull();
		expect(straightSelfIntersection(o).length).toBeGreaterThan(0);
	});

	it('takes the axis with fewer chains: a comb whose teeth turn in y but run on in x', () => {
		const pts: Vec[] = [];
		for (let i = 0; i < 400; i++) pts.push({ x: i * 2, y: 0 }, { x: i * 2 + 1, y: 30 });
		pts.push({ x: 800, y: 40 }, { x: -5, y: 40 }, { x: 1.5, y: -5 });
		const o = outlineFromPolyline(pts);
		const found = chainSelfIntersection(straightCoords(o)!);
		expect(found).not.toBeNull();
		expect(found!.length > 0).toBe(outlineSelfIntersectionsByGrid(o).length > 0);
		expect(found!.length).toBeGreaterThan(0);
	});
});
