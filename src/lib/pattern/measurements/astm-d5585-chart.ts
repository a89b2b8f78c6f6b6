import Fraction from 'fraction.js';
import { mmFromInchFraction } from './units';
import { measurementSetSchema, type MeasurementSet, type MeasurementValue } from './measurement-set';
import type { MeasurementId } from './measurement-ids';

/**
 * ASTM D5585-11e1, Table 1 (inches), misses sizes 00–20, as reproduced on the standard's summary
 * page (reference-values row 1, status C for these rows only). The inch values are kept exactly as
 * printed; millimetres are computed (× 25.4). The standard's own metric table is separate and is
 * NOT derived from these rows.
 */
export const ASTM_D5585_SOURCE = { standard: 'ASTM D5585-11e1', table: 'Table 1 (inches), misses' } as const;

export const astmD5585Sizes = ['00', '0', '2', '4', '6', '8', '10', '12', '14', '16', '18', '20'] as const;
export type AstmD5585Size = (typeof astmD5585Sizes)[number];

/** Columns as printed, one entry per size in the order of astmD5585Sizes. */
export const astmD5585Rows = {
	bust: ['31 1/8', '31 3/4', '33', '34 1/8', '35 1/4', '36 1/4', '37 1/4', '38 3/4', '40 3/8', '42 1/8', '44', '46'],
	underbust: ['25 3/4', '26 1/2', '27 1/4', '28', '29', '30', '31', '32 1/2', '34', '35 3/4', '37 5/8', '39 5/8'],
	waistCurvy: ['23 7/8', '24 5/8', '25 3/8', '26 1/8', '27', '28', '29', '30 3/4', '32 1/2', '34 1/2', '36 3/4', '39'],
	waistStraight: ['25 3/8', '26 1/8', '26 7/8', '27 5/8', '28 1/2', '29 1/2', '30 1/2', '32 1/4', '34', '36', '38 1/4', '40 1/2'],
	neckBase: ['13 1/4', '13 1/2', '13 3/4', '14', '14 1/4', '14 5/8', '14 7/8', '15 1/8', '15 1/2', '15 3/4', '16', '16 3/8'],
	upperChest: ['31 3/4', '32 1/4', '33 1/4', '34 1/8', '35', '35 7/8', '36 3/4', '38', '39 1/4', '40 5/8', '42 1/4', '43 7/8']
} as const;

export type AstmD5585Chart = 'curvy' | 'straight';

export const astmD5585Charts: readonly { id: AstmD5585Chart; name: string; variant: string }[] = [
	{ id: 'curvy', name: 'ASTM D5585 misses, curvy waist', variant: 'curvy waist' },
	{ id: 'straight', name: 'ASTM D5585 misses, straight waist', variant: 'straight waist' }
];

function chartValue(id: MeasurementId, printed: string): MeasurementValue {
	return { id, valueMm: mmFromInchFraction(new Fraction(printed)), derived: false, status: 'C', printedInches: printed };
}

/** The chart's own values for one size (no derived values). */
export function astmD5585MeasurementSet(chart: AstmD5585Chart, size: AstmD5585Size): MeasurementSet {
	const i = astmD5585Sizes.indexOf(size);
	if (i < 0) throw new Error(`size "${size}" is not in ASTM D5585 Table 1 (misses)`);
	const meta = astmD5585Charts.find((c) => c.id === chart)!;
	const r = astmD5585Rows;
	return measurementSetSchema.parse({
		kind: 'chart',
		name: `${meta.name}, size ${size}`,
		source: { ...ASTM_D5585_SOURCE, size, variant: meta.variant },
		notes: 'Chart values in inches as printed; converted to mm (× 25.4).',
		unitPreference: 'in',
		measurements: [
			chartValue('bust', r.bust[i]),
			chartValue('underbust', r.underbust[i]),
			chartValue('waist', chart === 'curvy' ? r.waistCurvy[i] : r.waistStraight[i]),
			chartValue('neck_base', r.neckBase[i]),
			chartValue('upper_chest', r.upperChest[i])
		]
	});
}

/** Every size of both charts. */
export function astmD5585AllSets(): MeasurementSet[] {
	return astmD5585Charts.flatMap((c) => astmD5585Sizes.map((s) => astmD5585MeasurementSet(c.id, s)));
}
