import { describe, expect, it } from 'vitest';
import { lineSegment, outlineArea, outlineFromPolyline, outlineMirrorAcross, pathLength } from '../kernel';
import { pieceStructureProblems } from '../piece';
import { chainsDeviation } from './chain-tools';
import { curvedTopPiece, pieceOf, rectanglePiece } from './fixtures/simple-pieces';
import { fold, unfold } from './fold';
import { grain } from './grain';
import { notch } from './notch';
import { styleLine } from './style-line';

describe('notch', () => {
	it('snaps onto the stitching line; refuses a point off it and a corner', () => {
		const p = rectanglePiece();
		const ok = notch(p, { id: 'n', at: { x: 200.4, y: 120 }, count: 2 });
		if (!ok.ok) throw new Error(ok.error.message);
		expect(ok.piece.notches[0]).toEqual({ id: 'n', at: { x: 200, y: 120 }, count: 2 });
		const off = notch(p, { id: 'n', at: { x: 150, y: 120 } });
		expect(off.ok).toBe(false);
		if (!off.ok) expect(off.error.code).toBe('point_off_outline');
		const corner = notch(p, { id: 'n', at: { x: 200, y: 0 } });
		expect(corner.ok).toBe(false);
		if (!corner.ok) expect(corner.error.message).toMatch(/corner/);
	});
});

describe('grain (reference-values row 27, C: lengthwise ∥ centre line, crosswise ⟂, bias 45°)', () => {
	it('places lengthwise, crosswise and bias grainlines against the centre line', () => {
		const p = { ...rectanglePiece(), foldLine: { from: { x: 0, y: 300 }, to: { x: 0, y: 0 } } };
		const angle = (g: { from: { x: number; y: number }; to: { x: number; y: number } }) => Math.atan2(g.to.y - g.from.y, g.to.x - g.from.x);
		const centre = Math.atan2(-300, 0);
		for (const [direction, want] of [['lengthwise', 0], ['crosswise', Math.PI / 2], ['bias', Math.PI / 4]] as const) {
			const r = grain(p, { through: { x: 100, y: 150 }, lengthMm: 120, direction, arrowheads: 'one' });
			if (!r.ok) throw new Error(r.error.message);
			expect(Math.abs(Math.sin(angle(r.piece.grainline!) - centre - want))).toBeLessThan(1e-12);
			expect(r.piece.grainline!.arrowheads).toBe('one');
		}
	});
	it('refuses a grainline that runs off the piece', () => {
		const r = grain(rectanglePiece(), { through: { x: 100, y: 150 }, lengthMm: 400 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.error.code).toBe('point_outside_piece');
	});
});

describe('fold and unfold (trade-primer §8)', () => {
	it('refuses to fold on a curved edge', () => {
		const r = fold(curvedTopPiece(), { from: { x: 0, y: 0 }, to: { x: 200, y: 0 } });
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.error.code).toBe('fold_edge_curved');
			expect(r.error.message).toMatch(/straight/);
		}
	});

	it('unfolds across the fold: mirrored outline and markings, twice the area, cut single', () => {
		const base = pieceOf('bodice', outlineFromPolyline([{ x: 0, y: 0 }, { x: 150, y: 0 }, { x: 180, y: 300 }, { x: 110, y: 300 }, { x: 100, y: 200 }, { x: 90, y: 300 }, { x: 0, y: 300 }]), {
			apexes: [{ id: 'bp', kind: 'bust_point', label: 'BP', point: { x: 100, y: 200 } }],
			darts: [{ id: 'waist', apexId: 'bp', leg1End: { x: 110, y: 300 }, leg2End: { x: 90, y: 300 }, movingLeg: 'leg2' }],
			notches: [{ id: 'cf', at: { x: 0, y: 150 }, count: 1 }, { id: 'side', at: { x: 165, y: 150 }, count: 1 }],
			cut: 'pair'
		});
		const folded = fold(base, { from: { x: 0, y: 300 }, to: { x: 0, y: 0 } });
		if (!folded.ok) throw new Error(folded.error.message);
		expect(folded.piece.cut).toBe('on_fold');
		const r = unfold(folded.piece);
		if (!r.ok) throw new Error(r.error.message);
		const u = r.piece;
		expect(u.cut).toBe('single');
		expect(u.foldLine).toBeNull();
		expect(outlineArea(u.outline)).toBeCloseTo(2 * outlineArea(base.outline), 9);
		// symmetric: the mirror image of the outline is the outline
		expect(chainsDeviation(outlineMirrorAcross(u.outline, { x: 0, y: 0 }, { x: 0, y: 1 }), u.outline)).toBeLessThan(1e-9);
		expect(u.darts.map((d) => d.id)).toEqual(['waist', 'waist-mirror']);
		expect(pieceStructureProblems(u)).toEqual([]);
		expect(u.notches.map((n) => n.id).sort()).toEqual(['cf', 'side', 'side-mirror']); // nothing doubled on the fold
	});

	it('refuses to unfold a piece without a fold', () => {
		const r = unfold(rectanglePiece());
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.error.code).toBe('no_fold');
	});
});

describe('style_line', () => {
	it('snaps ends within 2 mm onto the outline and stores an internal line; refuses ends further off', () => {
		const p = rectanglePiece();
		const ok = styleLine(p, { id: 'yoke', path: { segments: [lineSegment({ x: 1.5, y: 80 }, { x: 199, y: 90 })] } });
		if (!ok.ok) throw new Error(ok.error.message);
		const line = ok.piece.internalLines[0];
		expect(line.path.segments[0].p0.x).toBe(0);
		expect(line.path.segments[0].p0.y).toBeCloseTo(80, 9);
		expect(pathLength(line.path)).toBeGreaterThan(199);
		const far = styleLine(p, { id: 'yoke', path: { segments: [lineSegment({ x: 5, y: 80 }, { x: 200, y: 90 })] } });
		expect(far.ok).toBe(false);
		if (!far.ok) expect(far.error.code).toBe('style_line_off_outline');
	});
});
