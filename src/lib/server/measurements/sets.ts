import { z } from 'zod';
import {
	clientReferenceSchema,
	cupCode,
	derivationRules,
	lengthFieldRead,
	lengthValueProblem,
	measurementDefinitions,
	measurementIds,
	measurementIdSchema,
	measurementProblems,
	type CupCode,
	type MeasurementId,
	type MeasurementsMm,
	type MeasurementValue,
	type PlausibilityIssue
} from '$lib/pattern/measurements';
import type { Db } from '../db';
import { ApiError } from '../http-errors';
import {
	measurementSetsCreate,
	measurementSetsDelete,
	measurementSetsInStudio,
	measurementSetsOfStudio,
	measurementSetsUpdate,
	type MeasurementSetRow,
	type SetUnit
} from '../repositories/measurement-sets';
import { measurementChartsEnsure } from './charts';

export const setUnitSchema = z.enum(['mm', 'cm', 'in']);

/** A client reference code, or '' for a custom set that is not tied to one client. */
export const clientRefInputSchema = z
	.string()
	.trim()
	.max(40, 'Keep the reference under 40 characters.')
	.superRefine((s, ctx) => {
		if (s === '') return;
		const r = clientReferenceSchema.safeParse(s);
		if (!r.success) for (const i of r.error.issues) ctx.addIssue({ code: 'custom', message: i.message });
	});

/**
 * A length: a number is millimetres; a text is read in the set's unit ("86.5", "34 1/8", "867 mm").
 * Negative, zero, non-numbers and values no human body measures are told apart by valuesCheck.
 */
const lengthInputSchema = z.union([z.number(), z.string().trim().max(24, 'Too long for a length.')]);
export const valuesInputSchema = z.partialRecord(measurementIdSchema, lengthInputSchema);

const setNameSchema = z.string().trim().min(1, 'Name the set.').max(120, 'Keep the name under 120 characters.');
const notesSchema = z.string().max(2000, 'Keep the notes under 2,000 characters.');

export const measurementSetCreateSchema = z.object({
	kind: z.literal('client', { message: 'Only client (or custom) sets can be made; charts come with the studio.' }).default('client'),
	name: setNameSchema,
	clientRef: clientRefInputSchema.default(''),
	notes: notesSchema.default(''),
	unit: setUnitSchema.default('cm'),
	values: valuesInputSchema,
	/** Keep values that only raise warnings (outside the usual range), as typed. */
	acceptWarnings: z.boolean().default(false)
});
export type MeasurementSetCreateInput = z.output<typeof measurementSetCreateSchema>;

export const measurementSetPatchSchema = z.object({
	name: setNameSchema.optional(),
	clientRef: clientRefInputSchema.optional(),
	notes: notesSchema.optional(),
	unit: setUnitSchema.optional(),
	values: valuesInputSchema.optional(),
	acceptWarnings: z.boolean().default(false)
});
export type MeasurementSetPatchInput = z.output<typeof measurementSetPatchSchema>;

export const measurementSetDuplicateSchema = z.object({ name: setNameSchema.optional() });

/** What a set looks like to the API and the pages. */
export interface MeasurementSetView {
	id: string;
	name: string;
	kind: 'chart' | 'client';
	/** 'chart' (published, read-only), 'client' (with a client reference) or 'custom' (neither). */
	kindLabel: 'chart' | 'client' | 'custom';
	source: string;
	chartSource: MeasurementSetRow['chartSource'];
	clientRef: string;
	notes: string;
	unit: SetUnit;
	readOnly: boolean;
	/** The set's own values (measured, or as printed in the chart). */
	measurements: MeasurementValue[];
	/** What a draft would add, each with its rule; never part of the set or the chart. */
	derived: { id: MeasurementId; valueMm: number; rule: string }[];
	cupCode: CupCode | null;
	createdAt: string;
	updatedAt: string;
}

export function measurementsMmOf(values: readonly MeasurementValue[]): MeasurementsMm {
	const out: MeasurementsMm = {};
	for (const v of values) out[v.id] = v.valueMm;
	return out;
}

