import { describe, expect, it } from 'vitest';
import {
	astmD5585AllSets,
	astmD5585MeasurementSet,
	astmD5585Rows,
	astmD5585Sizes,
	measurementDefinitions,
	measurementIds,
	measurementSetSchema,
	measurementSetWithDerived,
	measurementsMm
} from './index';

describe('ASTM D5585-11e1 Table 1 seed (reference-values row 1, C)', () => {
	it('has the 12 misses sizes and every printed column', () => {
		expect(astmD5585Sizes).toEqual(['00', '0', '2', '4', '6', '8', '10', '12', '14', '16', '18', '20']);
		for (const col of Object.values(astmD5585Rows)) expect(col).toHaveLength(12);
	});
	it('keeps the inch values as printed and converts exactly (× 25.4)', () => {
		// ASTM D5585-11e1 Table 1, size 4: bust 34⅛, under-bust 28, waist curvy 26⅛, straight 27⅝, neck 14, upper chest 34⅛ (row 1, C)
		const curvy = astmD5585MeasurementSet('curvy', '4');
		const byId = Object.fromEntries(curvy.measurements.map((m) => [m.id, m]));
		expect(byId.bust.printedInches).toBe('34 1/8');
		expect(byId.bust.valueMm).toBeCloseTo(34.125 * 25.4, 9);
		expect(byId.underbust.valueMm).toBeCloseTo(28 * 25.4, 9);
		expect(byId.waist.valueMm).toBeCloseTo(26.125 * 25.4, 9);
		expect(byId.neck_base.valueMm).toBeCloseTo(14 * 25.4, 9);
		expect(byId.upper_chest.valueMm).toBeCloseTo(34.125 * 25.4, 9);
		const straight = measurementsMm(astmD5585MeasurementSet('straight', '4'));
		expect(straight.waist).toBeCloseTo(27.625 * 25.4, 9);
		// size 20: bust 46, under-bust 39⅝, waist curvy 39, straight 40½ (row 1, C)
		expect(measurementsMm(astmD5585MeasurementSet('curvy', '20')).underbust).toBeCloseTo(39.625 * 25.4, 9);
		expect(measurementsMm(astmD5585MeasurementSet('straight', '20')).waist).toBeCloseTo(40.5 * 25.4, 9);
	});
	it('names its source on every set and has two charts', () => {
		const all = astmD5585AllSets();
		expect(all).toHaveLength(24);
		for (const s of all) {
			expect(s.kind).toBe('chart');
			if (s.kind === 'chart') expect(s.source.standard).toBe('ASTM D5585-11e1');
			expect(s.measurements.every((m) => !m.derived && m.status === 'C')).toBe(true);
		}
	});
});

describe('derived measurements (rules of thumb, M)', () => {
	it('marks every derived value with its rule and never replaces chart values', () => {
		const set = measurementSetWithDerived(astmD5585MeasurementSet('curvy', '12'));
		const chartIds = ['bust', 'underbust', 'waist', 'neck_base', 'upper_chest'];
		for (const m of set.measurements) {
			if (chartIds.includes(m.id)) expect(m.derived).toBe(false);
			else {
				expect(m.derived).toBe(true);
				expect(m.rule).toMatch(/rule of thumb, M; not from the chart/);
				expect(m.status).toBe('M');
			}
		}
		expect(set.measurements.map((m) => m.id)).toContain('back_length');
	});
	it('stays inside the loose bounds of row 7 for misses 8–14 (M, bounds only)', () => {
		// Row 7 (M, bounds only): bust-point spacing ≈ 170–200 mm; side neck point to apex ≈ 240–270 mm for misses 8–14.
		for (const size of ['8', '10', '12', '14'] as const) {
			const m = measurementsMm(measurementSetWithDerived(astmD5585MeasurementSet('curvy', size)));
			expect(m.bust_point_separation).toBeGreaterThanOrEqual(170);
			expect(m.bust_point_separation).toBeLessThanOrEqual(200);
			expect(m.shoulder_to_bust_point).toBeGreaterThanOrEqual(240);
			expect(m.shoulder_to_bust_point).toBeLessThanOrEqual(270);
		}
	});
});

describe('measurement set model', () => {
	it('has a definition for every id', () => {
		for (const id of measurementIds) expect(measurementDefinitions[id].definition.length).toBeGreaterThan(20);
		// EN 13402-1 / ISO 8559-1 bust girth (row 5, C paraphrase): largest horizontal girth, under the arms, over the bust prominence.
		expect(measurementDefinitions.bust.definition).toMatch(/largest horizontal girth/);
		expect(measurementDefinitions.bust.definition).toMatch(/under the arms/);
	});
	it('accepts a client set with a reference code and refuses a name', () => {
		const base = { kind: 'client' as const, name: 'Fitting 1', measurements: [{ id: 'bust' as const, valueMm: 900 }] };
		expect(measurementSetSchema.safeParse({ ...base, clientRef: 'C-0042' }).success).toBe(true);
		expect(measurementSetSchema.safeParse({ ...base, clientRef: 'Jane Doe' }).success).toBe(false);
		expect(measurementSetSchema.safeParse({ ...base, clientRef: 'Jane' }).success).toBe(false);
	});
	it('refuses duplicates, non-positive values and derived values without a rule', () => {
		const base = { kind: 'client' as const, name: 'x', clientRef: 'C-1' };
		expect(measurementSetSchema.safeParse({ ...base, measurements: [{ id: 'bust', valueMm: 900 }, { id: 'bust', valueMm: 901 }] }).success).toBe(false);
		expect(measurementSetSchema.safeParse({ ...base, measurements: [{ id: 'bust', valueMm: -1 }] }).success).toBe(false);
		expect(measurementSetSchema.safeParse({ ...base, measurements: [{ id: 'hip', valueMm: 950, derived: true }] }).success).toBe(false);
		const ok = measurementSetSchema.parse({ ...base, measurements: [{ id: 'bust', valueMm: 900 }] });
		expect(ok.unitPreference).toBe('cm');
	});
});
