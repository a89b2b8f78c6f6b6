import { stepParamsCarry } from '../anchors/step-anchors';
import type { LedgerEntry } from '../ledger';
import type { MeasurementsMm } from '../measurements';
import type { Piece } from '../piece-schema';
import { piecesForStep, piecesStepApply, recipeStepApply } from '../recipe/registry';
import { reshapeChanges, reshapeDeclaredEntries } from '../reshape-declaration';
import type { StepOutcome } from '../recipe/change';
import type { RecipeStepData } from '../verify/version-verify';
import { draftPart, type DraftCache, type DraftOrigin } from './draft-part';
import { stepWords, type RecipeChange, type RecipePiece, type StyleRecipe } from './style-recipe';

/**
 * A hand reshape posts nothing to the ledger: on the base size the pattern cutter declared what it
 * changed (added ease, removed fullness…). Made again on another size, the same moves change that size's
 * area and seams by other amounts, so the changes are declared again as this size measures them (the
 * kind the form suggests: ease where cloth is added, fullness where it is taken away); the checks then
 * hold each size to its own declaration, as the server held the base size.
 */
function reshapeDeclaredOnSize(op: string, before: Piece, after: Piece): LedgerEntry[] {
	if (op !== 'reshape') return [];
	const declared = reshapeDeclaredEntries(reshapeChanges(before, after));
	return declared.ok ? [...declared.entries] : [];
}

/**
 * Grading by replay (pure): the style's blocks drafted again from another measurement set and every step
 * of every piece made again on them, in the order they were made. Each step's points are carried from the
 * base size to the new one by their anchors (anchors/), so a pleat a third of the way along the shoulder is
 * a third of the way along the new shoulder. A step that cannot be made again is reported in the trade's
 * words and everything made from it is left out; the other pieces go on.
 */

export interface SizeFailure {
	readonly pieceId: string;
	readonly pieceName: string;
	/** The version whose recipe holds the step (1 = the piece's origin). */
	readonly version: number;
	/** The step within that version's recipe (1-based), or of the style change. */
	readonly step: number;
	readonly op: string;
	readonly message: string;
}

export interface ReplayedVersion {
	readonly piece: Piece;
	/** The base size's piece at the same point (for checks that compare with it). */
	readonly base: Piece;
	readonly before: Piece;
	readonly ledger: readonly LedgerEntry[];
}

export interface ChangeReplay {
	readonly steps: readonly StepOutcome[];
	readonly baseSteps: readonly StepOutcome[];
	/** The steps with the parameters as carried to this size. */
	readonly carried: RecipeChange['steps'];
}

type Made<T> = { ok: true; value: T } | { ok: false; failure: SizeFailure };

export interface SizeReplay {
	/** Every version of every piece that could be made again, by piece id and version number. */
	readonly versions: ReadonlyMap<string, ReadonlyMap<number, ReplayedVersion>>;
	readonly changes: ReadonlyMap<string, ChangeReplay>;
	readonly failures: readonly SizeFailure[];
	readonly stepsDone: number;
}

export interface SizeReplayOptions {
	/** Called after every step (progress). */
	readonly onStep?: () => void;
}

