import { describe, expect, it } from 'vitest';
import { outlineProblems, outlineSelfIntersections, outlineSelfIntersectionsBetweenParts, type Vec } from '../kernel';
import type { OperationResult } from '../operation-result';
import { pieceFromInput } from '../piece';
import type { Piece } from '../piece-schema';
import { recipeStepApply } from '../recipe/registry';
import { versionVerify, type RecipeStepData } from '../verify/version-verify';
import { pivot } from './pivot';
import { openWedgesKeepingStill } from './still-side';

/**
 * A pivot checks its result only for crossings between the side it turned and the side that stayed
 * (each is clean on its own, as the input was), plus the new dart legs. A turned side that swings over
 * the still side must still be found, by the operation and by the server's save.
 *
 * The piece: apex P at the origin, a narrow dart opening upward (legs to L1 = (−10, −100) and
 * L2 = (10, −100)). The still side hooks over the top of the moving side, 10 mm above its top edge;
 * closing the dart turns the moving side 11.4° about P, and its top edge rises through that hook (the
 * edge's first segment changes where the closed dart's legs meet; its second is turned whole).
 */
const P: Vec = { x: 0, y: 0 };
const L1: Vec = { x: -10, y: -100 };
const L2: Vec = { x: 10, y: -100 };
const S: Vec = { x: 100, y: 0 };

function hookedPiece(): Piece {
	const pts: Vec[] = [L2, { x: 50, y: -100 }, { x: 100, y: -100 }, { x: 100, y: 50 }, { x: -100, y: 50 }, { x: -100, y: -200 }, { x: 60, y: -200 }, { x: 60, y: -110 }, { x: -10, y: -110 }, L1, P];
	return pieceFromInput({
		schemaVersion: 1,
		id: 'hooked',
		name: 'Hooked piece',
		outline: { segments: pts.map((p, i) => ({ kind: 'line' as const, p0: p, p1: pts[(i + 1) % pts.length] })) },
		apexes: [{ id: 'a', kind: 'bust_point', label: '', point: P }],
		darts: [{ id: 'd', apexId: 'a', leg1End: L1, leg2End: L2 }],
		cut: 'pair'
	});
}

describe('pivot whose turned side crosses the still side', () => {
	it('starts from a clean piece', () => {
		expect(outlineProblems(hookedPiece().outline)).toEqual([]);
	});

	it('is refused as a broken result', () => {
		const r = pivot(hookedPiece(), { dartId: 'd', to: S });
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.error.code).toBe('result_broken');
			expect(r.error.message).toContain('crosses itself');
		}
	});

	it('finds the crossing between the turned and the still side, where the full search finds it', () => {
		const piece = hookedPiece();
		const r = openWedgesKeepingStill(piece, piece.darts[0], [{ at: S, angleRad: 2 * Math.atan(0.1) }], 0, () => 'Dart "d"');
		if (!r.ok) throw new Error(r.message);
		const { outline, rigidParts } = r.value;
		const between = outlineSelfIntersectionsBetweenParts(outline, rigidParts);
		expect(between.some((h) => rigidParts[h.segmentIndex] >= 0 && rigidParts[h.otherSegmentIndex] >= 0 && rigidParts[h.segmentIndex] !== rigidParts[h.otherSegmentIndex])).toBe(true);
		expect(between).toEqual(outlineSelfIntersections(outline));
	});

	it('is refused by the server: the crossing geometry as submitted, and the recipe replayed on the base', () => {
		const piece = hookedPiece();
		const r = openWedgesKeepingStill(piece, piece.darts[0], [{ at: S, angleRad: 2 * Math.atan(0.1) }], 0, () => 'Dart "d"');
		if (!r.ok) throw new Error(r.message);
		const o = r.value.openings[0];
		const submitted: Piece = { ...piece, outline: r.value.outline, darts: [{ ...piece.darts[0], leg1End: o.leg1End, leg2End: o.leg2End }] };
		const recipe: RecipeStepData[] = [{ op: 'pivot', params: { dartId: 'd', to: S } }];
		const replay = (p: Piece, step: RecipeStepData): OperationResult => recipeStepApply(p, step);
		const asSubmitted = versionVerify(piece, submitted, recipe, replay);
		expect(asSubmitted.ok).toBe(false);
		if (!asSubmitted.ok) expect(asSubmitted.problem.code).toBe('invalid_geometry');
		// a client that sends the clean base back with the pivot recipe: the replay itself refuses
		const replayed = versionVerify(piece, piece, recipe, replay);
		expect(replayed.ok).toBe(false);
		if (!replayed.ok) expect(replayed.problem.code).toBe('replay_refused');
	});
});
