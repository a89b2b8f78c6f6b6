// The client measurement set form: one text field per measurement, read in the chosen unit.
// Shared by the browser (live checks) and the server (the action validates again).
import { z } from 'zod';
import {
	clientReferenceSchema,
	lengthFieldRead,
	lengthFieldText,
	lengthParse,
	measurementDefinitions,
	measurementIds,
	type LengthUnit,
	type MeasurementId,
	type MeasurementsMm,
	type MeasurementValue
} from '$lib/pattern/measurements';

const lengthField = z.string().trim().max(24, 'Too long for a length.').default('');
const lengthFields = Object.fromEntries(measurementIds.map((id) => [id, lengthField])) as Record<MeasurementId, typeof lengthField>;

export const setFormSchema = z
	.object({
		name: z.string().trim().min(1, 'Name the set.').max(120, 'Keep the name under 120 characters.'),
		clientRef: z
			.string()
			.trim()
			.max(40, 'Keep the reference under 40 characters.')
			.default('')
			.superRefine((s, ctx) => {
				if (s === '') return;
				const r = clientReferenceSchema.safeParse(s);
				if (!r.success) ctx.addIssue({ code: 'custom', message: r.error.issues[0]?.message ?? 'Use a reference code.' });
			}),
		notes: z.string().max(2000, 'Keep the notes under 2,000 characters.').default(''),
		unit: z.enum(['mm', 'cm', 'in']).default('cm'),
		acceptWarnings: z.boolean().default(false),
		...lengthFields
	})
	.superRefine((f, ctx) => {
		for (const id of measurementIds) {
			const v = f[id];
			if (v === '') continue;
			const read = lengthFieldRead(measurementDefinitions[id].label, v, f.unit);
			if (!read.ok) ctx.addIssue({ code: 'custom', path: [id], message: read.message });
		}
		if (f.bust === '') ctx.addIssue({ code: 'custom', path: ['bust'], message: 'Bust girth is needed: the cup code, derived values and every draft start from it.' });
	});

export type SetForm = z.infer<typeof setFormSchema>;

/** The form's status message (superforms `message`). */
export type FormMessage = { kind: 'warnings' | 'errors'; text: string };

/** The typed values that read as lengths, in mm. */
export function formMm(f: Pick<SetForm, 'unit'> & Partial<Record<MeasurementId, string>>): MeasurementsMm {
	const out: MeasurementsMm = {};
	for (const id of measurementIds) {
		const v = f[id];
		if (!v) continue;
		const p = lengthParse(v, f.unit);
		if (p && p.mm > 0) out[id] = p.mm;
	}
	return out;
}

/**
 * A length in mm as a field value in a unit, exact: 867 → "86.7" (cm), 866.775 → "34 1/8" (in); a value the
 * unit cannot say exactly keeps a unit that can (920 mm in an inch form: "92 cm"). So switching the unit,
 * or opening a set to edit it, never changes a stored value.
 */
export function fieldText(mm: number, unit: LengthUnit): string {
	return lengthFieldText(mm, unit);
}

/** Form values of a stored set (for editing). */
export function formFromSet(set: { name: string; clientRef: string; notes: string; unit: LengthUnit; measurements: MeasurementValue[] }): SetForm {
	const values = Object.fromEntries(measurementIds.map((id) => [id, ''])) as Record<MeasurementId, string>;
	for (const m of set.measurements) {
		values[m.id] = set.unit === 'in' && m.printedInches ? m.printedInches : fieldText(m.valueMm, set.unit);
	}
	return { name: set.name, clientRef: set.clientRef, notes: set.notes, unit: set.unit, acceptWarnings: false, ...values };
}

/** The fields in the order a cutter takes them: girths, then lengths and widths. */
export const formOrder: MeasurementId[] = [
	'bust',
	'underbust',
	'waist',
	'hip',
	'upper_chest',
	'neck_base',
	'back_length',
	'front_length',
	'armhole_depth',
	'shoulder_length',
	'shoulder_to_bust_point',
	'across_back',
	'across_front',
	'bust_point_separation',
	'height'
];

export const definitions = measurementDefinitions;
