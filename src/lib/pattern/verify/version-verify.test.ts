import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { ledgerEntry } from '../ledger';
import { pieceMetrics } from '../metrics';
import { succeed, type OperationResult } from '../operation-result';
import { pivot } from '../operations/pivot';
import type { Piece } from '../piece-schema';
import { reshape } from './reshape';
import { versionVerify, type RecipeStepData } from './version-verify';

/** A replay that knows pivot and reshape, like the server's. */
function replay(piece: Piece, step: RecipeStepData): OperationResult {
	if (step.op === 'pivot') return pivot(piece, step.params as never);
	if (step.op === 'reshape') return reshape(piece, step.params);
	throw new Error(`unexpected op ${step.op}`);
}

const pivotParams = { dartId: 'shoulder-dart', to: { x: 235 - 10 / 3, y: 300 } };

describe('server verification of a submitted version', () => {
	const block = frontBodiceBlock();

	it('accepts a pivot replayed on the base version and returns the server-computed metrics', () => {
		const r = pivot(block, pivotParams);
		if (!r.ok) throw new Error(r.error.message);
		const v = versionVerify(block, r.piece, [{ op: 'pivot', params: pivotParams }], replay);
		expect(v.ok).toBe(true);
		if (v.ok) {
			expect(v.metrics.areaMm2).toBeCloseTo(pieceMetrics(block).areaMm2, 3); // a pivot keeps area (trade-primer §1)
			expect(v.checks.every((c) => c.passed)).toBe(true);
		}
	});

	it('refuses a geometry that differs from the replay by more than 0.01 mm, naming where', () => {
		const r = pivot(block, pivotParams);
		if (!r.ok) throw new Error(r.error.message);
		// Nudge one Bézier handle of the neckline by 0.02 mm: still a sound piece, but not the replay.
		const k = r.piece.outline.segments.findIndex((s) => s.kind === 'cubic');
		const segments = r.piece.outline.segments.map((s, i) =>
			i === k && s.kind === 'cubic' ? { ...s, p1: { x: s.p1.x + 0.02, y: s.p1.y } } : s
		);
		const moved = { ...r.piece, outline: { segments } };
		const v = versionVerify(block, moved, [{ op: 'pivot', params: pivotParams }], replay);
		expect(v.ok).toBe(false);
		if (!v.ok) {
			expect(v.problem.code).toBe('replay_mismatch');
			expect(v.problem.message).toContain(`outline segment ${k + 1}`);
		}
	});

	it('refuses a later version without a recipe, and a first version that is not a draft or import', () => {
		const none = versionVerify(block, block, [], replay);
		expect(!none.ok && none.problem.code).toBe('recipe_missing');
		const first = versionVerify(null, block, [{ op: 'pivot', params: pivotParams }], replay);
		expect(!first.ok && first.problem.code).toBe('recipe_missing');
		expect(versionVerify(null, block, [{ op: 'draft' }], replay).ok).toBe(true);
		// a piece made by a multi-piece step cannot be posted as a first version: it is recomputed in a style change
		const merged = versionVerify(null, block, [{ op: 'change_result', params: { step: 0, result: 0 } }], replay);
		expect(!merged.ok && merged.problem.message).toMatch(/saved as a style change/);
		expect(versionVerify(null, block, [{ op: 'separate_result' }], replay).ok).toBe(false);
	});

	it('refuses an operation that changes a dart angle without posting it to the ledger', () => {
		// A faulty operation: narrows the shoulder dart but claims nothing changed.
		const faulty = (piece: Piece): OperationResult => {
			const d = piece.darts[0];
			const m = reshape(piece, { moves: [{ from: d.leg2End, to: { x: d.leg2End.x + 6, y: d.leg2End.y } }] });
			if (!m.ok) throw new Error(m.error.message);
			return succeed(m.piece, [ledgerEntry({ apexId: 'bp', kind: 'dart', refId: d.id, label: 'claims nothing', angleRad: 0 })], m.ok ? { op: 'x', summary: '', values: {}, notes: [] } : (undefined as never));
		};
		const result = faulty(block);
		if (!result.ok) throw new Error('faulty op failed');
		const v = versionVerify(block, result.piece, [{ op: 'faulty' }], (p) => faulty(p));
		expect(v.ok).toBe(false);
		if (!v.ok) {
			expect(v.problem.code).toBe('shaping_not_kept');
			expect(v.problem.message).toMatch(/Bust point/);
		}
	});

	it('refuses declared entries of a kind that only operations may post', () => {
		const r = pivot(block, pivotParams);
		if (!r.ok) throw new Error(r.error.message);
		const v = versionVerify(block, r.piece, [{ op: 'pivot', params: pivotParams }], replay, [
			ledgerEntry({ apexId: 'bp', kind: 'dart', refId: 'x', label: 'sneaky', angleRad: 0.1 })
		]);
		expect(!v.ok && v.problem.code).toBe('shaping_not_kept');
	});

	it('refuses a change declared as "other" without a note, and accepts it with one', () => {
		const dart = block.darts.find((d) => d.id === 'shoulder-dart')!;
		const params = { moves: [{ from: dart.leg2End, to: { x: dart.leg2End.x + 8, y: dart.leg2End.y + 2 } }] };
		const m = reshape(block, params);
		if (!m.ok) throw new Error(m.error.message);
		const before = pieceMetrics(block);
		const after = pieceMetrics(m.piece);
		const entry = ledgerEntry({
			apexId: 'bp',
			kind: 'other',
			refId: 'shoulder-dart',
			label: 'shoulder dart narrowed by hand',
			angleRad: after.apexTotals[0].totalAngleRad - before.apexTotals[0].totalAngleRad,
			areaMm2: after.areaMm2 - before.areaMm2,
			lengthMm: after.seamLengthMm - before.seamLengthMm
		});
		const recipe = [{ op: 'reshape', params }];
		const bare = versionVerify(block, m.piece, recipe, replay, [entry]);
		expect(!bare.ok && bare.problem.code).toBe('declaration_incomplete');
		expect(!bare.ok && bare.problem.message).toMatch(/shoulder dart narrowed by hand/);
		expect(versionVerify(block, m.piece, recipe, replay, [{ ...entry, note: 'less bust shaping after the fitting' }]).ok).toBe(true);
	});

	it('refuses unsound geometry (a self-intersecting outline) before anything else', () => {
		const bow: Piece = {
			...block,
			apexes: [],
			darts: [],
			outline: {
				segments: [
					{ kind: 'line', p0: { x: 0, y: 0 }, p1: { x: 100, y: 100 } },
					{ kind: 'line', p0: { x: 100, y: 100 }, p1: { x: 100, y: 0 } },
					{ kind: 'line', p0: { x: 100, y: 0 }, p1: { x: 0, y: 100 } },
					{ kind: 'line', p0: { x: 0, y: 100 }, p1: { x: 0, y: 0 } }
				]
			}
		};
		const v = versionVerify(null, bow, [{ op: 'draft' }], replay);
		expect(!v.ok && v.problem.code).toBe('invalid_geometry');
	});
});

describe('comparing two versions', () => {
	it('pairs each seam with the same seam after a pivot, so kept lengths show no difference', async () => {
		const { metricsCompare } = await import('./metrics-compare');
		const block = frontBodiceBlock();
		const r = pivot(block, pivotParams);
		if (!r.ok) throw new Error(r.error.message);
		const rows = metricsCompare(pieceMetrics(block), pieceMetrics(r.piece)).filter((x) => x.group === 'seam');
		// a pivot is a rigid move of a chain (trade-primer §1): with the darts folded out every seam between
		// corners keeps its length, though the outline now starts and runs differently
		expect(rows.length).toBe(pieceMetrics(block).seams.length);
		for (const x of rows) {
			expect(x.difference).not.toBeNull();
			expect(Math.abs(x.difference!)).toBeLessThan(0.01);
		}
	});
});
