import { describe, expect, it } from 'vitest';
import { astmD5585MeasurementSet, measurementsMm } from '../measurements';
import { pieceGeometryDifference } from '../verify/piece-compare';
import { demoStyleRecipe } from './demo-recipe';
import { sizeResult } from './size-result';
import { styleRecipeAt } from './style-recipe-at';

const recipe = demoStyleRecipe();
const heads = new Map(recipe.pieces.map((p) => [p.id, p.versions.at(-1)!.number]));

describe('a style as it stood when a size run was made', () => {
	it('with every piece at its head, gives the same pieces on another size as the whole style', () => {
		const at = styleRecipeAt(recipe, heads);
		expect(at.ok).toBe(true);
		if (!at.ok) return;
		const mm = measurementsMm(astmD5585MeasurementSet('curvy', '14'));
		const whole = sizeResult(recipe, mm);
		const again = sizeResult(at.style, mm);
		expect(again.failures).toEqual([]);
		for (const p of recipe.pieces) expect(pieceGeometryDifference(whole.heads.get(p.id)!, again.heads.get(p.id)!, 1e-9), p.name).toBeNull();
	});

	it('leaves out a later version and a piece the run did not make', () => {
		const grown = recipe.pieces.find((p) => p.versions.length > 1)!;
		const older = new Map(heads);
		older.set(grown.id, grown.versions.at(-2)!.number);
		const left = recipe.pieces.find((p) => p.id !== grown.id)!;
		older.delete(left.id);
		const at = styleRecipeAt(recipe, older);
		expect(at.ok).toBe(true);
		if (!at.ok) return;
		expect(at.style.pieces.some((p) => p.id === left.id)).toBe(false);
		expect(at.style.pieces.find((p) => p.id === grown.id)!.versions.at(-1)!.number).toBe(grown.versions.at(-2)!.number);
	});

	it('says so when a piece the run made is gone or lacks the version', () => {
		const gone = styleRecipeAt(recipe, new Map([['no-such-piece', 1]]));
		expect(gone).toEqual({ ok: false, message: 'A piece the run made is no longer in the style.' });
		const p = recipe.pieces[0];
		const missing = styleRecipeAt(recipe, new Map([[p.id, p.versions.length + 1]]));
		expect(missing.ok).toBe(false);
		if (!missing.ok) expect(missing.message).toContain(p.name);
	});
});
