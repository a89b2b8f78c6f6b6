import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from './fixtures/front-bodice-block';
import { ledgerEntry, ledgerEntrySchema, shapingChecks } from './ledger';
import { pieceMetrics, type PieceMetrics } from './metrics';

describe('labelled changes of kind "other"', () => {
	const base = { apexId: null, kind: 'other', refId: 'area', label: 'reshaped by hand', angleRad: 0, areaMm2: 120 };

	it('need a note saying what they are', () => {
		const none = ledgerEntrySchema.safeParse(base);
		expect(none.success).toBe(false);
		expect(none.error?.issues[0].path).toEqual(['note']);
		expect(ledgerEntrySchema.safeParse({ ...base, note: '   ' }).success).toBe(false);
		const ok = ledgerEntrySchema.safeParse({ ...base, note: ' toile too short at the hem ' });
		expect(ok.success && ok.data.note).toBe('toile too short at the hem');
	});

	it('other kinds may carry a note, and need none', () => {
		expect(ledgerEntrySchema.safeParse({ ...base, kind: 'fullness' }).success).toBe(true);
		expect(ledgerEntrySchema.safeParse({ ...base, kind: 'removed_ease', note: 'after the first fitting' }).success).toBe(true);
	});
});

describe('seams checked one by one', () => {
	const before = pieceMetrics(frontBodiceBlock());
	// one seam 3 mm longer, another 3 mm shorter: the total is kept, the seams are not
	const after: PieceMetrics = {
		...before,
		seams: before.seams.map((s, i) => (i === 0 ? { ...s, lengthMm: s.lengthMm + 3 } : i === 1 ? { ...s, lengthMm: s.lengthMm - 3 } : s))
	};
	const each = (entries: Parameters<typeof shapingChecks>[2]) => shapingChecks(before, after, entries).find((c) => c.code === 'seam_lengths_each');

	it('refuse a seam lengthened and another shortened by as much, undeclared', () => {
		expect(each([])?.passed).toBe(false);
	});

	it('accept them once both changes are declared, the total still kept', () => {
		const entries = [
			ledgerEntry({ apexId: null, kind: 'removed_ease', refId: 'seam:0', label: 'added ease', angleRad: 0, lengthMm: 3 }),
			ledgerEntry({ apexId: null, kind: 'fullness', refId: 'seam:1', label: 'removed fullness', angleRad: 0, lengthMm: -3 })
		];
		expect(shapingChecks(before, after, entries).every((c) => c.passed)).toBe(true);
	});

	it('refuse two seams changed by 20 mm each way when only 3 mm of change is declared', () => {
		const far: PieceMetrics = {
			...before,
			seams: before.seams.map((s, i) => (i === 0 ? { ...s, lengthMm: s.lengthMm + 20 } : i === 1 ? { ...s, lengthMm: s.lengthMm - 20 } : s))
		};
		const entries = [ledgerEntry({ apexId: null, kind: 'removed_ease', refId: 'seam:0', label: 'added ease', angleRad: 0, lengthMm: 3 }), ledgerEntry({ apexId: null, kind: 'removed_ease', refId: 'seam:1', label: 'removed ease', angleRad: 0, lengthMm: -3 })];
		const check = shapingChecks(before, far, entries).find((c) => c.code === 'seam_lengths_each');
		expect(check?.passed).toBe(false);
		expect(check?.message).toMatch(/declared changes account for 6\.00 mm/);
	});
});
