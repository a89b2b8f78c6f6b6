import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { fittingDetail } from '$lib/server/fittings/fittings';
import { fitNotesUnit } from '$lib/server/fittings/unit';
import { membershipsOfStudio } from '$lib/server/repositories/memberships';
import { stylesInStudio } from '$lib/server/repositories/styles';
import { versionsById } from '$lib/server/repositories/versions';
import { seesOnlySignedOff } from '$lib/server/versions/access';
import { styleOverview } from '$lib/server/versions/overview';
import type { PageServerLoad } from './$types';

/** A fitting: its photos, its notes, and the piece versions a note can be pinned on. */
export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const fittingId = z.uuid().safeParse(event.params.fittingId);
	if (!fittingId.success) error(404, { message: 'No such fitting.', code: 'not_found' });
	const fitting = await fittingDetail(db(), studioId, fittingId.data).catch(() => null);
	if (!fitting) error(404, { message: 'No such fitting.', code: 'not_found' });
	const style = await stylesInStudio(db(), studioId, fitting.styleId);
	if (!style) error(404, { message: 'No such fitting.', code: 'not_found' });
	// pin targets: the versions the toile was cut from, else each piece's version this role sees now
	let targets: { pieceId: string; pieceName: string; versionId: string; number: number; geometry: unknown }[] = [];
	if (fitting.versions.length > 0) {
		for (const v of fitting.versions) {
			if (seesOnlySignedOff(role) && v.state !== 'signed_off') continue;
			const row = await versionsById(db(), v.pieceId, v.versionId);
			if (row) targets.push({ pieceId: v.pieceId, pieceName: v.pieceName, versionId: v.versionId, number: v.number, geometry: row.geometry });
		}
	} else {
		const overview = await styleOverview(db(), studioId, style.id, role);
		targets = overview.pieces.flatMap((p) => (p.shown ? [{ pieceId: p.id, pieceName: p.name, versionId: p.shown.id, number: p.shown.number, geometry: p.shown.geometry }] : []));
	}
	const assignees = (await membershipsOfStudio(db(), studioId)).filter((m) => m.role === 'patterncutter' || m.role === 'owner').map((m) => ({ id: m.userId, name: m.name }));
	return {
		fitting,
		style: { id: style.id, name: style.name, code: style.code },
		targets: targets.map((t) => ({ ...t, geometry: pieceSchema.parse(t.geometry) })),
		assignees,
		// amounts are shown and typed in this unit unless the person chose one (the fitted set's, else the style's)
		unit: await fitNotesUnit(db(), studioId, [fitting.measurementSetId, style.measurementSetId])
	};
};
