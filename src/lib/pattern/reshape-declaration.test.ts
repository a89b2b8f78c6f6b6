import { describe, expect, it } from 'vitest';
import { demoPath } from './fixtures/demo-path';
import { frontBodiceBlock } from './fixtures/front-bodice-block';
import { ledgerEntrySchema, shapingChecks } from './ledger';
import { pieceMetrics } from './metrics';
import type { OperationResult } from './operation-result';
import type { Piece } from './piece-schema';
import { reshapeChanges, reshapeDeclaredEntries } from './reshape-declaration';
import { recipeStepApply } from './recipe/registry';
import { reshape, type ReshapeParams } from './verify/reshape';
import { seamNames } from './verify/seam-names';
import { versionVerify, type RecipeStepData } from './verify/version-verify';

const replay = (piece: Piece, step: RecipeStepData): OperationResult => reshape(piece, step.params);

function reshaped(block: Piece, params: ReshapeParams): Piece {
	const r = reshape(block, params);
	if (!r.ok) throw new Error(r.error.message);
	return r.piece;
}

describe('what a hand reshape changed', () => {
	const block = frontBodiceBlock();
	// the side waist corner of the front block (side seam meets waist)
	const sideWaist = { x: 225, y: 440 };

	it('proposes nothing for a reshape that keeps everything, and the server accepts it undeclared', () => {
		const params = { moves: [{ from: sideWaist, to: sideWaist }] };
		const after = reshaped(block, params);
		expect(reshapeChanges(block, after)).toEqual([]);
		const declared = reshapeDeclaredEntries([]);
		expect(declared).toEqual({ ok: true, entries: [] });
		expect(versionVerify(block, after, [{ op: 'reshape', params }], replay).ok).toBe(true);
	});

	it('lowering the side waist by 6 mm: the side seam, the waist and the area change, and are proposed with their names', () => {
		const params = { moves: [{ from: sideWaist, to: { x: 225, y: 446 } }] };
		const after = reshaped(block, params);
		const changes = reshapeChanges(block, after);
		const byLabel = new Map(changes.map((c) => [c.label, c]));
		const side = byLabel.get('Side seam');
		expect(side?.subject).toBe('seam');
		// the side seam runs (235, 230) → (225, 440): lowering its lower end by 6 mm lengthens it by about 6 mm (D)
		const lengthSide = (y: number) => Math.hypot(225 - 235, y - 230);
		expect(side?.difference).toBeCloseTo(lengthSide(446) - lengthSide(440), 9);
		expect(side?.addsCloth).toBe(true);
		expect(side?.suggested).toBe('ease');
		expect(byLabel.get('Waist')?.subject).toBe('seam');
		const area = changes.find((c) => c.subject === 'area');
		expect(area?.difference).toBeCloseTo(pieceMetrics(after).areaMm2 - pieceMetrics(block).areaMm2, 9);
		expect(area!.difference).toBeGreaterThan(0);
		// the darts are not touched: no apex change
		expect(changes.some((c) => c.subject === 'apex')).toBe(false);
	});

	it('the server refuses that reshape undeclared and accepts it with the proposed entries', () => {
		const params = { moves: [{ from: sideWaist, to: { x: 225, y: 446 } }] };
		const after = reshaped(block, params);
		const recipe = [{ op: 'reshape', params }];
		const refused = versionVerify(block, after, recipe, replay);
		expect(!refused.ok && refused.problem.code).toBe('shaping_not_kept');
		const declared = reshapeDeclaredEntries(reshapeChanges(block, after));
		if (!declared.ok) throw new Error('expected entries');
		// the entries are what the save API accepts as `declared`
		for (const e of declared.entries) expect(ledgerEntrySchema.safeParse(e).success).toBe(true);
		const accepted = versionVerify(block, after, recipe, replay, declared.entries);
		expect(accepted.ok).toBe(true);
		// and each kind the pattern cutter may pick is accepted the same way
		const changes = reshapeChanges(block, after);
		for (const choice of ['ease', 'fullness', 'other'] as const) {
			const d = reshapeDeclaredEntries(changes, Object.fromEntries(changes.map((c) => [c.key, { choice, note: 'taken from the first fitting' }])));
			if (!d.ok) throw new Error('expected entries');
			expect(versionVerify(block, after, recipe, replay, d.entries).ok).toBe(true);
		}
	});

	it('dragging a dart leg end changes the shaping at the apex, which is proposed and accepted once declared', () => {
		const dart = block.darts.find((d) => d.id === 'shoulder-dart')!;
		const params = { moves: [{ from: dart.leg2End, to: { x: dart.leg2End.x + 8, y: dart.leg2End.y + 2 } }] };
		const after = reshaped(block, params);
		const changes = reshapeChanges(block, after);
		const apex = changes.find((c) => c.subject === 'apex');
		expect(apex?.apexId).toBe('bp');
		expect(apex?.label).toBe('Bust point: shaping');
		const before = pieceMetrics(block).apexTotals[0].totalAngleRad;
		const now = pieceMetrics(after).apexTotals[0].totalAngleRad;
		expect(apex?.difference).toBeCloseTo(now - before, 12);
		// a narrower dart takes less cloth away: it adds cloth
		expect(apex?.addsCloth).toBe(now < before);
		const recipe = [{ op: 'reshape', params }];
		expect(versionVerify(block, after, recipe, replay).ok).toBe(false);
		const declared = reshapeDeclaredEntries(changes);
		if (!declared.ok) throw new Error('expected entries');
		expect(versionVerify(block, after, recipe, replay, declared.entries).ok).toBe(true);
	});

	it('proposes a change exactly when the server would refuse it undeclared (its tolerances)', () => {
		// a 0.001 mm nudge of the side waist corner: seams within 0.05 mm, area within 0.5 mm² (0.06 mm²)
		const tiny = { moves: [{ from: sideWaist, to: { x: 225, y: 440.001 } }] };
		const a = reshaped(block, tiny);
		expect(reshapeChanges(block, a)).toEqual([]);
		expect(versionVerify(block, a, [{ op: 'reshape', params: tiny }], replay).ok).toBe(true);
		// 0.01 mm: the seams still within 0.05 mm, but about 0.6 mm² of area (the piece is 120 mm wide there)
		const small = { moves: [{ from: sideWaist, to: { x: 225, y: 440.01 } }] };
		const b = reshaped(block, small);
		const changes = reshapeChanges(block, b);
		expect(changes.map((c) => c.key)).toEqual(['area']);
		expect(versionVerify(block, b, [{ op: 'reshape', params: small }], replay).ok).toBe(false);
		const d = reshapeDeclaredEntries(changes);
		expect(d.ok && versionVerify(block, b, [{ op: 'reshape', params: small }], replay, d.entries).ok).toBe(true);
	});
});

