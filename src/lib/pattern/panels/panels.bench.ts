import { bench, describe } from 'vitest';
import { lineSegment } from '../kernel';
import type { Piece } from '../piece-schema';
import { allowance } from './allowance';
import { carry } from './carry';
import { benchPanels, benchSeparateInput } from './fixtures/bench-pieces';
import { join } from './join';
import { separate } from './separate';

/**
 * Panel operations on 2,000- and 20,000-vertex pieces (targets: 5 ms and 100 ms median).
 * "repeat": the same piece objects every time, so their full outline check is reused (the interactive
 * case: a style line dragged across unchanged pieces). "cold": a fresh copy of every piece each time,
 * so every check runs.
 */
const fresh = (p: Piece): Piece => ({ ...p });

for (const n of [2000, 20000]) {
	describe(`${n} vertices`, () => {
		const { piece, line } = benchSeparateInput(n);
		const cut = separate(piece, { path: line });
		if (!cut.ok) throw new Error(cut.error.message);
		const { panels, seams } = benchPanels(n);
		const styleLine = { segments: [lineSegment({ x: -10, y: 200 }, { x: 220, y: 200 })] };

		bench(`separate ${n} repeat`, () => {
			separate(piece, { path: line });
		});
		bench(`separate ${n} cold`, () => {
			separate(fresh(piece), { path: line });
		});
		bench(`join ${n} repeat`, () => {
			join(cut.pieces, cut.seamPairs[0]);
		});
		bench(`join ${n} cold`, () => {
			join(cut.pieces.map(fresh), cut.seamPairs[0]);
		});
		bench(`carry ${n} (2 panels of ${n}) repeat`, () => {
			carry(panels, seams, { styleLine, fuse: 'below' });
		});
		bench(`carry ${n} (2 panels of ${n}) cold`, () => {
			carry(panels.map(fresh), seams, { styleLine, fuse: 'below' });
		});
		bench(`allowance ${n}`, () => {
			allowance(piece);
		});
	});
}
