import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { DRAFT_READERS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { sizeRunsById } from '$lib/server/repositories/size-runs';
import { sizeSetsOfRun } from '$lib/server/repositories/size-sets';
import { stylesInStudio } from '$lib/server/repositories/styles';
import { runPageBase, runPageNest, runPagePieces } from '$lib/server/size-runs/run-page';
import { sizeRunView } from '$lib/server/size-runs/service';
import type { PageServerLoad } from './$types';

/**
 * One size run: its progress (the page follows the job), what each size gave, the base size's pieces
 * measured here for the differences, and the chosen piece (`?piece=`) as every size made it, for the nest.
 */
export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, DRAFT_READERS);
	const id = z.uuid().safeParse(event.params.sizeRunId);
	const run = id.success ? await sizeRunsById(db(), studioId, id.data) : undefined;
	if (!run) error(404, { message: 'No such size run.', code: 'not_found' });
	const style = await stylesInStudio(db(), studioId, run.styleId);
	if (!style) error(404, { message: 'No such size run.', code: 'not_found' });
	const pieces = await runPagePieces(db(), run);
	const asked = z.uuid().safeParse(event.url.searchParams.get('piece'));
	const pieceId = (asked.success ? pieces.find((p) => p.pieceId === asked.data) : pieces[0])?.pieceId ?? null;
	// the size set this run was kept as, if it was
	const keptSizeSetId = (await sizeSetsOfRun(db(), run.id))?.id ?? null;
	return {
		keptSizeSetId,
		style: { id: style.id, name: style.name },
		sizeRun: JSON.parse(JSON.stringify(sizeRunView(run))) as ReturnType<typeof sizeRunView>,
		pieces,
		base: await runPageBase(db(), run, style.measurementSetId, pieces),
		nest: pieceId ? await runPageNest(db(), run, pieceId) : null
	};
};
