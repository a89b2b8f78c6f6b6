import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import ClipperLib from 'clipper-lib';
import Flatten from '@flatten-js/core';
import {
	cubicSegment,
	lineSegment,
	outlineArea,
	outlineFlatten,
	outlinePointAtLength,
	outlinePerimeter,
	type Outline,
	type Segment,
	type Vec
} from '../kernel';
import { separate } from './separate';
import { join } from './join';
import { chainsDeviation } from './chain-tools';
import { curvedTopPiece, pieceOf, rectanglePiece } from './fixtures/simple-pieces';
import { CLIPPER_SCALE } from './clipper-tools';

/** Random convex-ish piece: n vertices round a centre, radii 85–100 % of R, some edges bulging cubics. */
const pieceArb = fc
	.record({
		n: fc.integer({ min: 4, max: 10 }),
		radii: fc.array(fc.double({ min: 0.85, max: 1, noNaN: true }), { minLength: 10, maxLength: 10 }),
		jitter: fc.array(fc.double({ min: -0.25, max: 0.25, noNaN: true }), { minLength: 10, maxLength: 10 }),
		bulges: fc.array(fc.double({ min: 0, max: 0.12, noNaN: true }), { minLength: 10, maxLength: 10 }),
		curved: fc.array(fc.boolean(), { minLength: 10, maxLength: 10 })
	})
	.map(({ n, radii, jitter, bulges, curved }) => {
		const R = 150;
		const pts: Vec[] = [];
		for (let i = 0; i < n; i++) {
			const a = ((i + jitter[i]) * 2 * Math.PI) / n;
			pts.push({ x: 200 + R * radii[i] * Math.cos(a), y: 200 + R * radii[i] * Math.sin(a) });
		}
		const segs: Segment[] = pts.map((p, i) => {
			const q = pts[(i + 1) % n];
			if (!curved[i]) return lineSegment(p, q);
			// bulge outward (away from the centre) by a fraction of the chord
			const d = { x: q.x - p.x, y: q.y - p.y };
			const len = Math.hypot(d.x, d.y);
			let nx = d.y / len;
			let ny = -d.x / len;
			const mid = { x: (p.x + q.x) / 2 - 200, y: (p.y + q.y) / 2 - 200 };
			if (nx * mid.x + ny * mid.y < 0) [nx, ny] = [-nx, -ny];
			const b = bulges[i] * len;
			return cubicSegment(p, { x: p.x + d.x / 3 + nx * b, y: p.y + d.y / 3 + ny * b }, { x: p.x + (2 * d.x) / 3 + nx * b, y: p.y + (2 * d.y) / 3 + ny * b }, q);
		});
		return pieceOf('rnd', { segments: segs }, { grainline: { from: { x: 200, y: 150 }, to: { x: 200, y: 250 }, arrowheads: 'both' } });
	});

const lineArb = fc.record({
	u0: fc.double({ min: 0, max: 1, noNaN: true, maxExcluded: true }),
	du: fc.double({ min: 0.2, max: 0.8, noNaN: true }),
	curved: fc.boolean(),
	bend: fc.double({ min: -0.15, max: 0.15, noNaN: true })
});

function styleLineFor(outline: Outline, l: { u0: number; du: number; curved: boolean; bend: number }): Segment {
	const P = outlinePerimeter(outline);
	const a = outlinePointAtLength(outline, l.u0 * P).point;
	const b = outlinePointAtLength(outline, ((l.u0 + l.du) % 1) * P).point;
	if (!l.curved) return lineSegment(a, b);
	const d = { x: b.x - a.x, y: b.y - a.y };
	const n = { x: -d.y * l.bend, y: d.x * l.bend };
	return cubicSegment(a, { x: a.x + d.x / 3 + n.x, y: a.y + d.y / 3 + n.y }, { x: a.x + (2 * d.x) / 3 + n.x, y: a.y + (2 * d.y) / 3 + n.y }, b);
}

