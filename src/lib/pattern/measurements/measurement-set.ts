import { z } from 'zod';
import { measurementIds, type MeasurementId } from './measurement-ids';

/** Status marks of a value's source (see shared reference-values: C, S, P, CP, M, D). */
export const sourceStatusSchema = z.enum(['C', 'S', 'P', 'CP', 'M', 'D']);
export type SourceStatus = z.infer<typeof sourceStatusSchema>;

export const measurementIdSchema = z.enum(measurementIds);

const positiveMm = z.number().refine((n) => Number.isFinite(n) && n > 0, { message: 'must be a positive length in mm' });

/**
 * One measurement. `derived: true` means it was not measured nor given by the chart: it was
 * computed by a stated proportional rule (`rule`), which is a rule of thumb unless said otherwise.
 */
export const measurementValueSchema = z
	.object({
		id: measurementIdSchema,
		valueMm: positiveMm,
		derived: z.boolean().default(false),
		rule: z.string().max(400).optional(),
		status: sourceStatusSchema.optional(),
		/** For chart values given in inches: the exact value as printed, e.g. "31 1/8". */
		printedInches: z.string().max(16).optional()
	})
	.refine((m) => !m.derived || (m.rule !== undefined && m.rule.length > 0), {
		message: 'a derived measurement must state its rule',
		path: ['rule']
	});

export const unitPreferenceSchema = z.enum(['mm', 'cm', 'in']);

export const chartSourceSchema = z.object({
	standard: z.string().min(1).max(120),
	table: z.string().min(1).max(120),
	size: z.string().min(1).max(20),
	variant: z.string().max(60).optional()
});

/**
 * A client is referred to by a studio reference code, never by name: letters, digits, '.', '_' or
 * '-', no spaces, at least one digit (e.g. "C-0042").
 */
export const clientReferenceSchema = z
	.string()
	.regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,39}$/, { message: 'use a reference code (letters, digits, - _ .), not a name' })
	.refine((s) => /\d/.test(s), { message: 'a client reference must contain a digit (use a code, not a name)' });

const measurementListSchema = z.array(measurementValueSchema).superRefine((list, ctx) => {
	const seen = new Set<string>();
	for (const [i, m] of list.entries()) {
		if (seen.has(m.id)) ctx.addIssue({ code: 'custom', message: `measurement "${m.id}" is given twice`, path: [i, 'id'] });
		seen.add(m.id);
	}
});

const common = {
	name: z.string().min(1).max(120),
	notes: z.string().max(2000).default(''),
	unitPreference: unitPreferenceSchema.default('cm'),
	measurements: measurementListSchema
};

export const measurementSetSchema = z.discriminatedUnion('kind', [
	z.object({ kind: z.literal('chart'), source: chartSourceSchema, ...common }),
	z.object({ kind: z.literal('client'), clientRef: clientReferenceSchema, ...common })
]);

export type MeasurementValue = z.infer<typeof measurementValueSchema>;
export type MeasurementSet = z.infer<typeof measurementSetSchema>;
export type MeasurementSetInput = z.input<typeof measurementSetSchema>;
export type ChartSource = z.infer<typeof chartSourceSchema>;

/** Measurements keyed by id, in mm (only those present). */
export type MeasurementsMm = Partial<Record<MeasurementId, number>>;

export function measurementsMm(set: MeasurementSet): MeasurementsMm {
	const out: MeasurementsMm = {};
	for (const m of set.measurements) out[m.id] = m.valueMm;
	return out;
}

export function measurementById(set: MeasurementSet, id: MeasurementId): MeasurementValue | undefined {
	return set.measurements.find((m) => m.id === id);
}
