import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { unprintableCharacters } from '$lib/export/pdf-fonts';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { styleOverview } from '$lib/server/versions/overview';
import type { PageServerLoad } from './$types';

/** The print options page: paper, pieces, allowance, pairs; the download is a plain GET of export.pdf. */
export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const styleId = z.uuid().safeParse(event.params.styleId);
	if (!styleId.success) error(404, { message: 'No such style.', code: 'not_found' });
	const overview = await styleOverview(db(), studioId, styleId.data, role).catch(() => null);
	if (!overview) error(404, { message: 'No such style.', code: 'not_found' });
	const pieces = overview.pieces
		.filter((p) => p.shown)
		.map((p) => ({ id: p.id, name: p.name, cut: p.cut, fabric: p.fabric, version: p.shown!.number, state: p.shown!.state }));
	// characters of the labels that no part of the embedded font has: printed as '?', so the page warns
	const unprintable = unprintableCharacters([overview.style.name, overview.style.code ?? '', ...pieces.flatMap((p) => [p.name, p.fabric])]);
	return { style: { id: overview.style.id, name: overview.style.name, code: overview.style.code }, pieces, unprintable };
};
