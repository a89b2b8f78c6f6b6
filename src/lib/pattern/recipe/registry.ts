import { z } from 'zod';
import { cap, capParamsSchema, pivot, pivotParamsSchema, pleat, pleatParamsSchema, pullBack, pullBackParamsSchema, share, shareParamsSchema, spread, spreadParamsSchema } from '../operations';
import { refuse, type OperationResult } from '../operation-result';
import { allowance, carry, divergencePoint, fold, grain, join, notch, separate, styleLine, unfold, type PiecesResult, type SeamPair } from '../panels';
import { pieceStructureProblems } from '../piece';
import type { Piece } from '../piece-schema';
import { reshape, reshapeParamsSchema } from '../verify/reshape';
import * as S from './step-schemas';

/**
 * The recipe registry: every step a recipe can hold, in one table. For each step name: its zod schema,
 * its pure function, whether it starts a piece's history (an origin: drafting, an import, a style
 * change's result) and whether it spans pieces (separate, join, carry: sources in, new pieces out).
 * Replay, the browser's preview, the server's save and the API's step schemas all read this table;
 * a new operation is added here and nowhere else.
 */

type Schema = z.ZodType;

export interface OriginStepDef<P extends Schema = Schema> {
	readonly schema: P;
	readonly startsHistory: true;
	readonly spansPieces: false;
	/** A client may start a piece with it (drafting, an import); pieces made from others come from a style change. */
	readonly byClient: boolean;
}
export interface PieceStepDef<P extends Schema = Schema> {
	readonly schema: P;
	readonly startsHistory: false;
	readonly spansPieces: false;
	readonly apply: (piece: Piece, params: z.output<P>) => OperationResult;
}
export interface PiecesStepDef<P extends Schema = Schema> {
	readonly schema: P;
	readonly startsHistory: false;
	readonly spansPieces: true;
	/** How many source pieces the step takes. */
	readonly sources: { readonly min: number; readonly max: number };
	readonly apply: (pieces: readonly Piece[], params: z.output<P>) => PiecesResult;
}
export type StepDef = OriginStepDef | PieceStepDef | PiecesStepDef;

const origin = <P extends Schema>(schema: P, byClient: boolean): OriginStepDef<P> => ({ schema, startsHistory: true, spansPieces: false, byClient });
const onPiece = <P extends Schema>(schema: P, apply: (piece: Piece, params: z.output<P>) => OperationResult): PieceStepDef<P> => ({ schema, startsHistory: false, spansPieces: false, apply });
/** Dart operations refuse a piece whose darts or pleats are not in its outline. */
const dartOp = <P extends Schema>(schema: P, apply: (piece: Piece, params: z.output<P>) => OperationResult): PieceStepDef<P> =>
	onPiece(schema, (piece, params) => {
		const problems = pieceStructureProblems(piece);
		if (problems.length > 0) return refuse('invalid_piece', `The piece is not in a state operations can work on: ${problems.join('; ')}`);
		return apply(piece, params);
	});
const onPieces = <P extends Schema>(schema: P, sources: { min: number; max: number }, apply: (pieces: readonly Piece[], params: z.output<P>) => PiecesResult): PiecesStepDef<P> => ({
	schema,
	startsHistory: false,
	spansPieces: true,
	sources,
	apply
});

function numberKeys<T>(r: Record<string, T> | undefined): Record<number, T> | undefined {
	if (!r) return undefined;
	return Object.fromEntries(Object.entries(r).map(([k, v]) => [Number(k), v]));
}

function allowanceStep(piece: Piece, a: z.output<typeof S.allowanceParamsSchema>): OperationResult {
	const r = allowance(piece, { ...a, widthsMm: numberKeys(a.widthsMm), corners: numberKeys(a.corners) });
	if (!r.ok) return r;
	const seamAllowance = { defaultWidthMm: a.defaultWidthMm ?? 10, widthsMm: a.widthsMm ?? {}, corners: a.corners ?? {}, defaultCorner: a.defaultCorner ?? 'mitre', cutLine: r.cutOutline };
	return { ok: true, piece: { ...r.piece, seamAllowance }, ledgerEntries: [], report: r.report };
}

