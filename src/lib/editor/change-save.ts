import { outlineContainsPoint, outlineFlatten, type Path, type Vec } from '$lib/geometry';
import type { CutInstruction, Piece } from '$lib/pattern/piece-schema';
import type { PiecesStepName } from '$lib/pattern/recipe/registry';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import { cutInstructionText } from '$lib/pattern/export/svg';
import { edgeEnds } from '$lib/pattern/panels/seam-edge-ends';
import type { EditorDoc, PieceEdit } from './doc';

export type { PendingStep } from './doc';

/** The cut instructions a new piece can be given, in the naming dialog's order. */
export const CUT_INSTRUCTIONS: readonly CutInstruction[] = ['pair', 'single', 'on_fold'];

type XY = { x: number; y: number };
type Side = ({ pieceId: string } | { newPiece: number }) & { from: XY; to: XY };

export interface ChangeBody {
	message: string;
	bases: { pieceId: string; versionId: string }[];
	steps: { op: PiecesStepName; sources: ({ pieceId: string; recipe: RecipeStepData[] } | { step: number; result: number; recipe: RecipeStepData[] })[]; params: unknown }[];
	pieces: { step: number; result: number; name: string; cut: CutInstruction; geometry: Piece; edits?: { recipe: RecipeStepData[]; geometry: Piece; declared: unknown[] } }[];
	seamPairs: { create: { label: string; a: Side; b: Side; allowedEaseMm: number; toleranceMm: number }[]; update: never[] };
}

/** The new pieces a save of the pending steps makes: every result no later pending step uses. */
export function changeNewPieces(doc: EditorDoc): PieceEdit[] {
	const steps = doc.pendingSteps ?? [];
	const used = new Set(steps.flatMap((s) => s.sources.map((x) => x.key)));
	const keys = steps.flatMap((s) => s.resultKeys).filter((k) => !used.has(k));
	return keys.map((k) => doc.pieces.find((p) => p.key === k)).filter((p): p is PieceEdit => !!p && !p.retired);
}

/** Names of the stored pieces the pending steps start from (a new piece must get a name of its own). */
export function changeSourceNames(doc: EditorDoc): string[] {
	const made = new Set((doc.pendingSteps ?? []).flatMap((s) => s.resultKeys));
	const keys = (doc.pendingSteps ?? []).flatMap((s) => s.sources.map((x) => x.key)).filter((k) => !made.has(k));
	return keys.map((k) => doc.pieces.find((p) => p.key === k)?.name ?? '').filter(Boolean);
}

/** A point well inside the piece for its name label: the grainline's middle, else the outline's centre. */
function labelPoint(g: Piece): Vec {
	if (g.grainline) {
		const m = { x: (g.grainline.from.x + g.grainline.to.x) / 2 + 8, y: (g.grainline.from.y + g.grainline.to.y) / 2 };
		if (outlineContainsPoint(g.outline, m)) return m;
	}
	const pts = outlineFlatten(g.outline, 1);
	const c = pts.reduce((a, p) => ({ x: a.x + p.x / pts.length, y: a.y + p.y / pts.length }), { x: 0, y: 0 });
	return outlineContainsPoint(g.outline, c) ? c : pts[0];
}

/** The piece under its own name and cut: the sources' labels go, one label says name and cut instruction. */
export function pieceRenamed(g: Piece, name: string, cut: CutInstruction): Piece {
	const text = `${name} — ${cutInstructionText(cut)}`;
	return { ...g, name, cut, labels: [{ id: 'name', text, at: labelPoint(g), angleRad: g.labels.find((l) => l.id === 'name')?.angleRad ?? 0 }] };
}

/** What is wrong with the names given to the new pieces, or null. */
export function namingProblem(entries: readonly { name: string }[], sourceNames: readonly string[]): string | null {
	const seen = new Set<string>();
	for (const [i, e] of entries.entries()) {
		const n = e.name.trim();
		if (!n) return `Give new piece ${i + 1} a name.`;
		if (n.length > 120) return `The name of new piece ${i + 1} is longer than 120 characters.`;
		if (sourceNames.some((s) => s.trim().toLowerCase() === n.toLowerCase())) return `"${n}" is the name of a piece it was made from; give the new piece a name of its own.`;
		if (seen.has(n.toLowerCase())) return `Two new pieces are both called "${n}".`;
		seen.add(n.toLowerCase());
	}
	return null;
}

/** The body of POST …/changes for the document's pending steps, or a reason it cannot be sent. */
export function changeBodyBuild(doc: EditorDoc, message: string, recipeOf: (p: PieceEdit) => RecipeStepData[], declaredOf: (p: PieceEdit) => unknown[]): { body: ChangeBody; newKeys: string[] } | string {
	const steps = doc.pendingSteps ?? [];
	const piece = (k: string) => doc.pieces.find((p) => p.key === k);
	const made = new Map<string, { step: number; result: number }>();
	steps.forEach((s, i) => s.resultKeys.forEach((k, r) => made.set(k, { step: i, result: r })));
	const bases = new Map<string, string>();
	const out: ChangeBody['steps'] = [];
	for (const s of steps) {
		const sources: ChangeBody['steps'][number]['sources'] = [];
		for (const src of s.sources) {
			const at = made.get(src.key);
			if (at) sources.push({ ...at, recipe: [...src.recipe] });
			else {
				const p = piece(src.key);
				if (!p?.baseVersionId) return `A piece this change starts from is not saved yet (${p?.name ?? src.key}).`;
				bases.set(src.key, p.baseVersionId);
				sources.push({ pieceId: src.key, recipe: [...src.recipe] });
			}
		}
		out.push({ op: s.op, sources, params: s.params });
	}
	const news = changeNewPieces(doc);
	const pieces: ChangeBody['pieces'] = news.map((p) => {
		const at = made.get(p.key)!;
		const edits = p.steps.length ? { recipe: recipeOf(p), geometry: p.geometry, declared: declaredOf(p) } : undefined;
		return { ...at, name: p.name, cut: p.cut, geometry: p.base ?? p.geometry, ...(edits ? { edits } : {}) };
	});
	const index = new Map(news.map((p, i) => [p.key, i]));
	const side = (key: string, edge: Path): Side | null => {
		const p = piece(key);
		if (!p || p.retired) return null;
		const ends = edgeEnds(p.geometry, edge);
		const i = index.get(key);
		if (i !== undefined) return { newPiece: i, ...ends };
		return key.startsWith('new-') ? null : { pieceId: key, ...ends };
	};
	const create: ChangeBody['seamPairs']['create'] = [];
	for (const sp of doc.pendingSeams ?? []) {
		const a = side(sp.a.pieceKey, sp.a.edge);
		const b = side(sp.b.pieceKey, sp.b.edge);
		if (a && b) create.push({ label: sp.label, a, b, allowedEaseMm: sp.allowedEaseMm, toleranceMm: sp.toleranceMm });
	}
	return { body: { message, bases: [...bases].map(([pieceId, versionId]) => ({ pieceId, versionId })), steps: out, pieces, seamPairs: { create, update: [] } }, newKeys: news.map((p) => p.key) };
}
