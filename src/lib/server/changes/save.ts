import type { ChangeCheck, ChangeProblem } from '$lib/pattern/verify/change-verify';
import type { SeamPairMeasure } from '$lib/pattern/verify/seam-measure';
import type { Db } from '../db';
import { piecesCreate, piecesHeadSet, piecesLockForSave, piecesOfStyle } from '../repositories/pieces';
import { seamPairsCreate, seamPairsUpdate, type SeamPairRow } from '../repositories/seam-pairs';
import { styleChangesInsert } from '../repositories/style-changes';
import { stylesInStudio } from '../repositories/styles';
import { versionsInsert } from '../repositories/versions';
import { changePrepare, staleBases, type StaleBase } from './prepare';
import type { ChangeSaveBody } from './schemas';

export type ChangeOutcome =
	| {
			ok: true;
			change: { id: string };
			pieces: { id: string; name: string; versions: { id: string; number: number }[] }[];
			seamPairs: SeamPairRow[];
			checks: readonly ChangeCheck[];
			warnings: SeamPairMeasure[];
	  }
	| { ok: false; status: 404; message: string }
	| { ok: false; status: 409; stale: StaleBase[] }
	| { ok: false; status: 422; problem: ChangeProblem };

/** Test seam: runs inside the transaction after every row is written, before it commits. */
export interface ChangeHooks {
	afterInsert?: () => void | Promise<void>;
}

/**
 * Saves one style change (the core contract for multi-piece steps): the server recomputes every step
 * from the base versions of its sources and runs the checks across the pieces (see changePrepare), then,
 * in one transaction, locks every base piece, answers 409 if any base is no longer its head (listing
 * which), stores the change, creates the new pieces with their first versions (and the edits made on
 * them as version 2), and creates or moves the seam pairs. Any failure rolls everything back: the style
 * is as it was.
 */
export async function changeSave(db: Db, input: { studioId: string; styleId: string; authorId: string; body: ChangeSaveBody }, hooks: ChangeHooks = {}): Promise<ChangeOutcome> {
	const style = await stylesInStudio(db, input.studioId, input.styleId);
	if (!style) return { ok: false, status: 404, message: 'No such style in this studio.' };
	const { body } = input;
	const prepared = await changePrepare(db, style.id, body);
	if (!prepared.ok) return prepared;
	const { pieces, ledger, checks, warnings } = prepared.change;

	return db.transaction().execute(async (tx): Promise<ChangeOutcome> => {
		// lock in a fixed order, so two changes over the same pieces queue instead of deadlocking
		const locked = new Map<string, NonNullable<Awaited<ReturnType<typeof piecesLockForSave>>>>();
		for (const id of body.bases.map((b) => b.pieceId).sort()) {
			const row = await piecesLockForSave(tx, id);
			if (row) locked.set(id, row);
		}
		const stale = staleBases(body.bases, locked);
		if (stale.length || locked.size !== body.bases.length) return { ok: false, status: 409, stale };
		const change = await styleChangesInsert(tx, { styleId: style.id, authorId: input.authorId, message: body.message, bases: body.bases, steps: body.steps, ledger, checks });
		let order = (await piecesOfStyle(tx, style.id)).length;
		const made: { id: string; name: string; versions: { id: string; number: number }[] }[] = [];
		for (const p of pieces) {
			const row = await piecesCreate(tx, { styleId: style.id, name: p.piece.name, cut: p.piece.cut, fabric: p.piece.fabric, sortOrder: order++ });
			const v1 = await versionsInsert(tx, {
				pieceId: row.id,
				number: 1,
				parentId: null,
				authorId: input.authorId,
				message: body.message,
				geometry: p.piece,
				recipe: [{ op: 'change_result', params: { changeId: change.id, step: p.step, result: p.result } }],
				metrics: { ...p.metrics, ledger: [] },
				checks: checks.filter((c) => c.step === p.step)
			});
			const versions = [v1];
			if (p.edits) {
				versions.push(
					await versionsInsert(tx, {
						pieceId: row.id,
						number: 2,
						parentId: v1.id,
						authorId: input.authorId,
						message: p.edits.message,
						geometry: p.edits.piece,
						recipe: p.edits.recipe,
						metrics: { ...p.edits.metrics, ledger: p.edits.ledger },
						checks: p.edits.checks
					})
				);
			}
			const head = versions[versions.length - 1];
			await piecesHeadSet(tx, row.id, head.id, head.number);
			made.push({ id: row.id, name: p.piece.name, versions });
		}
		const seamPairs: SeamPairRow[] = [];
		for (const sp of body.seamPairs.create) {
			const id = (s: (typeof sp)['a']) => ('newPiece' in s ? made[s.newPiece].id : s.pieceId);
			seamPairs.push(
				await seamPairsCreate(tx, { styleId: style.id, label: sp.label, aPieceId: id(sp.a), aEdge: { from: sp.a.from, to: sp.a.to }, bPieceId: id(sp.b), bEdge: { from: sp.b.from, to: sp.b.to }, allowedEaseMm: sp.allowedEaseMm, toleranceMm: sp.toleranceMm })
			);
		}
		for (const u of body.seamPairs.update) {
			const row = await seamPairsUpdate(tx, u.id, { label: u.label, aEdge: u.a, bEdge: u.b, allowedEaseMm: u.allowedEaseMm, toleranceMm: u.toleranceMm });
			if (row) seamPairs.push(row);
		}
		await hooks.afterInsert?.();
		return { ok: true, change, pieces: made, seamPairs, checks, warnings };
	});
}
