import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { outlineArea, outlineContainsPoint, outlineFlatten, outlineNearestPoint, pathBoundingBox, pathReverse, type Path, type Vec } from '../kernel';
import { ledgerBalance } from '../ledger';
import { carry, type CarryPlacement } from './carry';
import { nonFiniteAt } from './finite-check';
import type { SeamPair } from './panel-types';
import { pieceMapPoints } from './piece-tools';
import { underStructurePanels } from './fixtures/under-structure-panels';

// Random style lines (tilted, bowed cubics) across the boned under-structure drafted from ASTM D5585-11e1
// misses size 10 curvy (reference-values rows 1 C, 16 CP), with each seam edge given either way round.
const drafts = { 4: underStructurePanels(4), 6: underStructurePanels(6) };

/** `at`: where the line's middle lies between the panels' top and the waist (0 top, 1 waist). */
const lineArbFrom = (minAt: number, maxAt: number) => fc.record({
	panels: fc.constantFrom(4 as const, 6 as const),
	at: fc.double({ min: minAt, max: maxAt, noNaN: true }),
	tiltMm: fc.double({ min: -40, max: 40, noNaN: true }),
	bowMm: fc.double({ min: -30, max: 30, noNaN: true }),
	flips: fc.array(fc.boolean(), { minLength: 4, maxLength: 4 }),
	fuse: fc.constantFrom('above' as const, 'below' as const),
	residualAs: fc.constantFrom('dart' as const, 'pleats' as const)
});
// anywhere, also above the armhole where the line misses a panel and carry refuses
const lineArb = lineArbFrom(0.02, 0.98);
// between the armhole and the waist, where it crosses every panel once (mostly)
const acrossArb = lineArbFrom(0.5, 0.85);

function setUp(c: LineCase) {
	const f = drafts[c.panels];
	const boxes = f.panels.map((p) => pathBoundingBox(p.outline));
	const minX = Math.min(...boxes.map((b) => b.minX)) - 15;
	const maxX = Math.max(...boxes.map((b) => b.maxX)) + 15;
	const top = Math.min(...boxes.map((b) => b.minY));
	const bottom = Math.max(...boxes.map((b) => b.maxY));
	const y = top + c.at * (bottom - top);
	const w = maxX - minX;
	const styleLine: Path = {
		segments: [
			{
				kind: 'cubic',
				p0: { x: minX, y: y - c.tiltMm / 2 },
				p1: { x: minX + w / 3, y: y - c.tiltMm / 6 + c.bowMm },
				p2: { x: minX + (2 * w) / 3, y: y + c.tiltMm / 6 + c.bowMm },
				p3: { x: maxX, y: y + c.tiltMm / 2 }
			}
		]
	};
	const flip = (e: Path, k: number) => (c.flips[k] ? pathReverse(e) : e);
	const pairs: SeamPair[] = f.seamPairs.map((p, i) => ({ ...p, a: { ...p.a, edge: flip(p.a.edge, 2 * i) }, b: { ...p.b, edge: flip(p.b.edge, 2 * i + 1) } }));
	return { f, styleLine, pairs };
}

type LineCase = { panels: 4 | 6; at: number; tiltMm: number; bowMm: number; flips: boolean[]; fuse: 'above' | 'below'; residualAs: 'dart' | 'pleats' };

const unplace = (q: CarryPlacement) => (p: Vec): Vec => {
	const x = p.x - q.dxMm;
	const y = p.y - q.dyMm;
	const c = Math.cos(-q.angleRad);
	const s = Math.sin(-q.angleRad);
	return { x: c * x - s * y, y: s * x + c * y };
};

describe('carry over random style lines and seam directions (fast-check)', () => {
	it('no input gives NaN or Infinity anywhere in a result or a message', () => {
		fc.assert(
			fc.property(lineArb, (c) => {
				const { f, styleLine, pairs } = setUp(c);
				const r = carry(f.panels, pairs, { styleLine, fuse: c.fuse, residualAs: c.residualAs });
				expect(nonFiniteAt(r)).toBeNull();
			}),
			{ numRuns: 120, seed: 11 }
		);
	});

	it('carry then un-carry (each part laid back by the inverse of its placement) restores the panels and their shaping', () => {
		let carried = 0;
		fc.assert(
			fc.property(acrossArb, (c) => {
				const { f, styleLine, pairs } = setUp(c);
				const r = carry(f.panels, pairs, { styleLine, fuse: c.fuse, residualAs: c.residualAs });
				if (!r.ok) return;
				carried++;
				// the ledger balances at every apex and the cloth is all there
				expect(ledgerBalance(r.ledgerEntries).every((b) => b.balanced)).toBe(true);
				const before = f.panels.reduce((s, p) => s + outlineArea(p.outline), 0);
				const after = r.pieces.reduce((s, p) => s + outlineArea(p.outline), 0);
				expect(Math.abs(after - before)).toBeLessThan(0.5);
				// laid back, the joined piece covers each panel wherever that panel's other-side part does not
				const joined = r.pieces[0];
				const others = r.pieces.slice(1);
				for (const [k, panel] of f.panels.entries()) {
					const back = pieceMapPoints(joined, unplace(r.placements[k])).outline;
					for (const p of outlineFlatten(panel.outline, 2)) {
						if (outlineNearestPoint(others[k].outline, p).distance <= 0.01) continue;
						const inside = outlineContainsPoint(back, p) || outlineNearestPoint(back, p).distance <= 0.01;
						expect(inside).toBe(true);
					}
				}
			}),
			{ numRuns: 80, seed: 5 }
		);
		// most random lines carry (the rest are clear refusals, checked above)
		expect(carried).toBeGreaterThan(60);
	});
});
