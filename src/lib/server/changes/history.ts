import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import { pieceGeometryDifference } from '$lib/pattern/verify/piece-compare';
import { changeRecompute, type ChangeStep } from '$lib/pattern/recipe/change';
import { recipeStepApply, stepStartsHistory } from '$lib/pattern/recipe/registry';
import type { DbOrTx } from '../db';
import { piecesOfStyle } from '../repositories/pieces';
import { styleChangesById } from '../repositories/style-changes';
import { versionsById, versionsGeometry, versionsOfPiece } from '../repositories/versions';

export interface PieceReplay {
	pieceId: string;
	name: string;
	/** Versions replayed, up to and including the head. */
	versions: number;
	/** What did not reproduce (empty when every version, the head included, came out exactly as stored). */
	problems: string[];
}

/**
 * How far a replayed piece may lie from the stored one (mm): the same code gives the very same numbers;
 * versions stored by an earlier release of the kernel may differ in the last digits.
 */
export const HISTORY_TOLERANCE_MM = 1e-6;
const same = (a: Piece, b: Piece) => JSON.stringify(a) === JSON.stringify(b) || pieceGeometryDifference(a, b, HISTORY_TOLERANCE_MM) === null;

/**
 * Replays a style's history from its first versions: a piece made by a style change is recomputed from
 * the change's stored sources and parameters, every later version from its recipe on the version
 * before; each must come out exactly as stored, up to the piece's head. Drafted and imported first
 * versions are taken as stored (they are where a history starts).
 */
export async function styleHistoryReplay(db: DbOrTx, styleId: string): Promise<PieceReplay[]> {
	const out: PieceReplay[] = [];
	const changes = new Map<string, ReturnType<typeof changeRecompute> | string>();
	const recompute = async (changeId: string) => {
		if (changes.has(changeId)) return changes.get(changeId)!;
		const c = await styleChangesById(db, styleId, changeId);
		let r: ReturnType<typeof changeRecompute> | string = `style change ${changeId} is not stored`;
		if (c) {
			const bases = new Map<string, Piece>();
			for (const b of c.bases) {
				const g = await versionsGeometry(db, b.pieceId, b.versionId);
				if (g) bases.set(b.pieceId, pieceSchema.parse(g));
			}
			r = changeRecompute(bases, c.steps as ChangeStep[]);
		}
		changes.set(changeId, r);
		return r;
	};
	for (const piece of await piecesOfStyle(db, styleId)) {
		if (!piece.headVersionId) continue;
		const problems: string[] = [];
		const list = (await versionsOfPiece(db, piece.id)).filter((v) => v.number <= piece.headNumber).sort((a, b) => a.number - b.number);
		let previous: Piece | null = null;
		for (const s of list) {
			const v = await versionsById(db, piece.id, s.id);
			if (!v) break; // the piece went away while it was read
			const stored = pieceSchema.parse(v.geometry);
			const recipe = v.recipe as { op: string; params?: unknown }[];
			let computed: Piece | null = null;
			if (previous === null) {
				const origin = recipe[0];
				if (origin?.op === 'change_result') {
					const p = origin.params as { changeId: string; step: number; result: number };
					const rc = await recompute(p.changeId);
					if (typeof rc === 'string') problems.push(`v1: ${rc}`);
					else if (!rc.ok) problems.push(`v1: ${rc.message}`);
					else {
						const g = rc.steps[p.step]?.result.pieces[p.result];
						computed = g ? { ...g, name: stored.name, cut: stored.cut, labels: stored.labels } : null;
						if (!g) problems.push(`v1: the change has no result ${p.result + 1} at step ${p.step + 1}`);
					}
				} else if (recipe.length === 1 && stepStartsHistory(origin.op)) computed = stored;
				else problems.push(`v1 starts with "${origin?.op}", which does not start a history`);
			} else {
				let g: Piece = previous;
				for (const step of recipe) {
					const r = recipeStepApply(g, step);
					if (!r.ok) {
						problems.push(`v${v.number}: ${step.op} refused: ${r.error.message}`);
						break;
					}
					g = r.piece;
				}
				computed = g;
			}
			if (computed && !same(pieceSchema.parse(JSON.parse(JSON.stringify(computed))), stored)) problems.push(`v${v.number} does not come out as stored`);
			if (problems.length) break;
			previous = stored;
		}
		out.push({ pieceId: piece.id, name: piece.name, versions: list.length, problems });
	}
	return out;
}