describe('separate then join', () => {
	it('returns the original area and outline (fast-check property, random convex-ish pieces, straight and curved style lines)', () => {
		let joined = 0;
		let refused = 0;
		fc.assert(
			fc.property(pieceArb, lineArb, (piece, l) => {
				const seg = styleLineFor(piece.outline, l);
				const s = separate(piece, { path: { segments: [seg] } });
				if (!s.ok) {
					// a curved line may leave a convex-ish piece near its ends: that must be a clear refusal
					// (a cut grazing the outline that would touch it again is refused as a broken result)
					expect(['style_line_leaves_piece', 'style_line_off_outline', 'style_line_too_short', 'result_broken']).toContain(s.error.code);
					expect(s.error.message.length).toBeGreaterThan(10);
					refused++;
					return;
				}
				const [a, b] = s.pieces;
				const areaBefore = outlineArea(piece.outline);
				expect(outlineArea(a.outline) + outlineArea(b.outline)).toBeCloseTo(areaBefore, 6);
				const j = join(s.pieces, s.seamPairs[0]);
				if (!j.ok) throw new Error(`join refused: ${j.error.code}: ${j.error.message}`);
				const back = j.pieces[0];
				expect(Math.abs(outlineArea(back.outline) - areaBefore)).toBeLessThan(1e-6 * areaBefore);
				expect(chainsDeviation(back.outline, piece.outline)).toBeLessThan(1e-3);
				joined++;
			}),
			{ numRuns: 150, seed: 20240611 }
		);
		expect(joined).toBeGreaterThan(100);
		expect(refused).toBeLessThan(50);
	});

	it('keeps markings on their side and gives each part a grainline and a match notch', () => {
		const p = rectanglePiece('front');
		const s = separate(p, { path: { segments: [lineSegment({ x: 0, y: 100 }, { x: 200, y: 100 })] }, pieceIds: ['top', 'bottom'] });
		expect(s.ok).toBe(true);
		if (!s.ok) return;
		const [a, b] = s.pieces;
		// the label at (100,150) is below the line: only in one part
		expect(a.labels.length + b.labels.length).toBe(1);
		for (const q of [a, b]) {
			expect(q.grainline).not.toBeNull();
			expect(q.notches).toHaveLength(1);
		}
		expect(a.notches[0].at).toEqual(b.notches[0].at);
		expect(s.seamPairs[0]).toMatchObject({ a: { pieceId: 'top' }, b: { pieceId: 'bottom' }, allowedEaseMm: 0 });
	});

	it('refuses a style line that ends off the outline, and one that leaves the piece', () => {
		const p = curvedTopPiece();
		const off = separate(p, { path: { segments: [lineSegment({ x: 10, y: 100 }, { x: 200, y: 100 })] } });
		expect(off.ok).toBe(false);
		if (!off.ok) expect(off.error.code).toBe('style_line_off_outline');
		const out = separate(p, {
			path: { segments: [cubicSegment({ x: 0, y: 100 }, { x: 100, y: 500 }, { x: 150, y: 500 }, { x: 200, y: 100 })] }
		});
		expect(out.ok).toBe(false);
		if (!out.ok) expect(out.error.code).toBe('style_line_leaves_piece');
	});

	it('refuses to join edges that are further apart than 0.05 mm, and snaps those within it', () => {
		const p = rectanglePiece('front');
		const s = separate(p, { path: { segments: [lineSegment({ x: 0, y: 100 }, { x: 200, y: 100 })] } });
		if (!s.ok) throw new Error(s.error.message);
		const pair = s.seamPairs[0];
		const shift = (dy: number) => {
			const b = s.pieces[1];
			const moved = { ...b, outline: { segments: b.outline.segments.map((g) => ({ ...g, p0: { x: g.p0.x, y: g.p0.y + dy }, p1: { x: (g as { p1: Vec }).p1.x, y: (g as { p1: Vec }).p1.y + dy } })) } } as typeof b;
			const edge = { segments: [lineSegment({ x: 0, y: 100 + dy }, { x: 200, y: 100 + dy })] };
			return join([s.pieces[0], moved], { ...pair, b: { pieceId: b.id, edge } });
		};
		const near = shift(0.03);
		expect(near.ok).toBe(true);
		const far = shift(0.2);
		expect(far.ok).toBe(false);
		if (!far.ok) {
			expect(far.error.code).toBe('seam_gap_too_wide');
			expect(far.error.message).toMatch(/0\.05 mm/);
		}
	});

	it('agrees with clipper-lib (union at µm scale after inserting T-junction vertices) and @flatten-js/core areas', () => {
		const p = curvedTopPiece();
		const s = separate(p, { path: { segments: [lineSegment({ x: 0, y: 120 }, { x: 200, y: 180 })] } });
		if (!s.ok) throw new Error(s.error.message);
		const j = join(s.pieces, s.seamPairs[0]);
		if (!j.ok) throw new Error(j.error.message);
		// clipper-lib reference: union of the two flattened parts, T-junction vertices inserted first
		const polys = s.pieces.map((q) => outlineFlatten(q.outline, 0.01));
		const withT = polys.map((poly, i) => insertTJunctions(poly, polys[1 - i]));
		const c = new ClipperLib.Clipper();
		for (const poly of withT) c.AddPath(poly.map((v) => ({ X: Math.round(v.x * CLIPPER_SCALE), Y: Math.round(v.y * CLIPPER_SCALE) })), ClipperLib.PolyType.ptSubject, true);
		const out = ([] as ClipperLib.Paths);
		c.Execute(ClipperLib.ClipType.ctUnion, out, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
		expect(out.length).toBe(1); // one ring: no sliver holes
		const clipperArea = Math.abs(ClipperLib.Clipper.Area(out[0])) / CLIPPER_SCALE ** 2;
		const flat = new Flatten.Polygon(outlineFlatten(j.pieces[0].outline, 0.01).map((v) => [v.x, v.y] as [number, number]));
		expect(Math.abs(flat.area() - clipperArea)).toBeLessThan(0.01);
		expect(Math.abs(outlineArea(j.pieces[0].outline) - outlineArea(p.outline))).toBeLessThan(1e-6);
	});
});

/** Insert into `poly` every vertex of `other` that lies on one of its edges (T-junctions). */
function insertTJunctions(poly: Vec[], other: Vec[]): Vec[] {
	const out: Vec[] = [];
	for (let i = 0; i < poly.length; i++) {
		const a = poly[i];
		const b = poly[(i + 1) % poly.length];
		out.push(a);
		const dx = b.x - a.x;
		const dy = b.y - a.y;
		const l2 = dx * dx + dy * dy;
		const on = other
			.map((p) => ({ p, t: ((p.x - a.x) * dx + (p.y - a.y) * dy) / l2 }))
			.filter(({ p, t }) => t > 1e-9 && t < 1 - 1e-9 && Math.abs((p.x - a.x) * dy - (p.y - a.y) * dx) / Math.sqrt(l2) < 1e-6)
			.sort((u, v) => u.t - v.t);
		for (const { p } of on) out.push(p);
	}
	return out;
}
