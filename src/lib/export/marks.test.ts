import { describe, expect, it } from 'vitest';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import type { DrawItem, DrawPath } from './drawing';
import { dartPressArrows, NOTCH_DEPTH_MM, NOTCH_SPACING_MM, notchSlits } from './marks';
import { rectPiece } from './test-support/rect-piece';

const paths = (items: DrawItem[]) => items.filter((i): i is DrawPath => i.kind === 'path');
const ends = (p: DrawPath) => [p.segments[0].p0, p.segments[p.segments.length - 1].kind === 'line' ? (p.segments[p.segments.length - 1] as { p1: { x: number; y: number } }).p1 : p.segments[0].p0];

describe('notch slits on printed pieces', () => {
	// common practice (trade-primer §7): notches are snipped square to the seam, shallower than the allowance
	it('cuts a single notch on a net pattern as one slit square to the edge, running into the piece', () => {
		const piece = { ...rectPiece({ name: 'band', w: 200, h: 100, cut: 'pair' }), notches: [{ id: 'n1', at: { x: 200, y: 40 }, count: 1 }] } as Piece;
		const [slit] = paths(notchSlits(piece, piece.outline));
		const [a, b] = ends(slit);
		expect(a.x).toBeCloseTo(200, 9);
		expect(a.y).toBeCloseTo(40, 9);
		expect(b.x).toBeCloseTo(200 - NOTCH_DEPTH_MM, 9); // inward, square to the right-hand edge
		expect(b.y).toBeCloseTo(40, 9);
	});

	it('cuts in from the cut line toward the stitching line when the allowance is shown, and no deeper than the allowance', () => {
		const piece = { ...rectPiece({ name: 'band', w: 200, h: 100, cut: 'pair', allowanceMm: 6 }), notches: [{ id: 'n1', at: { x: 80, y: 0 }, count: 1 }] } as Piece;
		const [slit] = paths(notchSlits(piece, piece.outline));
		const [a, b] = ends(slit);
		expect(a.y).toBeCloseTo(-6, 9); // on the cut line above the top edge
		expect(b.y).toBeGreaterThan(-6);
		expect(b.y).toBeLessThan(0); // stops inside the allowance
		expect(a.x).toBeCloseTo(80, 9);
		expect(b.x).toBeCloseTo(80, 9);
	});

	it('draws a double notch as two parallel slits spaced along the seam', () => {
		const piece = { ...rectPiece({ name: 'back', w: 200, h: 100, cut: 'pair' }), notches: [{ id: 'n2', at: { x: 100, y: 100 }, count: 2 }] } as Piece;
		const slits = paths(notchSlits(piece, piece.outline));
		expect(slits).toHaveLength(2);
		const xs = slits.map((s) => ends(s)[0].x).sort((p, q) => p - q);
		expect(xs[1] - xs[0]).toBeCloseTo(NOTCH_SPACING_MM, 9);
		for (const s of slits) expect(ends(s)[1].y).toBeCloseTo(100 - NOTCH_DEPTH_MM, 9);
	});
});

describe('dart pressing direction on printed pieces', () => {
	const dartPiece = (pressToward?: 'leg1' | 'leg2'): Piece =>
		pieceSchema.parse({
			...rectPiece({ name: 'front', w: 200, h: 300, cut: 'pair' }),
			apexes: [{ id: 'bp', kind: 'bust_point', point: { x: 100, y: 100 } }],
			darts: [{ id: 'waist', apexId: 'bp', leg1End: { x: 90, y: 300 }, leg2End: { x: 110, y: 300 }, ...(pressToward ? { pressToward } : {}) }]
		});

	it('points an arrow across the dart toward the leg it is pressed to', () => {
		for (const side of ['leg1', 'leg2'] as const) {
			const [shaft] = paths(dartPressArrows(dartPiece(side)));
			const [from, to] = ends(shaft);
			expect(Math.sign(to.x - from.x)).toBe(side === 'leg1' ? -1 : 1);
		}
	});

	it('draws no arrow where the piece does not say how the dart is pressed', () => {
		expect(dartPressArrows(dartPiece())).toEqual([]);
	});
});
