import { describe, expect, it } from 'vitest';
import ClipperLib from 'clipper-lib';
import Flatten from '@flatten-js/core';
import { outlineFlatten, pathNearestPoint, polygonSignedArea, type Vec } from '../kernel';
import { allowance } from './allowance';
import { allowanceEdges } from './allowance-edges';
import { CLIPPER_SCALE, fromClipper, toClipper } from './clipper-tools';
import { curvedTopPiece, manyVertexPiece, rectanglePiece } from './fixtures/simple-pieces';

/** Distance of a point to the exact stitching line of one edge (kernel) */
const edgeDistance = (edges: ReturnType<typeof allowanceEdges>, i: number, p: Vec) => pathNearestPoint(edges[i].path, p).distance;

describe('allowance', () => {
	it('puts every cut-line point at its edge width from the stitching line within 0.01 mm (kernel and @flatten-js/core distances); fold gets none', () => {
		// widths: reference-values.md row 21 (S): 15 mm domestic, 10 mm common, 6 mm on tight curves; fold 0
		const piece = { ...curvedTopPiece('front'), foldLine: { from: { x: 0, y: 300 }, to: { x: 0, y: 0 } } };
		const edges = allowanceEdges(piece);
		expect(edges.map((e) => e.isFold)).toEqual([false, false, false, true]);
		const widths = { 0: 6, 1: 15, 2: 10 };
		const r = allowance(piece, { widthsMm: widths, corners: { 1: 'mitre', 2: 'square' } });
		if (!r.ok) throw new Error(r.error.message);
		const w = [6, 15, 10, 0];
		const corners = edges.map((e) => e.path.segments[0].p0);
		const fine = outlineFlatten(piece.outline, 0.0005);
		const flat = new Flatten.Polygon(fine.map((v) => [v.x, v.y] as [number, number]));
		let checked = 0;
		for (const p of r.cutLine) {
			const d = edges.map((_, i) => edgeDistance(edges, i, p));
			const nearest = d.indexOf(Math.min(...d));
			// corner region: the nearest stitching point is a corner itself (mitre / squared fill)
			const foot = pathNearestPoint(edges[nearest].path, p).point;
			const nearCorner = corners.some((c) => Math.hypot(c.x - foot.x, c.y - foot.y) < 1e-6);
			if (nearCorner) expect(Math.min(...d)).toBeGreaterThanOrEqual(-0.01);
			// flatten-js distance from the point to the (finely flattened) stitching line agrees with the kernel
			const [fd] = flat.distanceTo(new Flatten.Point(p.x, p.y));
			expect(Math.abs(fd - Math.min(...d))).toBeLessThan(0.001);
			if (nearCorner) continue;
			expect(Math.abs(d[nearest] - w[nearest])).toBeLessThanOrEqual(0.01);
			checked++;
		}
		expect(checked).toBeGreaterThan(20);
		// the fold edge gets none: no cut-line point beyond x = 0, and the fold line is part of the cut line
		expect(Math.min(...r.cutLine.map((p) => p.x))).toBeGreaterThan(-1e-3);
		expect(r.cutLine.filter((p) => Math.abs(p.x) < 1e-3).length).toBeGreaterThanOrEqual(2);
		// squared corner at (200,300): two cut-line vertices on the line across the bisector at 15 mm
		const across = r.cutLine.filter((p) => Math.abs(((p.x - 200) + (p.y - 300)) / Math.SQRT2 - 15) < 0.01);
		expect(across.length).toBeGreaterThanOrEqual(2);
	});

	it('matches clipper-lib’s own mitred offset of the whole outline for a uniform 10 mm allowance', () => {
		const piece = rectanglePiece('back', 180, 260);
		const r = allowance(piece, { defaultWidthMm: 10 });
		if (!r.ok) throw new Error(r.error.message);
		const co = new ClipperLib.ClipperOffset(4, 2);
		co.AddPath(toClipper(outlineFlatten(piece.outline)), ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etClosedPolygon);
		const out = ([] as ClipperLib.Paths);
		co.Execute(out, 10 * CLIPPER_SCALE);
		const ref = fromClipper(out[0]);
		expect(Math.abs(Math.abs(polygonSignedArea(r.cutLine)) - Math.abs(polygonSignedArea(ref)))).toBeLessThan(0.01);
		expect(Math.abs(polygonSignedArea(r.cutLine))).toBeCloseTo(200 * 280, 2);
	});

	it('offsets a smooth piece with no corners in one go, every point at 10 mm within 0.01 mm', () => {
		const piece = manyVertexPiece('oval', 400);
		const r = allowance(piece);
		if (!r.ok) throw new Error(r.error.message);
		for (const p of r.cutLine) {
			const d = pathNearestPoint(piece.outline, p).distance;
			expect(Math.abs(d - 10)).toBeLessThanOrEqual(0.01);
		}
	});

	it('refuses a negative or absurd width', () => {
		const r = allowance(rectanglePiece(), { widthsMm: { 0: -3 } });
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.error.code).toBe('invalid_params');
			expect(r.error.message).toMatch(/between 0 and 100 mm/);
		}
	});
});
