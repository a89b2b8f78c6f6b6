import type { LengthUnit } from '$lib/pattern/measurements/units';
import type { DbOrTx } from '../db';
import { measurementSetsInStudio } from '../repositories/measurement-sets';

/**
 * The unit fit-note amounts are read in where no person has chosen one: the first of these measurement
 * sets that exists (the fitted client's set, then the style's own), else millimetres. Each note carries
 * the same rule as `unit` (repositories/fit-notes.ts).
 */
export async function fitNotesUnit(db: DbOrTx, studioId: string, setIds: readonly (string | null | undefined)[]): Promise<LengthUnit> {
	for (const id of setIds) {
		if (!id) continue;
		const set = await measurementSetsInStudio(db, studioId, id);
		if (set) return set.unit;
	}
	return 'mm';
}