export function derivedFor(mm: MeasurementsMm): MeasurementSetView['derived'] {
	if (mm.bust === undefined) return [];
	const base = { ...mm, bust: mm.bust };
	return derivationRules.filter((r) => mm[r.id] === undefined).map((r) => ({ id: r.id, valueMm: r.valueMm(base), rule: r.text }));
}

export function setView(row: MeasurementSetRow): MeasurementSetView {
	const mm = measurementsMmOf(row.values);
	const order = (id: MeasurementId) => measurementIds.indexOf(id);
	return {
		id: row.id,
		name: row.name,
		kind: row.kind,
		kindLabel: row.kind === 'chart' ? 'chart' : row.clientRef ? 'client' : 'custom',
		source: row.source,
		chartSource: row.chartSource,
		clientRef: row.clientRef,
		notes: row.notes,
		unit: row.unit,
		readOnly: row.readOnly,
		measurements: [...row.values].sort((a, b) => order(a.id) - order(b.id)),
		derived: derivedFor(mm),
		cupCode: mm.bust !== undefined && mm.underbust !== undefined ? cupCode(mm.bust, mm.underbust) : null,
		createdAt: new Date(row.createdAt).toISOString(),
		updatedAt: new Date(row.updatedAt).toISOString()
	};
}

/** The outcome of reading typed values: millimetres, or what is wrong field by field. */
export type ValuesCheck =
	| { ok: true; measurements: MeasurementValue[]; warnings: PlausibilityIssue[] }
	| {
			ok: false;
			/** 400: a value is not a length; 422: lengths that are not plausible. */
			status: 400 | 422;
			message: string;
			/** Messages per measurement id ('' for the set as a whole). */
			fields: Partial<Record<MeasurementId | '', string[]>>;
			/** Only warnings stand in the way: the person may confirm the values as typed. */
			warningsOnly: boolean;
	  };

function push(fields: Partial<Record<string, string[]>>, key: string, message: string) {
	(fields[key] ??= []).push(message);
}

/**
 * Reads typed values (numbers in mm, texts in `unit`), requires the bust girth, and checks the
 * values for plausibility: errors always refuse; warnings refuse unless `acceptWarnings`.
 */
export function valuesCheck(values: Partial<Record<MeasurementId, number | string>>, unit: SetUnit, acceptWarnings: boolean): ValuesCheck {
	const fields: Partial<Record<MeasurementId | '', string[]>> = {};
	const mm: MeasurementsMm = {};
	for (const id of measurementIds) {
		const v = values[id];
		if (v === undefined || v === '') continue;
		const label = measurementDefinitions[id].label;
		if (typeof v === 'number') {
			const problem = lengthValueProblem(label, v);
			if (problem) push(fields, id, problem);
			else mm[id] = v;
			continue;
		}
		const read = lengthFieldRead(label, v, unit);
		if (!read.ok) push(fields, id, read.message);
		else mm[id] = read.mm;
	}
	if (mm.bust === undefined && !fields.bust) push(fields, 'bust', 'Bust girth is needed: the cup code, derived values and every draft start from it.');
	if (Object.keys(fields).length > 0) return { ok: false, status: 400, message: 'Some values are not lengths.', fields, warningsOnly: false };

	const problems = measurementProblems(mm);
	const errors = problems.filter((p) => p.severity === 'error');
	const warnings = problems.filter((p) => p.severity === 'warning');
	const blocking = acceptWarnings ? errors : problems;
	if (blocking.length > 0) {
		for (const p of blocking) for (const id of p.ids.slice(0, 1)) push(fields, id, p.message);
		return {
			ok: false,
			status: 422,
			message: `Some measurements look wrong: ${blocking.map((p) => p.message).join(' ')}${
				errors.length === 0 ? ' If they are right as typed, confirm them (acceptWarnings).' : ''
			}`,
			fields,
			warningsOnly: errors.length === 0
		};
	}
	const measurements = measurementIds.filter((id) => mm[id] !== undefined).map((id): MeasurementValue => ({ id, valueMm: mm[id]!, derived: false }));
	return { ok: true, measurements, warnings };
}

