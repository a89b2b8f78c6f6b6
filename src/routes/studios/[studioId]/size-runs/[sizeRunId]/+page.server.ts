import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { DRAFT_READERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { sizeRunsById } from '$lib/server/repositories/size-runs';
import { stylesInStudio } from '$lib/server/repositories/styles';
import { sizeRunView } from '$lib/server/size-runs/service';
import type { PageServerLoad } from './$types';

/** One size run: its progress (the page follows the job) and what each size gave. */
export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, DRAFT_READERS);
	const id = z.uuid().safeParse(event.params.sizeRunId);
	const run = id.success ? await sizeRunsById(db(), studioId, id.data) : undefined;
	if (!run) error(404, { message: 'No such size run.', code: 'not_found' });
	const style = await stylesInStudio(db(), studioId, run.styleId);
	if (!style) error(404, { message: 'No such size run.', code: 'not_found' });
	return { style: { id: style.id, name: style.name }, sizeRun: JSON.parse(JSON.stringify(sizeRunView(run))) as ReturnType<typeof sizeRunView> };
};
