import { fail, redirect } from '@sveltejs/kit';
import { EASE_DEFAULT, EASE_SOURCE } from '$lib/pattern/drafting';
import { EDITORS, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { ApiError } from '$lib/server/http-errors';
import { blockDraftIntoStyle, blockDraftRequestSchema, measurementSetsList } from '$lib/server/measurements';
import { formObject } from '$lib/server/validation';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { studioId } = await requireRole(event, EDITORS);
	const sets = await measurementSetsList(db(), studioId);
	const wanted = event.url.searchParams.get('set');
	return {
		sets: sets.map((s) => ({
			id: s.id,
			name: s.name,
			kind: s.kindLabel,
			origin: s.kind === 'chart' ? s.source : s.clientRef ? `client ${s.clientRef}` : s.source,
			waistMm: s.measurements.find((m) => m.id === 'waist')?.valueMm ?? s.derived.find((d) => d.id === 'waist')?.valueMm ?? null,
			hasBust: s.measurements.some((m) => m.id === 'bust'),
			derivedCount: s.derived.length
		})),
		selected: sets.some((s) => s.id === wanted) ? wanted : null,
		easeDefault: EASE_DEFAULT,
		easeSource: EASE_SOURCE
	};
};

const num = (v: string | undefined) => (v === undefined || v.trim() === '' ? undefined : Number(v.trim().replace(',', '.').replace('−', '-')));

export const actions: Actions = {
	default: async (event) => {
		const { studioId, user } = await requireRole(event, EDITORS);
		const raw = formObject(await event.request.formData());
		const under = raw.underStructure === '4' ? 4 : raw.underStructure === '6' ? 6 : 'none';
		const parsed = blockDraftRequestSchema.safeParse({
			measurementSetId: raw.measurementSetId ?? '',
			name: raw.name ?? '',
			code: raw.code ?? '',
			season: raw.season ?? '',
			ease: { bustMm: num(raw.easeBust), waistMm: num(raw.easeWaist), underbustMm: num(raw.easeUnderbust) },
			options: { bustDart: raw.bustDart || undefined, frontCut: raw.frontCut || undefined, backCut: raw.backCut || undefined, underStructure: under }
		});
		if (!parsed.success) {
			const errors: Record<string, string[]> = {};
			for (const i of parsed.error.issues) (errors[i.path.join('.')] ??= []).push(i.message);
			return fail(400, { values: raw, errors, message: 'Some fields need attention.' });
		}
		let styleId: string;
		try {
			styleId = (await blockDraftIntoStyle(db(), studioId, user.id, parsed.data)).style.id;
		} catch (e) {
			if (e instanceof ApiError && e.status < 500) {
				return fail(e.status, { values: raw, errors: (e.fields ?? {}) as Record<string, string[]>, message: e.message });
			}
			throw e;
		}
		redirect(303, `/studios/${studioId}/styles/${styleId}`);
	}
};