function apiErrorOf(check: Extract<ValuesCheck, { ok: false }>): ApiError {
	const fields: Record<string, string[]> = {};
	for (const [k, v] of Object.entries(check.fields)) fields[k ? `values.${k}` : 'values'] = v ?? [];
	return new ApiError(check.status, check.status === 422 ? 'implausible' : 'invalid', check.message, fields);
}

export async function measurementSetsList(db: Db, studioId: string): Promise<MeasurementSetView[]> {
	await measurementChartsEnsure(db, studioId);
	return (await measurementSetsOfStudio(db, studioId)).map(setView);
}

export async function measurementSetOr404(db: Db, studioId: string, setId: string): Promise<MeasurementSetRow> {
	const parsed = z.uuid().safeParse(setId);
	const row = parsed.success ? await measurementSetsInStudio(db, studioId, parsed.data) : undefined;
	if (!row) throw new ApiError(404, 'not_found', 'No such measurement set in this studio.');
	return row;
}

export async function measurementSetCreate(db: Db, studioId: string, userId: string, input: MeasurementSetCreateInput): Promise<MeasurementSetView> {
	const check = valuesCheck(input.values, input.unit, input.acceptWarnings);
	if (!check.ok) throw apiErrorOf(check);
	const row = await measurementSetsCreate(db, {
		studioId,
		name: input.name,
		kind: 'client',
		clientRef: input.clientRef,
		notes: input.notes,
		unit: input.unit,
		values: check.measurements,
		createdBy: userId
	});
	return setView(row);
}

function readOnlyRefusal(row: MeasurementSetRow): ApiError {
	return new ApiError(409, 'read_only', `"${row.name}" is a published chart and cannot be changed or deleted. Duplicate it to make an editable set.`);
}

export async function measurementSetPatch(db: Db, studioId: string, setId: string, input: MeasurementSetPatchInput): Promise<MeasurementSetView> {
	const row = await measurementSetOr404(db, studioId, setId);
	if (row.readOnly) throw readOnlyRefusal(row);
	let values: MeasurementValue[] | undefined;
	const unit = input.unit ?? row.unit;
	if (input.values !== undefined) {
		const check = valuesCheck(input.values, unit, input.acceptWarnings);
		if (!check.ok) throw apiErrorOf(check);
		values = check.measurements;
	}
	const updated = await measurementSetsUpdate(db, studioId, row.id, {
		name: input.name,
		clientRef: input.clientRef,
		notes: input.notes,
		unit: input.unit,
		values
	});
	if (!updated) throw new ApiError(404, 'not_found', 'No such measurement set in this studio.');
	return setView(updated);
}

export async function measurementSetDelete(db: Db, studioId: string, setId: string): Promise<void> {
	const row = await measurementSetOr404(db, studioId, setId);
	if (row.readOnly) throw readOnlyRefusal(row);
	await measurementSetsDelete(db, studioId, row.id);
}

/** A copy the studio can edit: a chart becomes a custom set that names the chart it came from. */
export async function measurementSetDuplicate(db: Db, studioId: string, setId: string, userId: string, name?: string): Promise<MeasurementSetView> {
	const row = await measurementSetOr404(db, studioId, setId);
	const from = row.kind === 'chart' ? `Copied from the chart ${row.source}` : `Copied from "${row.name}"${row.source ? ` (${row.source})` : ''}`;
	const copy = await measurementSetsCreate(db, {
		studioId,
		name: (name ?? `${row.name} (copy)`).slice(0, 120),
		kind: 'client',
		source: from.slice(0, 400),
		clientRef: row.kind === 'chart' ? '' : row.clientRef,
		notes: row.notes,
		unit: row.unit,
		values: row.values.filter((v) => !v.derived),
		createdBy: userId
	});
	return setView(copy);
}
