import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { DRAFT_READERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetsOfStudio } from '$lib/server/repositories/measurement-sets';
import { sizeRunsOfStyle } from '$lib/server/repositories/size-runs';
import { stylesInStudio } from '$lib/server/repositories/styles';
import { measurementChartsEnsure } from '$lib/server/measurements/charts';
import { sizeRunView } from '$lib/server/size-runs/service';
import type { PageServerLoad } from './$types';

/** A style's size runs, and the measurement sets a new run can be made over. */
export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, DRAFT_READERS);
	const styleId = z.uuid().safeParse(event.params.styleId);
	const style = styleId.success ? await stylesInStudio(db(), studioId, styleId.data) : undefined;
	if (!style) error(404, { message: 'No such style.', code: 'not_found' });
	await measurementChartsEnsure(db(), studioId);
	const sets = (await measurementSetsOfStudio(db(), studioId)).map((s) => ({ id: s.id, name: s.name, kind: s.kind, isBase: s.id === style.measurementSetId }));
	const runs = (await sizeRunsOfStyle(db(), studioId, style.id)).map(sizeRunView);
	return { style: { id: style.id, name: style.name, code: style.code }, sets, runs };
};
