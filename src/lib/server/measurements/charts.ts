import { astmD5585Charts, astmD5585MeasurementSet, astmD5585Sizes } from '../../pattern/measurements';
import type { Db, DbOrTx } from '../db';
import { measurementSetsChartCount, measurementSetsInsertCharts, type MeasurementSetInsert } from '../repositories/measurement-sets';

/**
 * Published size charts every studio has, read-only: ASTM D5585-11e1 Table 1 (inches), misses,
 * sizes 00–20, curvy and straight waist (24 sets). Only the chart's own values are stored; values a
 * draft needs beyond them are derived when shown or drafted, flagged as derived with their rule.
 *
 * Where they come from: studios are created outside this module (sign-up, "new studio"), so the
 * charts are seeded LAZILY, the first time a studio's measurement sets are listed or a block is
 * drafted (`measurementChartsEnsure`), and by the demo seed. Seeding is idempotent: each chart row
 * has a stable key, unique per studio, and inserting an existing key does nothing.
 */
export function chartSetsFor(studioId: string): MeasurementSetInsert[] {
	const out: MeasurementSetInsert[] = [];
	let order = 0;
	for (const chart of astmD5585Charts) {
		for (const size of astmD5585Sizes) {
			const set = astmD5585MeasurementSet(chart.id, size);
			if (set.kind !== 'chart') continue;
			const s = set.source;
			out.push({
				studioId,
				name: set.name,
				kind: 'chart',
				source: `${s.standard}, ${s.table}, size ${s.size}${s.variant ? `, ${s.variant}` : ''}`,
				notes: set.notes,
				unit: set.unitPreference,
				readOnly: true,
				values: set.measurements,
				chartKey: `astm-d5585/${chart.id}/${size}`,
				chartSource: { standard: s.standard, table: s.table, size: s.size, ...(s.variant ? { variant: s.variant } : {}) },
				sortOrder: order++,
				createdBy: null
			});
		}
	}
	return out;
}

export const CHART_SET_COUNT = astmD5585Charts.length * astmD5585Sizes.length;

/** Seeds the studio's read-only charts; returns how many rows were added (0 on a second run). */
export async function measurementChartsSeed(tx: DbOrTx, studioId: string): Promise<number> {
	return measurementSetsInsertCharts(tx, chartSetsFor(studioId));
}

/** Seeds the charts when the studio does not have them all yet (cheap count first). */
export async function measurementChartsEnsure(db: Db | DbOrTx, studioId: string): Promise<void> {
	if ((await measurementSetsChartCount(db, studioId)) >= CHART_SET_COUNT) return;
	await measurementChartsSeed(db, studioId);
}