const seam = (p: S.SeamPairParams): SeamPair => p;

/** Pivot, optionally choosing first which leg of the dart turns (the pattern cutter's choice). */
const pivotStepSchema = pivotParamsSchema.extend({ movingLeg: z.enum(['leg1', 'leg2']).optional() });
function pivotStep(piece: Piece, { movingLeg, ...p }: z.output<typeof pivotStepSchema>): OperationResult {
	if (!movingLeg) return pivot(piece, p);
	return pivot({ ...piece, darts: piece.darts.map((d) => (d.id === p.dartId ? { ...d, movingLeg } : d)) }, p);
}

export const RECIPE_STEPS = {
	// origins: a piece's first version
	draft: origin(S.draftParamsSchema, true),
	import: origin(S.importParamsSchema, true),
	separate_result: origin(S.separateResultParamsSchema, false),
	change_result: origin(S.changeResultParamsSchema, false),
	// dart operations
	pivot: dartOp(pivotStepSchema, pivotStep),
	share: dartOp(shareParamsSchema, share),
	spread: dartOp(spreadParamsSchema, spread),
	pleat: dartOp(pleatParamsSchema, pleat),
	pull_back: dartOp(pullBackParamsSchema, pullBack),
	cap: dartOp(capParamsSchema, cap),
	// direct manipulation and the panel operations on one piece
	reshape: onPiece(reshapeParamsSchema, reshape),
	style_line: onPiece(S.styleLineParamsSchema, styleLine),
	notch: onPiece(S.notchParamsSchema, notch),
	divergence_point: onPiece(S.divergencePointParamsSchema, divergencePoint),
	grain: onPiece(S.grainParamsSchema, grain),
	fold: onPiece(S.foldParamsSchema, fold),
	unfold: onPiece(S.unfoldParamsSchema, (piece) => unfold(piece)),
	allowance: onPiece(S.allowanceParamsSchema, allowanceStep),
	// steps that span pieces (stored as a style change, recomputed on the server)
	separate: onPieces(S.separateParamsSchema, { min: 1, max: 1 }, (pieces, p) => separate(pieces[0], p)),
	join: onPieces(S.joinParamsSchema, { min: 2, max: 2 }, (pieces, { seam: s, ...rest }) => join(pieces, seam(s), rest)),
	carry: onPieces(S.carryParamsSchema, { min: 2, max: 40 }, (pieces, { seams, ...rest }) => carry(pieces, seams.map(seam), rest))
} as const satisfies Record<string, StepDef>;

export type StepName = keyof typeof RECIPE_STEPS;
export const STEP_NAMES = Object.keys(RECIPE_STEPS) as StepName[];
export const ORIGIN_STEP_NAMES = STEP_NAMES.filter((n) => RECIPE_STEPS[n].startsHistory);
export const PIECE_STEP_NAMES = STEP_NAMES.filter((n) => !RECIPE_STEPS[n].startsHistory && !RECIPE_STEPS[n].spansPieces);
export const PIECES_STEP_NAMES = STEP_NAMES.filter((n) => RECIPE_STEPS[n].spansPieces) as ('separate' | 'join' | 'carry')[];
export type PiecesStepName = (typeof PIECES_STEP_NAMES)[number];

export function stepDef(op: string): StepDef | null {
	return Object.hasOwn(RECIPE_STEPS, op) ? RECIPE_STEPS[op as StepName] : null;
}
export const stepStartsHistory = (op: string): boolean => stepDef(op)?.startsHistory === true;
export const stepSpansPieces = (op: string): boolean => stepDef(op)?.spansPieces === true;
/** Origins a client may send as a piece's first version: pieces made from others are saved as a style change. */
export const CLIENT_ORIGIN_STEP_NAMES = ORIGIN_STEP_NAMES.filter((n) => (RECIPE_STEPS[n] as OriginStepDef).byClient);

/** A step as the API takes it: a known name and parameters (checked against its schema when applied). */
export const recipeStepSchema = z.object({ op: z.enum(STEP_NAMES as [StepName, ...StepName[]]), params: z.unknown().optional() });

