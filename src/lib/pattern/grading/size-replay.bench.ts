import { bench, describe } from 'vitest';
import { astmD5585MeasurementSet, measurementsMm } from '../measurements';
import { demoStyleRecipe } from './demo-recipe';
import { sizeResult } from './size-result';

// The target: a size run of the demo style over eight sizes in ≤ 3 s on this machine; the worker
// yields to the event loop between sizes, so one size is the longest the web server waits.
const recipe = demoStyleRecipe();
const eight = (['2', '4', '6', '8', '12', '14', '16', '18'] as const).map((s) => measurementsMm(astmD5585MeasurementSet('curvy', s)));

describe('size run of the demo style', () => {
	bench('eight sizes of ASTM D5585 curvy (2–18 without 10)', () => {
		for (const mm of eight) sizeResult(recipe, mm);
	});
	bench('one size (curvy 12): the longest the worker holds the event loop', () => {
		sizeResult(recipe, eight[4]);
	});
});
