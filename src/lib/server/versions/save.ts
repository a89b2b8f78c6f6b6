import type { Db, DbOrTx } from '../db';
import type { LedgerEntry } from '$lib/pattern/ledger';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import { versionVerify, type RecipeStepData, type VerifyProblem } from '$lib/pattern/verify/version-verify';
import { seamPairMeasure, type SeamPairMeasure } from '$lib/pattern/verify/seam-measure';
import { recipeStepApply } from '$lib/pattern/recipe/registry';
import { piecesHeadSet, piecesInStudio, piecesLockForSave, piecesOfStyle } from '../repositories/pieces';
import { seamPairsOfStyle } from '../repositories/seam-pairs';
import { versionsGeometry, versionsInsert } from '../repositories/versions';

export interface SaveInput {
	studioId: string;
	pieceId: string;
	/** The version the edit started from; null only for a piece's first version. */
	baseVersionId: string | null;
	message: string;
	geometry: Piece;
	recipe: RecipeStepData[];
	/** Labelled changes declared by the pattern cutter (fullness, removed ease). */
	declared?: LedgerEntry[];
	authorId: string;
}

export type SaveOutcome =
	| {
			ok: true;
			version: { id: string; number: number };
			checks: unknown[];
			warnings: SeamPairMeasure[];
	  }
	| { ok: false; status: 404; message: string }
	| { ok: false; status: 409; message: string; head: { id: string | null; number: number } }
	| { ok: false; status: 422; problem: VerifyProblem };

/** Test seam: lets a test fail a save after the insert to prove the transaction rolls back. */
export interface SaveHooks {
	afterInsert?: () => void | Promise<void>;
}

function conflict(head: { id: string | null; number: number }): SaveOutcome {
	return {
		ok: false,
		status: 409,
		message: `Someone saved version ${head.number} of this piece after you started. Reload it, or save your work as a new version on top of it.`,
		head
	};
}

export async function seamWarnings(db: DbOrTx, styleId: string, pieceId: string, piece: Piece): Promise<SeamPairMeasure[]> {
	const pairs = (await seamPairsOfStyle(db, styleId)).filter((p) => p.aPieceId === pieceId || p.bPieceId === pieceId);
	if (pairs.length === 0) return [];
	// only the heads of the pieces these seams join are read (each once), not the whole style's
	const wanted = new Set(pairs.flatMap((p) => [p.aPieceId, p.bPieceId]));
	const heads = new Map<string, Piece>();
	for (const other of await piecesOfStyle(db, styleId)) {
		if (other.id === pieceId || !other.headVersionId || !wanted.has(other.id)) continue;
		const g = await versionsGeometry(db, other.id, other.headVersionId);
		if (g) heads.set(other.id, pieceSchema.parse(g));
	}
	heads.set(pieceId, piece);
	const out: SeamPairMeasure[] = [];
	for (const p of pairs) {
		const a = heads.get(p.aPieceId);
		const b = heads.get(p.bPieceId);
		if (!a || !b) continue;
		const m = seamPairMeasure(
			{ id: p.id, label: p.label, a: p.aEdge, b: p.bEdge, allowedEaseMm: p.allowedEaseMm, toleranceMm: p.toleranceMm },
			a,
			b
		);
		if (!m.withinTolerance) out.push(m);
	}
	return out;
}

/**
 * Saves a new version of a piece (the core contract): verify on the server (replay the recipe on the
 * base version, recompute every metric, run the shaping checks), then in one transaction refuse with
 * 409 if the base is no longer the head, insert the version and move the head. A save that dies
 * half-way leaves the old head intact.
 */
export async function versionSave(db: Db, input: SaveInput, hooks: SaveHooks = {}): Promise<SaveOutcome> {
	const piece = await piecesInStudio(db, input.studioId, input.pieceId);
	if (!piece) return { ok: false, status: 404, message: 'No such piece in this studio.' };
	if (input.baseVersionId !== piece.headVersionId) return conflict({ id: piece.headVersionId, number: piece.headNumber });

	let parent: Piece | null = null;
	if (input.baseVersionId) {
		const base = await versionsGeometry(db, input.pieceId, input.baseVersionId);
		if (!base) return { ok: false, status: 404, message: 'The base version does not belong to this piece.' };
		parent = pieceSchema.parse(base);
	}
	const verdict = versionVerify(parent, input.geometry, input.recipe, recipeStepApply, input.declared ?? []);
	if (!verdict.ok) return { ok: false, status: 422, problem: verdict.problem };
	const warnings = await seamWarnings(db, piece.styleId, piece.id, verdict.piece);
	const checks = [
		...verdict.checks,
		...warnings.map((w) => ({ code: 'seam_true', passed: false, warning: true, seamPairId: w.seamPairId, message: w.message }))
	];

	return db.transaction().execute(async (tx) => {
		const locked = await piecesLockForSave(tx, input.pieceId);
		if (!locked) return { ok: false, status: 404, message: 'No such piece in this studio.' } as const;
		if (locked.headVersionId !== input.baseVersionId) return conflict({ id: locked.headVersionId, number: locked.headNumber });
		const number = locked.headNumber + 1;
		const version = await versionsInsert(tx, {
			pieceId: input.pieceId,
			number,
			parentId: input.baseVersionId,
			authorId: input.authorId,
			message: input.message,
			geometry: verdict.piece,
			recipe: input.recipe,
			metrics: { ...verdict.metrics, ledger: verdict.ledger },
			checks
		});
		await hooks.afterInsert?.();
		await piecesHeadSet(tx, input.pieceId, version.id, number);
		return { ok: true, version, checks, warnings } as const;
	});
}
