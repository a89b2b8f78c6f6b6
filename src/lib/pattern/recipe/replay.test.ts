import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { rectanglePiece } from '../panels/fixtures/simple-pieces';
import { recipeStepApply } from './registry';

describe('recipe replay of one piece (registry)', () => {
	const block = frontBodiceBlock();

	it('adds a seam allowance as the last step and keeps the stitching line as it was', () => {
		const r = recipeStepApply(block, { op: 'allowance', params: { defaultWidthMm: 15 } });
		expect(r.ok).toBe(true);
		if (r.ok) {
			expect(r.piece.outline).toEqual(block.outline);
			expect(r.piece.seamAllowance?.defaultWidthMm).toBe(15);
			expect(r.piece.seamAllowance?.cutLine.segments.length).toBeGreaterThan(3);
		}
	});

	it('keeps the seam allowance along a hand-reshaped line with the same widths, as if added again after it', () => {
		const band = recipeStepApply(rectanglePiece('band', 200, 300), { op: 'allowance', params: { defaultWidthMm: 15, widthsMm: { '2': 25 } } });
		if (!band.ok) throw new Error(band.error.message);
		const r = recipeStepApply(band.piece, { op: 'reshape', params: { moves: [{ from: { x: 200, y: 300 }, to: { x: 200, y: 310 } }] } });
		if (!r.ok) throw new Error(r.error.message);
		expect(r.piece.seamAllowance?.defaultWidthMm).toBe(15);
		expect(r.piece.seamAllowance?.widthsMm).toEqual({ '2': 25 });
		expect(r.piece.seamAllowance?.cutLine).not.toEqual(band.piece.seamAllowance?.cutLine);
		const again = recipeStepApply({ ...r.piece, seamAllowance: null }, { op: 'allowance', params: { defaultWidthMm: 15, widthsMm: { '2': 25 } } });
		if (!again.ok) throw new Error(again.error.message);
		expect(r.piece.seamAllowance?.cutLine).toEqual(again.piece.seamAllowance?.cutLine);
		expect(r.report.notes.join(' ')).toMatch(/follows the new stitching line/);
	});

	it('drops the seam allowance when a later step changes the seams of the stitching line, and says so', () => {
		const a = recipeStepApply(block, { op: 'allowance', params: { defaultWidthMm: 10 } });
		if (!a.ok) throw new Error(a.error.message);
		const p = recipeStepApply(a.piece, { op: 'pivot', params: { dartId: 'shoulder-dart', to: { x: 235 - 10 / 3, y: 300 } } });
		expect(p.ok).toBe(true);
		if (p.ok) {
			expect(p.piece.seamAllowance).toBeNull();
			expect(p.report.notes.join(' ')).toMatch(/seam allowance was removed/);
		}
	});

	it('refuses panel steps with malformed parameters instead of throwing', () => {
		const r = recipeStepApply(block, { op: 'notch', params: { id: 'n', at: { x: 'a' } } });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.error.code).toBe('invalid_params');
	});

	it('refuses origin steps applied to an existing version', () => {
		const r = recipeStepApply(block, { op: 'draft' });
		expect(!r.ok && r.error.message).toMatch(/starts a piece's history/);
	});

	it('refuses an unknown operation with a clear message', () => {
		const r = recipeStepApply(block, { op: 'fold_in_half_twice' });
		expect(r.ok).toBe(false);
	});
});
