import { measurementDefinitions, measurementIds, type LengthUnit } from '$lib/pattern/measurements';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { measurementSetsList } from '$lib/server/measurements';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, ALL_ROLES);
	const sets = await measurementSetsList(db(), studioId);
	const q = event.url.searchParams;
	const u = q.get('unit');
	const unit: LengthUnit = u === 'mm' || u === 'cm' || u === 'in' ? u : 'cm';
	const a = sets.find((s) => s.id === q.get('a')) ?? null;
	const b = sets.find((s) => s.id === q.get('b')) ?? null;
	const rows =
		a && b
			? measurementIds
					.map((id) => ({
						id,
						label: measurementDefinitions[id].label,
						a: a.measurements.find((m) => m.id === id)?.valueMm ?? null,
						b: b.measurements.find((m) => m.id === id)?.valueMm ?? null
					}))
					.filter((r) => r.a !== null || r.b !== null)
			: [];
	const side = (s: typeof a) =>
		s && { id: s.id, name: s.name, kindLabel: s.kindLabel, source: s.source, clientRef: s.clientRef, cup: s.cupCode?.code ?? null };
	return { unit, a: side(a), b: side(b), rows, options: sets.map((s) => ({ id: s.id, name: s.name })) };
};
