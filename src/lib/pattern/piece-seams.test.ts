import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { blockDraft, underStructureDraft } from './drafting';
import { frontBodiceBlock } from './fixtures/front-bodice-block';
import { randomBlockArbitrary } from './fixtures/random-block';
import { segmentLength, vecDistance } from './kernel';
import { wedgeLegSegments } from './operations/open-wedges';
import { pivot } from './operations/pivot';
import { pieceSeams, seamLocate, seamPointAt } from './piece-seams';
import type { Piece } from './piece-schema';

/** Seams of a piece: every stretch of stitching line in exactly one named seam, darts and pleats folded out. */
function seamsCoverTheOutline(piece: Piece) {
	const seams = pieceSeams(piece);
	const legs = wedgeLegSegments(piece);
	const body = piece.outline.segments.map((_, i) => i).filter((i) => !legs.has(i));
	expect(seams.flatMap((s) => s.segmentIndices).sort((a, b) => a - b)).toEqual(body);
	expect(new Set(seams.map((s) => s.name)).size).toBe(seams.length);
	const sewn = body.reduce((sum, i) => sum + segmentLength(piece.outline.segments[i]), 0);
	expect(seams.reduce((sum, s) => sum + s.lengthMm, 0)).toBeCloseTo(sewn, 6);
	return seams;
}

describe('the seams of a piece, named by where they run', () => {
	it('names the drafted front, back and under-structure panels, each stretch in one seam', () => {
		const mm = { bust: 880, waist: 700, hip: 960 };
		for (const bustDart of ['shoulder', 'side'] as const) {
			const b = blockDraft(mm, { bustMm: 50, waistMm: 30 }, { bustDart, frontCut: 'on_fold', backCut: 'pair' });
			expect(seamsCoverTheOutline(b.front).map((s) => s.name)).toEqual(['shoulder', 'armhole', 'side seam', 'waist', 'fold (centre front)', 'neckline']);
			expect(seamsCoverTheOutline(b.back).map((s) => s.name)).toEqual(['shoulder', 'armhole', 'side seam', 'waist', 'centre back', 'neckline']);
		}
		for (const panels of [4, 6] as const) for (const p of underStructureDraft(mm, { bustMm: 50, waistMm: 30 }, { panels }).panels) seamsCoverTheOutline(p);
	});

	it('keeps naming the seams after a pivot moves the dart into the armhole', () => {
		const block = frontBodiceBlock();
		const arm = pieceSeams(block).find((s) => s.name === 'armhole')!;
		const at = seamPointAt(block, arm, 'start', arm.lengthMm / 2);
		if (!at.ok) throw new Error(at.message);
		const r = pivot(block, { dartId: 'shoulder-dart', to: at.point });
		if (!r.ok) throw new Error(r.error.message);
		const names = seamsCoverTheOutline(r.piece).map((s) => s.name);
		expect(names).toContain('armhole');
		expect(names).toContain('fold (centre front)');
	});

	it('property: on random blocks the seams cover the stitching line once, and a point is found again on its seam', () => {
		fc.assert(
			fc.property(randomBlockArbitrary(), fc.double({ min: 0, max: 1, noNaN: true }), (blk, f) => {
				const seams = seamsCoverTheOutline(blk.piece);
				const s = seams[0];
				const p = seamPointAt(blk.piece, s, 'start', f * s.lengthMm);
				if (!p.ok) return false;
				// found again (at a corner it may be the end of the seam before: the same point)
				const back = seamLocate(blk.piece, seams, p.point);
				if (!back) return false;
				const again = seamPointAt(blk.piece, seams[back.seamIndex], 'start', back.fromStartMm);
				return again.ok && vecDistance(again.point, p.point) < 1e-6;
			}),
			{ numRuns: 60 }
		);
	});
});
