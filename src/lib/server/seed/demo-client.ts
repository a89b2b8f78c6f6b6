import type { MeasurementValue } from '$lib/pattern/measurements';
import type { Db } from '../db';
import { measurementSetsCreate, measurementSetsOfStudio } from '../repositories/measurement-sets';

/**
 * The demo studio's one made-to-measure client (invented, referred to by code as every client is): her
 * measurements start from the ASTM D5585 curvy size 12 chart row and differ where a real client's would,
 * so a size run over "five sizes and one client" has a set of each kind. Idempotent: skipped when the
 * studio already has a set with this reference.
 */
export const DEMO_CLIENT_REF = 'LR-C014';
const FROM_CHART_KEY = 'astm-d5585/curvy/12';
/** Invented differences from the chart row, in mm: a fuller bust on a slightly smaller waist. */
const DIFFERENCES_MM: Readonly<Record<string, number>> = { bust: 25, underbust: 10, waist: -15, hip: 5 };

export async function demoClientSeed(db: Db, studioId: string, createdBy: string): Promise<void> {
	const sets = await measurementSetsOfStudio(db, studioId);
	if (sets.some((s) => s.clientRef === DEMO_CLIENT_REF)) return;
	const chart = sets.find((s) => s.chartKey === FROM_CHART_KEY);
	if (!chart) throw new Error(`Demo client: the studio has no chart set "${FROM_CHART_KEY}".`);
	const values: MeasurementValue[] = chart.values
		.filter((v) => !v.derived)
		.map(({ printedInches: _printed, status: _status, ...v }) => ({ ...v, valueMm: v.valueMm + (DIFFERENCES_MM[v.id] ?? 0) }));
	await measurementSetsCreate(db, {
		studioId,
		name: `Client ${DEMO_CLIENT_REF} (invented)`,
		kind: 'client',
		clientRef: DEMO_CLIENT_REF,
		source: 'measured in the studio (demo: invented from ASTM D5585 curvy size 12 with a fuller bust)',
		notes: 'Demo client of our own scenario; no real person.',
		unit: chart.unit,
		values,
		createdBy
	});
}
