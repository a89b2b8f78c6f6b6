import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { rectanglePiece } from '../panels/fixtures/simple-pieces';
import { CLIENT_ORIGIN_STEP_NAMES, ORIGIN_STEP_NAMES, PIECES_STEP_NAMES, piecesForStep, piecesStepApply, RECIPE_STEPS, recipeStepApply, recipeStepSchema, STEP_NAMES, stepSpansPieces, stepStartsHistory } from './registry';

describe('recipe registry', () => {
	it('names every step once, with a schema, and a function unless it starts a history', () => {
		expect(new Set(STEP_NAMES).size).toBe(STEP_NAMES.length);
		for (const name of STEP_NAMES) {
			const def = RECIPE_STEPS[name];
			expect(typeof def.schema.safeParse, name).toBe('function');
			if (def.startsHistory) expect('apply' in def, name).toBe(false);
			else expect(typeof (def as { apply: unknown }).apply, name).toBe('function');
		}
	});

	it('tells origins and multi-piece steps apart', () => {
		expect(ORIGIN_STEP_NAMES).toEqual(['draft', 'import', 'separate_result', 'change_result']);
		expect(PIECES_STEP_NAMES).toEqual(['separate', 'join', 'carry']);
		// pieces made from others never start from a client's say-so: they come from a style change
		expect(CLIENT_ORIGIN_STEP_NAMES).toEqual(['draft', 'import']);
		expect(stepStartsHistory('draft')).toBe(true);
		expect(stepStartsHistory('pivot')).toBe(false);
		expect(stepSpansPieces('carry')).toBe(true);
		expect(stepSpansPieces('notch')).toBe(false);
		expect(stepSpansPieces('toString')).toBe(false);
	});

	it('gives the API schema of a step: known names only', () => {
		expect(recipeStepSchema.safeParse({ op: 'pivot', params: {} }).success).toBe(true);
		expect(recipeStepSchema.safeParse({ op: 'teleport' }).success).toBe(false);
		expect(recipeStepSchema.safeParse({ op: '__proto__' }).success).toBe(false);
	});

	it('refuses a multi-piece step or an origin applied to one piece, with a message', () => {
		const r1 = recipeStepApply(frontBodiceBlock(), { op: 'carry', params: {} });
		expect(!r1.ok && r1.error.message).toMatch(/style change/);
		const r2 = recipeStepApply(frontBodiceBlock(), { op: 'change_result', params: { step: 0, result: 0 } });
		expect(!r2.ok && r2.error.message).toMatch(/starts a piece's history/);
	});

	it('applies a multi-piece step to its sources and refuses the wrong number of them', () => {
		const piece = rectanglePiece();
		const line = { id: 'cut', path: { segments: [{ kind: 'line' as const, p0: { x: 0, y: 120 }, p1: { x: 200, y: 120 } }] } };
		const withLine = recipeStepApply(piece, { op: 'style_line', params: line });
		if (!withLine.ok) throw new Error(withLine.error.message);
		const r = piecesStepApply([withLine.piece], { op: 'separate', params: { styleLineId: 'cut' } });
		expect(r.ok && r.pieces.length).toBe(2);
		const two = piecesStepApply([withLine.piece, withLine.piece], { op: 'separate', params: { styleLineId: 'cut' } });
		expect(!two.ok && two.error.message).toMatch(/takes 1 piece, not 2/);
		const bad = piecesStepApply([withLine.piece], { op: 'separate', params: {} });
		expect(!bad.ok && bad.error.code).toBe('invalid_params');
	});

	it('gives sources that share a geometry id distinct ids for the step, the same way every time', () => {
		const p = rectanglePiece();
		const ids = piecesForStep([p, p, { ...p, id: 'other' }]).map((q) => q.id);
		expect(ids).toEqual([p.id, `${p.id}-1`, 'other']);
	});
});