export function sizeReplay(style: StyleRecipe, mm: MeasurementsMm, options: SizeReplayOptions = {}): SizeReplay {
	const drafts: DraftCache = new Map();
	const versions = new Map<string, Map<number, Made<ReplayedVersion>>>();
	const changes = new Map<string, Made<ChangeReplay>>();
	const pieceById = new Map(style.pieces.map((p) => [p.id, p]));
	const versionById = new Map(style.pieces.flatMap((p) => p.versions.map((v) => [v.id, { piece: p, number: v.number }] as const)));
	let stepsDone = 0;
	const tick = () => {
		stepsDone++;
		options.onStep?.();
	};
	const failAt = (piece: RecipePiece, version: number, step: number, op: string, message: string): { ok: false; failure: SizeFailure } => ({
		ok: false,
		failure: { pieceId: piece.id, pieceName: piece.name, version, step, op, message }
	});

	/** Single-piece steps made again: params carried from the base piece to this size's. */
	function stepsReplay(piece: RecipePiece, version: number, base: Piece, target: Piece, recipe: readonly RecipeStepData[]): Made<{ base: Piece; target: Piece; ledger: LedgerEntry[] }> {
		const ledger: LedgerEntry[] = [];
		for (const [k, step] of recipe.entries()) {
			const carried = stepParamsCarry(step.params, [base], [target], false);
			if (!carried.ok) return failAt(piece, version, k + 1, step.op, `${stepWords(step.op)}: ${carried.message}`);
			const r = recipeStepApply(target, { op: step.op, params: carried.params });
			if (!r.ok) return failAt(piece, version, k + 1, step.op, `${stepWords(step.op)} cannot be made on this size: ${r.error.message}`);
			const b = recipeStepApply(base, step);
			if (!b.ok) return failAt(piece, version, k + 1, step.op, `${stepWords(step.op)} no longer replays on the base size itself: ${b.error.message}`);
			ledger.push(...r.ledgerEntries, ...reshapeDeclaredOnSize(step.op, target, r.piece));
			base = b.piece;
			target = r.piece;
			tick();
		}
		return { ok: true, value: { base, target, ledger } };
	}

	function versionMade(piece: RecipePiece, number: number): Made<ReplayedVersion> {
		let byNumber = versions.get(piece.id);
		if (!byNumber) versions.set(piece.id, (byNumber = new Map()));
		const known = byNumber.get(number);
		if (known) return known;
		const v = piece.versions.find((x) => x.number === number);
		let made: Made<ReplayedVersion>;
		if (!v) made = failAt(piece, number, 0, '', `version ${number} is not stored`);
		else if (number === 1) made = originMade(piece, v.recipe[0], v.geometry);
		else {
			const prev = versionMade(piece, number - 1);
			const baseBefore = piece.versions.find((x) => x.number === number - 1)!.geometry;
			if (!prev.ok) made = prev;
			else {
				const r = stepsReplay(piece, number, baseBefore, prev.value.piece, v.recipe);
				made = r.ok ? { ok: true, value: { piece: r.value.target, base: v.geometry, before: prev.value.piece, ledger: r.value.ledger } } : r;
			}
		}
		byNumber.set(number, made);
		return made;
	}

	function originMade(piece: RecipePiece, origin: RecipeStepData | undefined, stored: Piece): Made<ReplayedVersion> {
		if (origin?.op === 'draft') {
			const d = draftPart(mm, (origin.params ?? {}) as DraftOrigin, drafts);
			tick();
			if (!d.ok) return failAt(piece, 1, 1, 'draft', d.message);
			const drafted = { ...d.piece, name: stored.name, cut: stored.cut, labels: stored.labels };
			return { ok: true, value: { piece: drafted, base: stored, before: drafted, ledger: [] } };
		}
		if (origin?.op === 'change_result') {
			const p = origin.params as { changeId?: string; step: number; result: number };
			const c = p.changeId ? changeMade(p.changeId, piece) : failAt(piece, 1, 1, 'change_result', 'the style change that made this piece is not named');
			if (!c.ok) return c;
			const g = c.value.steps[p.step]?.result.pieces[p.result];
			if (!g) return failAt(piece, 1, p.step + 1, c.value.carried[p.step]?.op ?? 'change', `the style change gives no piece ${p.result + 1} at step ${p.step + 1} on this size`);
			const made = { ...g, name: stored.name, cut: stored.cut, labels: stored.labels };
			return { ok: true, value: { piece: made, base: stored, before: made, ledger: [] } };
		}
		return failAt(piece, 1, 1, origin?.op ?? '', `${piece.name} was not drafted (it starts with "${origin?.op ?? 'nothing'}"), so there is no block of another size to make it from`);
	}

	function changeMade(changeId: string, forPiece: RecipePiece): Made<ChangeReplay> {
		const known = changes.get(changeId);
		if (known) return known;
		const change = style.changes.find((c) => c.id === changeId);
		const made = change ? changeReplay(change, forPiece) : failAt(forPiece, 1, 1, 'change_result', 'the style change that made this piece is not stored');
		changes.set(changeId, made);
		return made;
	}

	function changeReplay(change: RecipeChange, forPiece: RecipePiece): Made<ChangeReplay> {
		const steps: StepOutcome[] = [];
		const baseSteps: StepOutcome[] = [];
		const carried: RecipeChange['steps'][number][] = [];
		for (const [i, step] of change.steps.entries()) {
			const fail = (message: string) => failAt(forPiece, 1, i + 1, step.op, message);
			const given: Piece[] = [];
			const baseGiven: Piece[] = [];
			const recipes: StepOutcome['sourceRecipes'][number][] = [];
			for (const [k, src] of step.sources.entries()) {
				let target: Piece;
				let base: Piece;
				if ('pieceId' in src) {
					const b = change.bases.find((x) => x.pieceId === src.pieceId);
					const at = b ? versionById.get(b.versionId) : undefined;
					const srcPiece = pieceById.get(src.pieceId);
					if (!at || !srcPiece) return fail(`source ${k + 1} is a piece version that is not stored`);
					const v = versionMade(srcPiece, at.number);
					if (!v.ok) return fail(`${srcPiece.name} could not be made on this size (${v.failure.message}), so ${stepWords(step.op)} cannot be made from it`);
					target = v.value.piece;
					base = at.piece.versions.find((x) => x.number === at.number)!.geometry;
				} else {
					const t = steps[src.step]?.result.pieces[src.result];
					const b = baseSteps[src.step]?.result.pieces[src.result];
					if (!t || !b) return fail(`source ${k + 1} names a result step ${src.step + 1} did not give on this size`);
					target = t;
					base = b;
				}
				const before = target;
				const r = stepsReplay(forPiece, 1, base, target, src.recipe ?? []);
				if (!r.ok) return r;
				given.push(r.value.target);
				baseGiven.push(r.value.base);
				recipes.push({ before, ledger: r.value.ledger });
			}
			const sources = piecesForStep(given);
			const baseSources = piecesForStep(baseGiven);
			const params = stepParamsCarry(step.params, baseSources, sources, true);
			if (!params.ok) return fail(`${stepWords(step.op)}: ${params.message}`);
			const c = { ...step, params: params.params };
			const r = piecesStepApply(sources, c);
			if (!r.ok) return fail(`${stepWords(step.op)} cannot be made on this size: ${r.error.message}`);
			const b = piecesStepApply(baseSources, step);
			if (!b.ok) return fail(`${stepWords(step.op)} no longer replays on the base size itself: ${b.error.message}`);
			steps.push({ sources, sourceRecipes: recipes, result: r });
			baseSteps.push({ sources: baseSources, sourceRecipes: [], result: b });
			carried.push(c);
			tick();
		}
		return { ok: true, value: { steps, baseSteps, carried } };
	}

	const failures: SizeFailure[] = [];
	const out = new Map<string, Map<number, ReplayedVersion>>();
	for (const piece of style.pieces) {
		const head = piece.versions[piece.versions.length - 1];
		if (!head) continue;
		const r = versionMade(piece, head.number);
		if (!r.ok && !failures.some((f) => f.pieceId === r.failure.pieceId && f.version === r.failure.version && f.step === r.failure.step && f.message === r.failure.message)) failures.push(r.failure);
	}
	for (const [pieceId, byNumber] of versions) {
		const ok = new Map<number, ReplayedVersion>();
		for (const [n, m] of byNumber) if (m.ok) ok.set(n, m.value);
		out.set(pieceId, ok);
	}
	const okChanges = new Map<string, ChangeReplay>();
	for (const [id, c] of changes) if (c.ok) okChanges.set(id, c.value);
	return { versions: out, changes: okChanges, failures, stepsDone };
}
