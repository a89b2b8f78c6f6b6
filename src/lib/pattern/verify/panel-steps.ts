import { z } from 'zod';
import { allowance, divergencePoint, fold, grain, notch, styleLine, unfold } from '../panels';
import { refuse, type OperationResult } from '../operation-result';
import { allowanceCornerSchema, lineMarkSchema, pathSchema, vecSchema, type Piece } from '../piece-schema';

/**
 * Recipe steps of the panel operations that act on one piece (the ones that make or merge pieces,
 * separate / join / carry, start the new pieces' histories instead). Params are validated here because
 * a recipe comes from outside.
 */
const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });
const id = z.string().min(1).max(64);

export const panelStepSchemas = {
	style_line: z.object({ id, path: pathSchema, label: z.string().max(80).optional() }),
	notch: z.object({ id, at: vecSchema, count: z.union([z.literal(1), z.literal(2)]).optional() }),
	divergence_point: z
		.object({ apexId: id.optional(), at: vecSchema.optional(), id: id.optional(), label: z.string().max(80).optional() })
		.refine((p) => p.apexId !== undefined || (p.at !== undefined && p.id !== undefined), { message: 'give the apex to mark, or a point and an id' }),
	grain: z.object({
		through: vecSchema,
		lengthMm: finite(),
		direction: z.enum(['lengthwise', 'crosswise', 'bias']).optional(),
		centreLine: lineMarkSchema.optional(),
		arrowheads: z.enum(['both', 'one']).optional()
	}),
	fold: z.object({ from: vecSchema, to: vecSchema }),
	unfold: z.object({}).optional(),
	allowance: z.object({
		defaultWidthMm: finite().optional(),
		widthsMm: z.record(z.string(), finite()).optional(),
		corners: z.record(z.string(), allowanceCornerSchema).optional(),
		defaultCorner: allowanceCornerSchema.optional()
	})
} as const;

export type PanelStepOp = keyof typeof panelStepSchemas;

export function isPanelStep(op: string): op is PanelStepOp {
	return op in panelStepSchemas;
}

function numberKeys<T>(r: Record<string, T> | undefined): Record<number, T> | undefined {
	if (!r) return undefined;
	return Object.fromEntries(Object.entries(r).map(([k, v]) => [Number(k), v]));
}

export function panelStepApply(piece: Piece, op: PanelStepOp, raw: unknown): OperationResult {
	const parsed = panelStepSchemas[op].safeParse(raw);
	if (!parsed.success) return refuse('invalid_params', `${op}: ${parsed.error.issues[0]?.path.join('.') ?? ''} ${parsed.error.issues[0]?.message ?? 'invalid'}`.trim());
	const p = parsed.data as never;
	switch (op) {
		case 'style_line':
			return styleLine(piece, p);
		case 'notch':
			return notch(piece, p);
		case 'divergence_point':
			return divergencePoint(piece, p);
		case 'grain':
			return grain(piece, p);
		case 'fold':
			return fold(piece, p);
		case 'unfold':
			return unfold(piece);
		case 'allowance': {
			const a = parsed.data as z.infer<typeof panelStepSchemas.allowance>;
			const r = allowance(piece, { ...a, widthsMm: numberKeys(a.widthsMm), corners: numberKeys(a.corners) });
			if (!r.ok) return r;
			return {
				ok: true,
				piece: {
					...r.piece,
					seamAllowance: {
						defaultWidthMm: a.defaultWidthMm ?? 10,
						widthsMm: a.widthsMm ?? {},
						corners: a.corners ?? {},
						defaultCorner: a.defaultCorner ?? 'mitre',
						cutLine: r.cutOutline
					}
				},
				ledgerEntries: [],
				report: r.report
			};
		}
	}
}