function parseParams(op: string, schema: Schema, raw: unknown): { ok: true; params: unknown } | { ok: false; message: string } {
	const parsed = schema.safeParse(raw);
	if (parsed.success) return { ok: true, params: parsed.data };
	const i = parsed.error.issues[0];
	return { ok: false, message: `${op}: ${i?.path.join('.') ?? ''} ${i?.message ?? 'invalid'}`.trim() };
}

function outlineSame(a: Piece, b: Piece): boolean {
	return a.outline === b.outline || JSON.stringify(a.outline) === JSON.stringify(b.outline);
}

/**
 * A seam allowance added before a step that changed the stitching line: a hand reshape moves points and
 * handles of the same segments, so the allowance follows the line with the same widths and corners (a
 * width is given per segment); any other step may move a dart or add stretches (a pivot, pleats), after
 * which the widths no longer name the same seams, so it is removed and added again last.
 */
function allowanceAfterStep(before: Piece, op: string, r: Extract<OperationResult, { ok: true }>): OperationResult {
	const a = before.seamAllowance!;
	const bare = { ...r.piece, seamAllowance: null };
	if (op === 'reshape' && before.outline.segments.length === r.piece.outline.segments.length) {
		const again = allowanceStep(bare, { defaultWidthMm: a.defaultWidthMm, widthsMm: a.widthsMm, corners: a.corners, defaultCorner: a.defaultCorner });
		if (again.ok) return { ...r, piece: again.piece, report: { ...r.report, notes: [...r.report.notes, 'The seam allowance follows the new stitching line, with the same widths and corners.'] } };
	}
	return { ...r, piece: bare, report: { ...r.report, notes: [...r.report.notes, 'The seam allowance was removed because the seams of the stitching line changed; add it again last.'] } };
}

/** Applies one single-piece step: the same function in the browser (preview) and on the server (replay). */
export function recipeStepApply(piece: Piece, step: { readonly op: string; readonly params?: unknown }): OperationResult {
	const def = stepDef(step.op);
	if (!def) return refuse('invalid_params', `"${step.op}" is not an operation this workbench knows.`);
	if (def.startsHistory) return refuse('invalid_params', `"${step.op}" starts a piece's history; it cannot be applied to an existing version.`);
	if (def.spansPieces) return refuse('invalid_params', `"${step.op}" works on several pieces; it is saved as a style change, not as a step of one piece.`);
	const p = parseParams(step.op, def.schema, step.params);
	if (!p.ok) return refuse('invalid_params', p.message);
	const r = (def as PieceStepDef).apply(piece, p.params);
	if (r.ok && step.op !== 'allowance' && piece.seamAllowance && !outlineSame(piece, r.piece)) return allowanceAfterStep(piece, step.op, r);
	return r;
}

/**
 * The pieces a multi-piece step works on, as the operation sees them (it finds pieces by their geometry
 * id): each keeps its own id unless an earlier one has it, then it gets `-<index>` added.
 */
export function piecesForStep(pieces: readonly Piece[]): Piece[] {
	const out: Piece[] = [];
	for (const [i, g] of pieces.entries()) {
		const id = out.some((q) => q.id === g.id) ? `${g.id.slice(0, 56)}-${i}` : g.id;
		out.push(id === g.id ? g : { ...g, id });
	}
	return out;
}

/** Applies one multi-piece step to its source pieces (already given their step ids by piecesForStep). */
export function piecesStepApply(pieces: readonly Piece[], step: { readonly op: string; readonly params?: unknown }): PiecesResult {
	const def = stepDef(step.op);
	if (!def || !def.spansPieces) return { ok: false, error: { code: 'invalid_params', message: `"${step.op}" is not an operation on several pieces.` } };
	if (pieces.length < def.sources.min || pieces.length > def.sources.max) {
		const n = def.sources.min === def.sources.max ? `${def.sources.min}` : `${def.sources.min} to ${def.sources.max}`;
		return { ok: false, error: { code: 'invalid_params', message: `${step.op} takes ${n} piece${def.sources.max === 1 ? '' : 's'}, not ${pieces.length}.` } };
	}
	const p = parseParams(step.op, def.schema, step.params);
	if (!p.ok) return { ok: false, error: { code: 'invalid_params', message: p.message } };
	return def.apply(pieces, p.params as never);
}
