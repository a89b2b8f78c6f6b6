import { describe, expect, it } from 'vitest';
import ClipperLib from 'clipper-lib';
import Flatten from '@flatten-js/core';
import { outlineFlatten, pathNearestPoint, polygonSignedArea, type Vec } from '../kernel';
import { allowance } from './allowance';
import { allowanceEdges } from './allowance-edges';
import { CLIPPER_SCALE, fromClipper, toClipper } from './clipper-tools';
import { curvedTopPiece, manyVertexPiece, pieceOf, rectanglePiece } from './fixtures/simple-pieces';
import { outlineFromPolyline } from '../kernel';

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

	// Common practice (trade-primer §9): an allowance that is pressed flat before a crossing seam is sewn
	// (a hem turned up, a seam pressed open) has its end cut as the crossing cut line mirrored across its
	// own stitching line, found by folding the paper along the stitching line and cutting along the other
	// cut line. Checked with @flatten-js/core: reflected across the pressed stitching line, the end lies
	// on the crossing edge's cut line (at its width from that stitching line).
	describe('folded (pressed) corners', () => {
		// a flared skirt panel: hem along y = 400 from x = 40 to x = 260, side seams flaring out 40 mm
		const flared = () => pieceOf('flared', outlineFromPolyline([{ x: 80, y: 0 }, { x: 220, y: 0 }, { x: 260, y: 400 }, { x: 40, y: 400 }]));
		const hemWidth = 40;
		const sideWidth = 15;
		const fl = (v: Vec) => new Flatten.Point(v.x, v.y);

		it('turns the hem up flush with a flared side seam: its end mirrors the side cut line across the hem line', () => {
			const piece = flared();
			const edges = allowanceEdges(piece);
			// edge 2 is the hem (260,400) → (40,400); corner 2 starts it (side seam 1 ends there), corner 3 ends it
			const r = allowance(piece, { widthsMm: { 0: 10, 1: sideWidth, 2: hemWidth, 3: sideWidth }, corners: { 2: 'folded_next', 3: 'folded_prev' } });
			if (!r.ok) throw new Error(r.error.message);
			const hemLine = new Flatten.Line(fl(edges[2].path.segments[0].p0), fl({ x: 40, y: 400 }));
			const sides = [edges[1], edges[3]].map((e) => {
				const s = e.path.segments[0] as { p0: Vec; p1: Vec };
				return new Flatten.Segment(fl(s.p0), fl(s.p1));
			});
			// cut-line vertices that end the turned-up hem, beyond the hem's ends
			const ends = r.cutLine.filter((p) => p.y > 400 + 1 && (p.x < 40 || p.x > 260));
			expect(ends.length).toBeGreaterThanOrEqual(2);
			let checked = 0;
			for (const p of ends) {
				// folded up across the hem line (y = 400), the point lies at the side seam allowance from the side seam line
				const up = { x: p.x, y: 800 - p.y };
				const side = p.x < 150 ? sides[1] : sides[0];
				const line = new Flatten.Line(side.start, side.end);
				const [d] = line.distanceTo(fl(up));
				expect(Math.abs(d - sideWidth)).toBeLessThanOrEqual(0.01);
				expect(hemLine.distanceTo(fl(p))[0]).toBeLessThanOrEqual(hemWidth + 0.01);
				checked++;
			}
			expect(checked).toBeGreaterThanOrEqual(2);
			// the hem's end leans in (a flared side seam): at the hem's cut line the allowance is narrower
			// than at the hem line, by hemWidth × tan of the flare (40 mm over 400 mm) on each side
			const bottom = r.cutLine.filter((p) => Math.abs(p.y - (400 + hemWidth)) < 0.01).map((p) => p.x);
			const atHem = r.cutLine.filter((p) => Math.abs(p.y - 400) < 0.01).map((p) => p.x);
			const flare = 40 / 400;
			expect(Math.max(...bottom) - Math.min(...bottom)).toBeCloseTo(Math.max(...atHem) - Math.min(...atHem) - 2 * hemWidth * flare, 2);
		});

		it('gives the plain square end at a right-angled corner', () => {
			const piece = rectanglePiece('r', 200, 300);
			const m = allowance(piece, { defaultWidthMm: 10, defaultCorner: 'mitre' });
			const f = allowance(piece, { defaultWidthMm: 10, defaultCorner: 'folded_next' });
			if (!m.ok || !f.ok) throw new Error('allowance refused');
			// with both widths 10 mm a right angle mitres square; folding gives the same corner
			expect(Math.abs(polygonSignedArea(f.cutLine))).toBeCloseTo(Math.abs(polygonSignedArea(m.cutLine)), 3);
		});

		it('folds either way: the prev and next choices shape opposite edges', () => {
			const piece = flared();
			const widthsMm = { 0: 10, 1: sideWidth, 2: hemWidth, 3: sideWidth };
			const prev = allowance(piece, { widthsMm, corners: { 2: 'folded_prev' } });
			const next = allowance(piece, { widthsMm, corners: { 2: 'folded_next' } });
			if (!prev.ok || !next.ok) throw new Error('allowance refused');
			// side seam pressed (prev): the side band runs on below the hem line to the hem cut line's mirror
			// (wider at the bottom); hem pressed (next): the hem band ends short of the side cut line
			const corner = (cut: readonly Vec[]) => cut.filter((p) => p.x > 255 && p.y > 380);
			const reach = (cut: readonly Vec[]) => Math.max(...corner(cut).map((p) => p.x));
			expect(reach(prev.cutLine)).toBeGreaterThan(reach(next.cutLine) + 1);
		});
	});
});
