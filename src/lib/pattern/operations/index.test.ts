import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { pieceFromInput } from '../piece';
import type { Vec } from '../kernel';
import { recipeStepApply as applyOperation, recipeStepSchema } from '../recipe/registry';
import { pivot } from './pivot';

describe('dart operations through the recipe registry', () => {
	it('replays a recipe: pivot the shoulder dart to the side, pleat the waist dart, pull back, cap', () => {
		let piece = frontBodiceBlock();
		const steps = [
			{ op: 'pivot', params: { dartId: 'shoulder-dart', to: { x: 232, y: 293 } } },
			{ op: 'pull_back', params: { dartId: 'shoulder-dart', clearanceMm: 25 } },
			{ op: 'cap', params: { dartId: 'shoulder-dart', pressToward: 'leg2' } }
		];
		for (const step of steps) {
			expect(recipeStepSchema.safeParse(step).success).toBe(true);
			const r = applyOperation(piece, step);
			if (!r.ok) throw new Error(`${step.op}: ${r.error.message}`);
			piece = r.piece;
		}
		expect(piece.darts.find((d) => d.id === 'shoulder-dart')!.cap).toBeDefined();
	});
	it('refuses an unknown operation or bad params', () => {
		const r1 = applyOperation(frontBodiceBlock(), { op: 'teleport', params: {} });
		expect(!r1.ok && r1.error.code).toBe('invalid_params');
		const r2 = applyOperation(frontBodiceBlock(), { op: 'pivot', params: { to: { x: 1, y: 2 } } });
		expect(!r2.ok && r2.error.code).toBe('invalid_params');
		const r3 = applyOperation(frontBodiceBlock(), { op: 'pull_back', params: { dartId: 'waist-dart', clearanceMm: Infinity } });
		expect(!r3.ok && r3.error.code).toBe('invalid_params');
	});
	it('refuses a piece whose dart is not in its outline', () => {
		const b = frontBodiceBlock();
		const broken = { ...b, darts: [{ ...b.darts[0], leg1End: { x: 1, y: 1 } }, b.darts[1]] };
		const r = applyOperation(broken, { op: 'pivot', params: { dartId: 'waist-dart', to: { x: 0, y: 200 } } });
		expect(!r.ok && r.error.code).toBe('invalid_piece');
	});
});

describe('operations never return a broken piece', () => {
	it('refuses a pivot whose moved chain would cross the fixed one (result_broken)', () => {
		// a hook-shaped piece: a strip overhangs the dart mouth, an arm of the fixed part rises beside it;
		// closing the dart swings the strip into the arm
		const P = { x: 0, y: 0 };
		const L = 50;
		const h = 0.3;
		const L1: Vec = { x: -L * Math.sin(h), y: -L * Math.cos(h) };
		const L2: Vec = { x: L * Math.sin(h), y: -L * Math.cos(h) };
		const pts: Vec[] = [L2, { x: 30, y: L2.y }, { x: 30, y: -70 }, { x: -40, y: -70 }, { x: -40, y: -90 }, { x: 50, y: -90 }, { x: 50, y: 60 }, { x: -60, y: 60 }, { x: -60, y: -150 }, { x: -50, y: -150 }, { x: -50, y: L1.y }, L1, P];
		for (const movingLeg of ['leg1', 'leg2'] as const) {
			const piece = pieceFromInput({
				schemaVersion: 1,
				id: 'hook',
				name: 'Hook-shaped piece (test)',
				outline: { segments: pts.map((p, i) => ({ kind: 'line' as const, p0: p, p1: pts[(i + 1) % pts.length] })) },
				apexes: [{ id: 'a', kind: 'bust_point', label: '', point: P }],
				darts: [{ id: 'd', apexId: 'a', leg1End: L1, leg2End: L2, movingLeg }],
				cut: 'single'
			});
			const r = pivot(piece, { dartId: 'd', to: { x: 0, y: 60 } });
			expect(!r.ok && r.error.code).toBe('result_broken');
			if (!r.ok) expect(r.error.message).toMatch(/crosses itself/);
		}
	});
});
