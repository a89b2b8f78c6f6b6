import { fail, redirect } from '@sveltejs/kit';
import { message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { measurementIds, type MeasurementId } from '$lib/pattern/measurements';
import type { Db } from '$lib/server/db';
import { measurementSetsCreate, measurementSetsUpdate } from '$lib/server/repositories/measurement-sets';
import { setView, valuesCheck } from '$lib/server/measurements';
import { setFormSchema, type FormMessage, type SetForm } from './set-form';

/**
 * Validates the posted form, reads the values in the chosen unit, checks plausibility (errors refuse;
 * warnings refuse until confirmed), then creates the set (`setId` absent) or updates it, and
 * redirects to the set's page.
 */
export async function setFormSave(
	db: Db,
	request: Request,
	ctx: { studioId: string; userId: string; setId?: string }
) {
	const form = await superValidate<SetForm, FormMessage>(request, zod4(setFormSchema));
	if (!form.valid) return fail(400, { form });
	const f = form.data;
	const values = Object.fromEntries(measurementIds.map((id) => [id, f[id]])) as Record<MeasurementId, string>;
	const check = valuesCheck(values, f.unit, f.acceptWarnings);
	if (!check.ok) {
		for (const [id, msgs] of Object.entries(check.fields)) {
			if (id && msgs) setError(form, id as MeasurementId, msgs);
		}
		form.data.acceptWarnings = false;
		return message(
			form,
			{
				kind: check.warningsOnly ? 'warnings' : 'errors',
				text: check.warningsOnly
					? 'Some values are outside the usual range. Check them; if they are right as typed, tick “These values are right” and save again.'
					: 'Some values cannot be right. Correct them and save again.'
			},
			{ status: check.status }
		);
	}
	let id = ctx.setId;
	if (id) {
		const updated = await measurementSetsUpdate(db, ctx.studioId, id, {
			name: f.name,
			clientRef: f.clientRef,
			notes: f.notes,
			unit: f.unit,
			values: check.measurements
		});
		if (!updated) return fail(409, { form });
	} else {
		const created = await measurementSetsCreate(db, {
			studioId: ctx.studioId,
			name: f.name,
			kind: 'client',
			clientRef: f.clientRef,
			notes: f.notes,
			unit: f.unit,
			values: check.measurements,
			createdBy: ctx.userId
		});
		id = setView(created).id;
	}
	redirect(303, `/studios/${ctx.studioId}/measurements/${id}`);
}
