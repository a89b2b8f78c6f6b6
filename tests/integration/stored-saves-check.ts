// What a crash must never leave behind, read straight from the database after the crash tests' saves
// (concurrent-saves.ts), checked with the server's own code: versions verified and replayed as the server
// does (version-verify.ts, changes/history.ts). Gives every problem found, in words; none is the pass.
import { pieceSchema, type Piece } from '../../src/lib/pattern/piece-schema';
import { recipeStepApply } from '../../src/lib/pattern/recipe/registry';
import { versionVerify, type RecipeStepData } from '../../src/lib/pattern/verify/version-verify';
import { styleHistoryReplay } from '../../src/lib/server/changes/history';
import type { Db } from '../../src/lib/server/db/index';
import { piecesOfStyle, type PieceRow } from '../../src/lib/server/repositories/pieces';
import { styleChangesOfStyle } from '../../src/lib/server/repositories/style-changes';
import { stylesOfStudio } from '../../src/lib/server/repositories/styles';
import { versionsById, versionsOfPiece } from '../../src/lib/server/repositories/versions';
import type { SaveAnswer } from './concurrent-saves';

interface Found {
	versionIds: Set<string>;
	changeIds: Set<string>;
	/** change id → how many pieces it made (their first versions say so) */
	piecesOfChange: Map<string, number>;
}

/**
 * One piece: its head is a stored version of its own, numbered as the piece says; its versions are
 * numbered 1 … head with none missing and none past the head, each the child of the one before; each
 * is whole (sound geometry, metrics) and each after the first verifies on the server's terms: its
 * recipe replayed on the version before gives it, and every shaping check passes.
 */
async function pieceProblems(db: Db, piece: PieceRow, found: Found): Promise<string[]> {
	const name = `${piece.name} (${piece.id})`;
	if (!piece.headVersionId) return [`${name} has no head version`];
	const list = (await versionsOfPiece(db, piece.id)).sort((a, b) => a.number - b.number);
	const problems: string[] = [];
	const numbers = list.map((v) => v.number);
	if (numbers.join() !== list.map((_, i) => i + 1).join()) problems.push(`${name}: versions numbered ${numbers.join(', ')}`);
	if (list.length !== piece.headNumber) problems.push(`${name}: ${list.length} versions stored, the head says ${piece.headNumber}`);
	const head = list.find((v) => v.id === piece.headVersionId);
	if (!head || head.number !== piece.headNumber) problems.push(`${name}: the head ${piece.headVersionId} is not its stored version ${piece.headNumber}`);
	let parent: Piece | null = null;
	for (const [i, s] of list.entries()) {
		found.versionIds.add(s.id);
		const v = await versionsById(db, piece.id, s.id);
		const stored = pieceSchema.safeParse(v?.geometry);
		if (!v || !stored.success || !v.metrics || !Array.isArray(v.recipe) || v.recipe.length === 0) {
			problems.push(`${name} v${s.number} is not whole`);
			break;
		}
		const recipe = v.recipe as RecipeStepData[];
		if (i === 0) {
			if (recipe[0].op === 'change_result') {
				const changeId = (recipe[0].params as { changeId: string }).changeId;
				found.piecesOfChange.set(changeId, (found.piecesOfChange.get(changeId) ?? 0) + 1);
			}
		} else {
			if (s.parentId !== list[i - 1].id) problems.push(`${name} v${s.number} does not follow v${s.number - 1}`);
			const verdict = versionVerify(parent, stored.data, recipe, recipeStepApply);
			if (!verdict.ok) problems.push(`${name} v${s.number} does not verify: ${verdict.problem.message}`);
		}
		parent = stored.data;
	}
	return problems;
}

/**
 * Every problem with what a studio's saves left stored: each piece as pieceProblems says; each style's
 * history replays from its first versions to every head (styleHistoryReplay); each stored style change
 * made all `piecesPerChange` of its pieces; and every save answered 201 is there.
 */
export async function storedSavesProblems(db: Db, studioId: string, answers: readonly SaveAnswer[], piecesPerChange: number): Promise<string[]> {
	const problems: string[] = [];
	const found: Found = { versionIds: new Set(), changeIds: new Set(), piecesOfChange: new Map() };
	for (const style of await stylesOfStudio(db, studioId)) {
		for (const piece of await piecesOfStyle(db, style.id)) problems.push(...(await pieceProblems(db, piece, found)));
		for (const p of await styleHistoryReplay(db, style.id)) problems.push(...p.problems.map((m) => `${p.name} (${p.pieceId}) on replay: ${m}`));
		for (const c of await styleChangesOfStyle(db, style.id)) {
			found.changeIds.add(c.id);
			const made = found.piecesOfChange.get(c.id) ?? 0;
			if (made !== piecesPerChange) problems.push(`style change ${c.id} made ${made} of its ${piecesPerChange} pieces`);
		}
	}
	for (const changeId of found.piecesOfChange.keys()) if (!found.changeIds.has(changeId)) problems.push(`pieces name style change ${changeId}, which is not stored`);
	for (const a of answers) {
		if (a.status !== 201) continue;
		const missing = a.versionIds.filter((id) => !found.versionIds.has(id));
		if (missing.length) problems.push(`a ${a.kind} answered 201 is missing versions ${missing.join(', ')}`);
		if (a.changeId && !found.changeIds.has(a.changeId)) problems.push(`a style change answered 201 is not stored (${a.changeId})`);
	}
	return problems;
}
