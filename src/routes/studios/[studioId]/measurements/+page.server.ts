import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetsList } from '$lib/server/measurements';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const sets = await measurementSetsList(db(), studioId);
	const mmOf = (s: (typeof sets)[number], id: string) => s.measurements.find((m) => m.id === id)?.valueMm ?? null;
	return {
		sets: sets.map((s) => ({
			id: s.id,
			name: s.name,
			kind: s.kindLabel,
			origin: s.kind === 'chart' && s.chartSource ? `${s.chartSource.standard}, ${s.chartSource.table}` : s.clientRef ? `client ${s.clientRef}` : s.source || 'own measurements',
			size: s.chartSource?.size ?? '',
			bust: mmOf(s, 'bust'),
			underbust: mmOf(s, 'underbust'),
			waist: mmOf(s, 'waist'),
			hip: mmOf(s, 'hip'),
			cup: s.cupCode?.code ?? '',
			count: s.measurements.length,
			updatedAt: s.updatedAt,
			sortOrder: s.kind === 'chart' ? sets.indexOf(s) : 1000
		}))
	};
};
