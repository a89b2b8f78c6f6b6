import type { PieceMetrics } from '$lib/pattern/metrics';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import { recipeStepApply } from '$lib/pattern/recipe/registry';
import { changeVerify, type ChangeCheck, type ChangeProblem, type StoredSeamPair } from '$lib/pattern/verify/change-verify';
import { seamPairMeasure, type SeamPairMeasure } from '$lib/pattern/verify/seam-measure';
import { versionVerify } from '$lib/pattern/verify/version-verify';
import type { LedgerEntry } from '$lib/pattern/ledger';
import type { DbOrTx } from '../db';
import { piecesOfStyle, type PieceRow } from '../repositories/pieces';
import { seamPairsOfStyle } from '../repositories/seam-pairs';
import { versionsGeometry } from '../repositories/versions';
import type { ChangeSaveBody } from './schemas';

/** A stored piece whose base is no longer its head. */
export interface StaleBase {
	pieceId: string;
	name: string;
	baseVersionId: string;
	headVersionId: string | null;
	headNumber: number;
}

/** Everything the transaction stores, computed and checked before it opens. */
export interface PreparedChange {
	pieces: {
		piece: Piece;
		metrics: PieceMetrics;
		step: number;
		result: number;
		edits: { message: string; recipe: unknown[]; piece: Piece; metrics: PieceMetrics; ledger: readonly LedgerEntry[]; checks: unknown[] } | null;
	}[];
	ledger: readonly LedgerEntry[];
	checks: readonly ChangeCheck[];
	warnings: SeamPairMeasure[];
}

export type Prepared =
	| { ok: true; change: PreparedChange }
	| { ok: false; status: 409; stale: StaleBase[] }
	| { ok: false; status: 422; problem: ChangeProblem };

const invalid = (message: string): Prepared => ({ ok: false, status: 422, problem: { code: 'change_invalid', message: `${message} Nothing was saved.` } });

/** Bases that are no longer their piece's head (the style's pieces by id). */
export function staleBases(bases: ChangeSaveBody['bases'], byId: ReadonlyMap<string, PieceRow>): StaleBase[] {
	return bases.flatMap((b) => {
		const p = byId.get(b.pieceId);
		return p && p.headVersionId !== b.versionId ? [{ pieceId: p.id, name: p.name, baseVersionId: b.versionId, headVersionId: p.headVersionId, headNumber: p.headNumber }] : [];
	});
}

/**
 * Loads the base versions, recomputes and checks the whole change as the server's own work (nothing is
 * trusted from the client but the names and cuts of the new pieces), measures the seam pairs it makes.
 */
export async function changePrepare(db: DbOrTx, styleId: string, body: ChangeSaveBody): Promise<Prepared> {
	const stylePieces = new Map((await piecesOfStyle(db, styleId)).map((p) => [p.id, p]));
	if (new Set(body.bases.map((b) => b.pieceId)).size !== body.bases.length) return invalid('A piece is given twice among the bases.');
	const foreign = body.bases.find((b) => !stylePieces.has(b.pieceId));
	if (foreign) return invalid(`The base piece ${foreign.pieceId} is not a piece of this style.`);
	const stale = staleBases(body.bases, stylePieces);
	if (stale.length) return { ok: false, status: 409, stale };
	for (const [i, s] of body.steps.entries()) {
		for (const src of s.sources) {
			if ('pieceId' in src && !body.bases.some((b) => b.pieceId === src.pieceId)) return invalid(`Step ${i + 1} (${s.op}) reads piece ${src.pieceId}, whose base version is not among the bases.`);
		}
	}
	const bases = new Map<string, Piece>();
	for (const b of body.bases) {
		const g = await versionsGeometry(db, b.pieceId, b.versionId);
		if (!g) return invalid(`Version ${b.versionId} is not a version of piece ${b.pieceId}.`);
		bases.set(b.pieceId, pieceSchema.parse(g));
	}
	const stored: StoredSeamPair[] = (await seamPairsOfStyle(db, styleId)).map((p) => ({ id: p.id, label: p.label, aPieceId: p.aPieceId, bPieceId: p.bPieceId, a: p.aEdge, b: p.bEdge, allowedEaseMm: p.allowedEaseMm, toleranceMm: p.toleranceMm }));
	const verdict = changeVerify(bases, body.steps, body.pieces, stored);
	if (!verdict.ok) return { ok: false, status: 422, problem: verdict.problem };

	const pieces: PreparedChange['pieces'] = [];
	for (const [n, sent] of body.pieces.entries()) {
		const made = verdict.pieces[n];
		let edits: PreparedChange['pieces'][number]['edits'] = null;
		if (sent.edits) {
			const v = versionVerify(made.piece, { ...sent.edits.geometry, name: sent.name, cut: sent.cut }, sent.edits.recipe, recipeStepApply, sent.edits.declared);
			if (!v.ok) return { ok: false, status: 422, problem: { code: v.problem.code === 'replay_mismatch' ? 'replay_mismatch' : 'shaping_not_kept', pieceIndex: n, message: `New piece ${n + 1} ("${sent.name}"), the edits made on it: ${v.problem.message}`, details: v.problem.details } };
			edits = { message: sent.edits.message ?? body.message, recipe: sent.edits.recipe, piece: { ...v.piece, name: sent.name, cut: sent.cut }, metrics: v.metrics, ledger: v.ledger, checks: [...v.checks] };
		}
		pieces.push({ piece: made.piece, metrics: made.metrics, step: sent.step, result: sent.result, edits });
	}

	// the seam pairs the change makes or moves must name pieces of this style (or its new pieces)
	const headOf = async (pieceId: string): Promise<Piece | null> => {
		const p = stylePieces.get(pieceId);
		if (!p?.headVersionId) return null;
		const g = bases.get(pieceId) ?? (await versionsGeometry(db, pieceId, p.headVersionId));
		return g ? pieceSchema.parse(g) : null;
	};
	const warnings: SeamPairMeasure[] = [];
	for (const [i, sp] of body.seamPairs.create.entries()) {
		const side = async (s: (typeof sp)['a']) => ('newPiece' in s ? (pieces[s.newPiece] ? (pieces[s.newPiece].edits?.piece ?? pieces[s.newPiece].piece) : null) : await headOf(s.pieceId));
		const a = await side(sp.a);
		const b = await side(sp.b);
		if (!a || !b) return invalid(`Seam pair ${i + 1} (${sp.label || 'no label'}) names a piece that is neither in this style nor new in this change.`);
		const m = seamPairMeasure({ id: `new-${i}`, label: sp.label, a: sp.a, b: sp.b, allowedEaseMm: sp.allowedEaseMm, toleranceMm: sp.toleranceMm }, a, b);
		if (!m.withinTolerance) warnings.push(m);
	}
	const storedIds = new Set(stored.map((p) => p.id));
	const foreignPair = body.seamPairs.update.find((u) => !storedIds.has(u.id));
	if (foreignPair) return invalid(`Seam pair ${foreignPair.id} is not a seam pair of this style.`);
	return { ok: true, change: { pieces, ledger: verdict.ledger, checks: verdict.checks, warnings } };
}
