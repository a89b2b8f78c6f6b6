import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { versionsOfPiece } from '$lib/server/repositories/versions';
import { fitNoteShowsOn } from '$lib/fittings/notes';
import { fitNoteJson, fittingJson } from '$lib/server/fittings/view';
import { fitNotesOfPieces } from '$lib/server/repositories/fit-notes';
import { fittingsOfStyle } from '$lib/server/repositories/fittings';
import { measurementSetsOfStudio } from '$lib/server/repositories/measurement-sets';
import { sizeSetsOfStyleShown } from '$lib/server/size-sets/list';
import { seesOnlySignedOff } from '$lib/server/versions/access';
import { styleOverview } from '$lib/server/versions/overview';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const styleId = z.uuid().safeParse(event.params.styleId);
	if (!styleId.success) error(404, { message: 'No such style.', code: 'not_found' });
	const overview = await styleOverview(db(), studioId, styleId.data, role).catch(() => null);
	if (!overview) error(404, { message: 'No such style.', code: 'not_found' });
	const pieces = [];
	const notes = await fitNotesOfPieces(db(), overview.pieces.map((p) => p.id));
	for (const p of overview.pieces) {
		pieces.push({
			id: p.id,
			name: p.name,
			cut: p.cut,
			fabric: p.fabric,
			shown: p.shown ? { id: p.shown.id, number: p.shown.number, state: p.shown.state, geometry: pieceSchema.parse(p.shown.geometry), checks: p.shown.checks as { code: string; passed: boolean; message: string; warning?: boolean }[] } : null,
			versions: await versionsOfPiece(db(), p.id, seesOnlySignedOff(role)),
			// fit notes not yet done that show on the version shown (pins on its drawing)
			pins: p.shown ? notes.filter((n) => fitNoteShowsOn(n, p.id, p.shown!.number)).map(fitNoteJson) : []
		});
	}
	// the style's fittings (a timeline beside the versions) and who can be named as fitted
	const fittings = (await fittingsOfStyle(db(), styleId.data)).map((f) => ({
		...fittingJson(f),
		photoCount: Number(f.photoCount),
		noteCount: Number(f.noteCount),
		openNoteCount: Number(f.openNoteCount)
	}));
	const clientSets = (await measurementSetsOfStudio(db(), studioId)).filter((s) => s.kind === 'client').map((s) => ({ id: s.id, name: s.name }));
	// the style's size sets (kept size runs); the sample room sees those with a signed-off size
	const sizeSets = await sizeSetsOfStyleShown(db(), studioId, styleId.data, role);
	return { style: overview.style, pieces, seamPairs: overview.seamPairs, fittings, clientSets, sizeSets };
};
