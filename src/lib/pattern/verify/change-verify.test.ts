import { describe, expect, it } from 'vitest';
import { lineSegment, pathFromPolyline } from '../kernel';
import { twoPanelWedge } from '../panels/fixtures/two-panel-wedge';
import { rectanglePiece } from '../panels/fixtures/simple-pieces';
import type { Piece } from '../piece-schema';
import { changeRecompute, type ChangePiece, type ChangeStep } from '../recipe/change';
import { changeVerify } from './change-verify';

const wire = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

/** A carry of the two-panel wedge fixture (12° below D at y = 150) along a straight line at y = 250. */
function carryChange() {
	const { left, right, pair } = twoPanelWedge();
	const bases = new Map<string, Piece>([['p-left', left], ['p-right', right]]);
	const styleLine = { segments: [lineSegment({ x: -10, y: 250 }, { x: 210, y: 250 })] };
	const steps: ChangeStep[] = [{ op: 'carry', sources: [{ pieceId: 'p-left' }, { pieceId: 'p-right' }], params: { seams: [pair], styleLine, fuse: 'below', name: 'Band' } }];
	const rc = changeRecompute(bases, steps);
	if (!rc.ok) throw new Error(rc.message);
	const pieces: ChangePiece[] = rc.unused.map((u, n) => ({ ...u, name: `New piece ${n + 1}`, cut: 'pair', geometry: rc.steps[u.step].result.pieces[u.result] }));
	return { bases, steps, pieces, pair, left, right };
}

describe('style change verification (multi-piece steps recomputed from their sources)', () => {
	it('accepts a carry as computed: the wedge measured at D goes into the style seam, area kept over the pieces', () => {
		const { bases, steps, pieces } = carryChange();
		const v = changeVerify(bases, wire(steps), wire(pieces));
		if (!v.ok) throw new Error(v.problem.message);
		expect(v.pieces.map((p) => p.piece.name)).toEqual(pieces.map((p) => p.name));
		const wedge = v.checks.find((c) => c.code === 'seam_wedge_measured');
		// the fixture's wedge is 12° by construction (two-panel-wedge.ts, stated numbers)
		expect(wedge?.message).toMatch(/12\.00°/);
		expect(v.checks.find((c) => c.code === 'apex_balanced_across_pieces')?.passed).toBe(true);
		expect(v.checks.find((c) => c.code === 'area_kept_across_pieces')?.passed).toBe(true);
	});

	it('refuses a new piece that differs from the recomputed one, saying which piece and by how much', () => {
		const { bases, steps, pieces } = carryChange();
		const moved = wire(pieces);
		const seg = moved[1].geometry.outline.segments[0] as { p0: { x: number; y: number } };
		seg.p0.x += 0.25;
		const v = changeVerify(bases, steps, moved);
		expect(v.ok).toBe(false);
		if (v.ok) return;
		expect(v.problem.code).toBe('replay_mismatch');
		expect(v.problem.pieceIndex).toBe(1);
		expect(v.problem.distanceMm).toBeCloseTo(0.25, 6);
		expect(v.problem.message).toMatch(/New piece 2 \("New piece 2"\).*0\.250 mm off/);
	});

	it('refuses a change whose new pieces are not exactly the results no later step uses', () => {
		const { bases, steps, pieces } = carryChange();
		const short = changeVerify(bases, steps, pieces.slice(1));
		expect(!short.ok && short.problem.code).toBe('change_invalid');
		const twice = changeVerify(bases, steps, [pieces[0], pieces[0], ...pieces.slice(1)]);
		expect(!twice.ok && twice.problem.code).toBe('change_invalid');
	});

	it('refuses a source whose base version was not given, and a source used twice', () => {
		const { steps, pieces, left } = carryChange();
		const v = changeVerify(new Map([['p-left', left]]), steps, pieces);
		expect(!v.ok && v.problem.message).toMatch(/base version was not given/);
		const { bases } = carryChange();
		const again: ChangeStep[] = [{ ...steps[0], sources: [{ pieceId: 'p-left' }, { pieceId: 'p-left' }] }];
		const w = changeVerify(bases, again, pieces);
		expect(!w.ok && w.problem.code).toBe('change_invalid');
	});

	it('checks the seams it sews with the style\'s seam pair, and says by how much they differ', () => {
		const { bases, steps, pieces, pair } = carryChange();
		const withStored = wire(steps);
		(withStored[0].params as { seams: { storedId?: string }[] }).seams[0].storedId = 'stored-1';
		const top = { x: 100, y: 0 };
		// seam pairs store each edge's ends in its piece's outline order: down the left panel, up the right one
		// the style's pair measures the left edge only to 10 mm above its waist end: 10 mm short of the right one
		const stored = { id: 'stored-1', label: 'panel seam', aPieceId: 'p-left', bPieceId: 'p-right', a: { from: top, to: { x: 100 - 250 * Math.tan((6 * Math.PI) / 180) * (240 / 250), y: 390 } }, b: { from: { x: 100 + 250 * Math.tan((6 * Math.PI) / 180), y: 400 }, to: top }, allowedEaseMm: 0, toleranceMm: 1.6 };
		const v = changeVerify(bases, withStored, pieces, [stored]);
		expect(v.ok).toBe(false);
		if (v.ok) return;
		expect(v.problem.code).toBe('seam_lengths_differ');
		expect(v.problem.message, v.problem.message).toMatch(/panel seam: .* 10\.\d mm too short/);
		const fine = changeVerify(bases, withStored, pieces, [{ ...stored, a: { from: top, to: { x: 100 - 250 * Math.tan((6 * Math.PI) / 180), y: 400 } } }]);
		expect(fine.ok).toBe(true);
	});

	it('recomputes a chain inside one change: separate, then join the parts back along the cut', () => {
		const rect = rectanglePiece('rect');
		const path = pathFromPolyline([{ x: 0, y: 120 }, { x: 200, y: 120 }]);
		const first = changeRecompute(new Map([['p', rect]]), [{ op: 'separate', sources: [{ pieceId: 'p' }], params: { path } }]);
		if (!first.ok) throw new Error(first.message);
		const seam = first.steps[0].result.seamPairs[0];
		const steps: ChangeStep[] = [
			{ op: 'separate', sources: [{ pieceId: 'p' }], params: { path } },
			{ op: 'join', sources: [{ step: 0, result: 0 }, { step: 0, result: 1 }], params: { seam, name: 'Whole again' } }
		];
		const rc = changeRecompute(new Map([['p', rect]]), steps);
		if (!rc.ok) throw new Error(rc.message);
		expect(rc.unused).toEqual([{ step: 1, result: 0 }]);
		const joined = rc.steps[1].result.pieces[0];
		const v = changeVerify(new Map([['p', rect]]), wire(steps), [{ step: 1, result: 0, name: 'Whole again', cut: 'single', geometry: wire(joined) }]);
		if (!v.ok) throw new Error(v.problem.message);
		expect(v.checks.some((c) => c.code === 'seam_sewn_true' && c.passed)).toBe(true);
		expect(v.pieces[0].metrics.areaMm2).toBeCloseTo(200 * 300, 6);
	});
});
