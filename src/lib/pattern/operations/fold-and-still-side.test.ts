import { describe, expect, it } from 'vitest';
import { frontBodiceBlock, FRONT_BLOCK_BUST_POINT } from '../fixtures/front-bodice-block';
import { outlineNearestLocation, vecDistance, vecLerp, type Vec } from '../kernel';
import { pieceMetrics } from '../metrics';
import type { Piece } from '../piece-schema';
import { recipeStepApply } from '../recipe/registry';
import { versionVerify } from '../verify/version-verify';
import { pivot } from './pivot';

/**
 * Trade rules for the fold and the still side (trade-primer §8: a place-on-fold edge is straight and the cut
 * piece is the pattern plus its reflection; §1: one side stays put while the other turns about the apex).
 * The demo front has centre front on the fold at x = 0, from the neck (0, 80) to the waist (0, 460).
 */

const onFold: Vec = { x: 0, y: 200 };
const necklinePoint: Vec = { x: 30, y: 76 }; // near the neckline curve, found on the outline below
const sideSeamPoint = vecLerp({ x: 235, y: 230 }, { x: 225, y: 440 }, 0.3);

function onOutline(piece: Piece, p: Vec): Vec {
	return outlineNearestLocation(piece.outline, p).point;
}

const direction = (a: Vec, b: Vec) => Math.atan2(b.y - a.y, b.x - a.x);

describe('no dart, pleat or slash opens on the fold line', () => {
	it('a pivot onto the fold line is refused in the operation, saying it is the fold', () => {
		const r = pivot(frontBodiceBlock(), { dartId: 'waist-dart', to: onFold });
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.error.code).toBe('target_on_fold');
			expect(r.error.message).toMatch(/fold line/);
		}
	});

	it('a share, pleats and a slash on the fold line are refused too (the server replays the same operations)', () => {
		const block = frontBodiceBlock();
		const steps = [
			{ op: 'share', params: { dartId: 'shoulder-dart', parts: [{ to: onFold, fraction: 0.5 }, { to: sideSeamPoint, fraction: 0.5 }] } },
			{ op: 'pleat', params: { dartId: 'waist-dart', at: [onFold, { x: 0, y: 300 }], mode: 'equal_angle' } },
			{ op: 'spread', params: { mode: 'hinged', slashes: [{ from: onFold, to: FRONT_BLOCK_BUST_POINT, angleRad: 0.1 }] } },
			{ op: 'spread', params: { mode: 'hinged', slashes: [{ from: sideSeamPoint, to: onFold, angleRad: 0.1 }] } }
		];
		for (const step of steps) {
			const r = recipeStepApply(block, step);
			expect(r.ok, step.op).toBe(false);
			if (!r.ok) expect(r.error.code, step.op).toBe('target_on_fold');
		}
	});

	it('the server refuses a version whose recipe opens a dart on the fold: its replay is refused', () => {
		const block = frontBodiceBlock();
		// what an older browser would have sent: the whole piece turned so the dart sits on the fold edge
		const step = { op: 'pivot', params: { dartId: 'waist-dart', to: onFold } };
		const v = versionVerify(block, block, [step], recipeStepApply);
		expect(v.ok).toBe(false);
		if (!v.ok) {
			expect(v.problem.code).toBe('replay_refused');
			expect(v.problem.message).toMatch(/on the fold line/);
		}
	});

	it('the fold line’s end corners are not on it: a dart may open at the centre front neck corner', () => {
		const r = pivot(frontBodiceBlock(), { dartId: 'shoulder-dart', to: { x: 0, y: 80 } });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.foldLine).toEqual(frontBodiceBlock().foldLine);
	});
});

