import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { piecesOfStyle } from '$lib/server/repositories/pieces';
import { versionsOfPiece } from '$lib/server/repositories/versions';
import { seesOnlySignedOff, styleOr404 } from '$lib/server/versions/access';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const styleId = z.uuid().safeParse(event.params.styleId);
	if (!styleId.success) error(404, { message: 'No such style.', code: 'not_found' });
	const style = await styleOr404(db(), studioId, styleId.data).catch(() => null);
	if (!style) error(404, { message: 'No such style.', code: 'not_found' });
	const pieces = [];
	for (const p of await piecesOfStyle(db(), style.id)) {
		const versions = await versionsOfPiece(db(), p.id, seesOnlySignedOff(role));
		if (versions.length) pieces.push({ id: p.id, name: p.name, versions: versions.map((v) => ({ id: v.id, number: v.number, message: v.message, state: v.state })) });
	}
	return { style: { id: style.id, name: style.name }, pieces };
};