describe('declaring the changes', () => {
	const block = frontBodiceBlock();
	const params = { moves: [{ from: { x: 225, y: 440 }, to: { x: 221, y: 436 } }] };
	const after = reshaped(block, params);
	const changes = reshapeChanges(block, after);

	it('posts each change once with the kind chosen, the sign kept, and says added or removed in the label', () => {
		const d = reshapeDeclaredEntries(changes, { area: { choice: 'fullness' } });
		if (!d.ok) throw new Error('expected entries');
		expect(d.entries).toHaveLength(changes.length);
		const area = d.entries.find((e) => e.refId === 'area')!;
		expect(area.kind).toBe('fullness');
		expect(area.areaMm2).toBeCloseTo(changes.find((c) => c.key === 'area')!.difference, 12);
		expect(area.label).toMatch(area.areaMm2 > 0 ? /^Added fullness by hand: area outside the darts/ : /^Removed fullness by hand: area outside the darts/);
		// the totals the server checks are exactly what the piece changed
		const mb = pieceMetrics(block);
		const ma = pieceMetrics(after);
		expect(d.entries.reduce((s, e) => s + e.lengthMm, 0)).toBeCloseTo(ma.seamLengthMm - mb.seamLengthMm, 9);
		expect(d.entries.reduce((s, e) => s + e.areaMm2, 0)).toBeCloseTo(ma.areaMm2 - mb.areaMm2, 9);
		expect(shapingChecks(block, after, d.entries).every((c) => c.passed)).toBe(true);
	});

	it('refuses "other" without a note, naming the change, and keeps the note when given', () => {
		const key = changes[0].key;
		const missing = reshapeDeclaredEntries(changes, { [key]: { choice: 'other', note: '   ' } });
		expect(missing).toEqual({ ok: false, missingNotes: [key] });
		const d = reshapeDeclaredEntries(changes, { [key]: { choice: 'other', note: ' lower hem for the toile ' } });
		if (!d.ok) throw new Error('expected entries');
		expect(d.entries[0]).toMatchObject({ kind: 'other', note: 'lower hem for the toile' });
	});
});

describe('the demo band reshaped by hand', () => {
	// the midriff band of the demo style (fixtures/demo-path.ts), as its v2 after grain and allowance
	const band = demoPath().pieces.find((p) => p.key === 'midriff-band')!.later[0].geometry;

	it('lowering a point of its lower edge by 20 mm: the lower edge and the area are proposed, and the server accepts them declared', () => {
		expect(seamNames(band, pieceMetrics(band).seams)).toContain('lower edge');
		// the lower edge runs (204.2, 439.9) → (129.6, 424.8) → (79.45, 416.6) → (0, 416.6) on the band
		const from = band.outline.segments[1].p0;
		const params = { moves: [{ from, to: { x: from.x, y: from.y + 20 } }] };
		// the two straight stretches beside it go from 50.8 + 79.5 to 51.5 + 81.9 mm (D): the edge gets longer
		const after = reshaped(band, params);
		const changes = reshapeChanges(band, after);
		// the moved point turns by more than 25° now: a corner, so the lower edge is two seams, shown as one change
		const edge = changes.find((c) => c.subject === 'seam');
		expect(edge?.label).toBe('Lower edge, now lower edge 1 and lower edge 2');
		expect(edge?.before).toBeCloseTo(206.37, 2);
		expect(edge?.addsCloth).toBe(true);
		expect(changes.filter((c) => c.subject === 'seam')).toHaveLength(1);
		expect(changes.find((c) => c.subject === 'area')!.difference).toBeGreaterThan(0);
		const recipe = [{ op: 'reshape', params }];
		expect(versionVerify(band, after, recipe, recipeStepApply).ok).toBe(false);
		const declared = reshapeDeclaredEntries(changes);
		if (!declared.ok) throw new Error('expected entries');
		expect(versionVerify(band, after, recipe, recipeStepApply, declared.entries).ok).toBe(true);
	});
});