describe('pivoting keeps the side that holds the fold line (else the grainline) still', () => {
	it('a pivot into the neckline turns the shoulder side, never the centre front fold', () => {
		const block = frontBodiceBlock();
		const to = onOutline(block, necklinePoint);
		const r = pivot(block, { dartId: 'shoulder-dart', to });
		if (!r.ok) throw new Error(r.error.message);
		// the stored fold line is where it was, and still lies along the outline, straight
		expect(r.piece.foldLine).toEqual(block.foldLine);
		for (const t of [0, 0.25, 0.5, 0.75, 1]) {
			const p = vecLerp(block.foldLine!.from, block.foldLine!.to, t);
			expect(outlineNearestLocation(r.piece.outline, p).distance).toBeLessThan(1e-9);
		}
		// neither the fold nor the grainline is slanted
		expect(r.piece.grainline).toEqual(block.grainline);
		// the shaping is kept (reference-values row 8, C: the dart angle is unchanged wherever it is moved)
		expect(pieceMetrics(r.piece).apexTotals[0].totalAngleRad).toBeCloseTo(pieceMetrics(block).apexTotals[0].totalAngleRad, 12);
		expect(r.report.notes.join(' ')).toMatch(/fold line stayed still/);
	});

	it('without a fold line, the side that holds the grainline stays still', () => {
		const block: Piece = { ...frontBodiceBlock(), foldLine: null, cut: 'pair' };
		const to = onOutline(block, necklinePoint);
		const r = pivot(block, { dartId: 'shoulder-dart', to });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.grainline).toEqual(block.grainline);
		// the centre front edge (x = 0) did not move
		for (const y of [100, 250, 450]) expect(outlineNearestLocation(r.piece.outline, { x: 0, y }).distance).toBeLessThan(1e-9);
	});

	it('without a fold line, the centre front marked by its label stays still, before the grainline', () => {
		const block: Piece = {
			...frontBodiceBlock(),
			foldLine: null,
			cut: 'pair',
			labels: [{ id: 'centre', text: 'CF', at: { x: 8, y: 270 }, angleRad: -Math.PI / 2 }],
			grainline: { from: { x: 180, y: 140 }, to: { x: 180, y: 200 }, arrowheads: 'both' }
		};
		const to = onOutline(block, necklinePoint);
		const r = pivot(block, { dartId: 'shoulder-dart', to });
		if (!r.ok) throw new Error(r.error.message);
		for (const y of [100, 250, 450]) expect(outlineNearestLocation(r.piece.outline, { x: 0, y }).distance).toBeLessThan(1e-9);
		expect(r.report.notes.join(' ')).toMatch(/centre front stayed still/);
		const g0 = block.grainline!;
		const g1 = r.piece.grainline!;
		expect(direction(g1.from, g1.to)).toBeCloseTo(direction(g0.from, g0.to), 12);
	});

	it('a grainline on the turning side moves with it but keeps its direction (parallel to the fold)', () => {
		const block: Piece = { ...frontBodiceBlock(), grainline: { from: { x: 180, y: 140 }, to: { x: 180, y: 200 }, arrowheads: 'both' } };
		const r = pivot(block, { dartId: 'shoulder-dart', to: sideSeamPoint });
		if (!r.ok) throw new Error(r.error.message);
		const g0 = block.grainline!;
		const g1 = r.piece.grainline!;
		expect(direction(g1.from, g1.to)).toBeCloseTo(direction(g0.from, g0.to), 12);
		expect(vecDistance(g1.from, g1.to)).toBeCloseTo(vecDistance(g0.from, g0.to), 9);
		expect(vecDistance(g1.from, g0.from)).toBeGreaterThan(1); // it went with its part
		expect(r.piece.foldLine).toEqual(block.foldLine);
	});

	it('pleats on both sides of the waist dart keep the fold still: the parts either side turn toward each other', () => {
		const block = frontBodiceBlock();
		const d = block.darts.find((x) => x.id === 'waist-dart')!;
		const at = [vecLerp(d.leg1End, { x: 225, y: 440 }, 0.3), vecLerp(d.leg2End, { x: 0, y: 460 }, 0.2)];
		const r = recipeStepApply(block, { op: 'pleat', params: { dartId: 'waist-dart', at, mode: 'equal_intake' } });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.foldLine).toEqual(block.foldLine);
		for (const y of [100, 250, 450]) expect(outlineNearestLocation(r.piece.outline, { x: 0, y }).distance).toBeLessThan(1e-9);
		expect(pieceMetrics(r.piece).apexTotals[0].totalAngleRad).toBeCloseTo(pieceMetrics(block).apexTotals[0].totalAngleRad, 12);
	});
});
