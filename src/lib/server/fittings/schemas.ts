import { z } from 'zod';
import { uuidSchema } from '../validation';

export const FIT_NOTE_CATEGORIES = ['too_tight', 'too_loose', 'length', 'balance', 'seam_placement', 'other'] as const;

const isoDate = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD.')
	.refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Not a real date.');

/** POST …/styles/{styleId}/fittings. Who was fitted: a client's measurement set or a named fit model. */
export const fittingCreateSchema = z
	.object({
		fittedOn: isoDate,
		title: z.string().trim().min(1, 'Give the fitting a title, e.g. "First toile fitting".').max(120),
		measurementSetId: uuidSchema.nullable().default(null),
		fitModel: z.string().trim().max(120).default(''),
		versionIds: z.array(uuidSchema).max(100).default([]),
		fabric: z.string().trim().max(200).default(''),
		remarks: z.string().max(4000).default('')
	})
	.refine((f) => (f.measurementSetId === null) !== (f.fitModel === ''), {
		message: 'Say who was fitted: a client measurement set or a fit model (one of the two).',
		path: ['fitModel']
	});

/** POST …/fittings/{fittingId}/notes: a note pinned to a point (mm) of a piece version. */
export const fitNoteCreateSchema = z.object({
	pieceId: uuidSchema,
	versionId: uuidSchema,
	xMm: z.number().finite().min(-100_000).max(100_000),
	yMm: z.number().finite().min(-100_000).max(100_000),
	category: z.enum(FIT_NOTE_CATEGORIES, 'Choose a category: too tight, too loose, length, balance, seam placement or other.'),
	/** Signed: + let out / lengthen, − take in / shorten. Millimetres (the page converts the user's unit). */
	amountMm: z.number().finite().min(-500).max(500).nullable().default(null),
	body: z.string().trim().min(1, 'Say what to change, e.g. "let out 6 mm at the side seam, waist level".').max(2000),
	assignedTo: uuidSchema.nullable().default(null)
});

/** PATCH …/notes/{noteId}: open ↔ in hand, reassign, reword. Done has its own route. */
export const fitNotePatchSchema = z
	.object({
		status: z.enum(['open', 'in_hand']),
		assignedTo: uuidSchema.nullable(),
		body: z.string().trim().min(1).max(2000),
		amountMm: z.number().finite().min(-500).max(500).nullable()
	})
	.partial();

/** POST …/notes/{noteId}/done: resolved by this version of the note's piece. */
export const fitNoteDoneSchema = z.object({ versionId: uuidSchema });
