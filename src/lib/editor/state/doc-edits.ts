import { vecAdd, type Vec } from '$lib/geometry';
import type { LedgerEntry } from '$lib/pattern/ledger';
import type { SeamPair } from '$lib/pattern/panels';
import type { Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import { docReplacePiece, type EditorDoc, type PendingSeam, type PendingStep, type PieceEdit, type SeamEdit, type StepRecord } from '../doc';
import { editorApply, editorSeparate } from '../ops';

/**
 * Changes to the document as pure functions: each gives the next document and the name of the change
 * (its undo step), or the reason it cannot be made.
 */
export type DocEdit = { ok: true; doc: EditorDoc; label: string; select?: string | null } | { ok: false; error: string };

/** Seam pairs made by Separate and Carry: sewn to match (no ease), trued to 1/16 in. */
const NEW_SEAM_TOLERANCE_MM = 1.6;
const CANNOT = 'This piece cannot be changed here.';

export const recipeOf = (p: Pick<PieceEdit, 'steps'>): RecipeStepData[] => p.steps.map((s) => ({ op: s.op, params: s.params }));
/** Labelled changes declared with the steps (e.g. a trued seam's length), sent with the save. */
export const declaredOf = (p: Pick<PieceEdit, 'steps'>): LedgerEntry[] => p.steps.flatMap((s) => s.declared ?? []);

/** A piece made by a multi-piece step in the editor, not saved yet: its history starts with the style change. */
export function pieceEditNew(key: string, g: Piece, offset: Vec): PieceEdit {
	return { key, name: g.name, cut: g.cut, fabric: g.fabric, baseVersionId: null, baseNumber: 0, base: g, geometry: g, steps: [], offset, origin: { op: 'change_result' }, retired: false, readOnly: false };
}

/** A panel operation's seam pairs (pieces named by geometry id) as pending pairs between the new pieces' editor keys. */
function pendingSeams(pairs: readonly SeamPair[], made: readonly PieceEdit[], label: (i: number, a: PieceEdit, b: PieceEdit) => string): PendingSeam[] {
	const byId = new Map(made.map((p) => [p.geometry.id, p]));
	return pairs.flatMap((sp, i) => {
		const a = byId.get(sp.a.pieceId);
		const b = byId.get(sp.b.pieceId);
		if (!a || !b || a === b) return [];
		return [{ label: label(i, a, b).slice(0, 120), a: { pieceKey: a.key, edge: sp.a.edge }, b: { pieceKey: b.key, edge: sp.b.edge }, allowedEaseMm: 0, toleranceMm: NEW_SEAM_TOLERANCE_MM }];
	});
}

export interface StepExtras {
	readonly label?: string;
	readonly declared?: readonly LedgerEntry[];
	readonly seamEdit?: SeamEdit;
}

/** One recipe step on one piece, with what it posts to the ledger and what is declared with it. */
export function docStepApply(doc: EditorDoc, key: string, step: RecipeStepData, extras: StepExtras = {}): DocEdit {
	const p = doc.pieces.find((q) => q.key === key);
	if (!p || p.readOnly) return { ok: false, error: CANNOT };
	const r = editorApply(p.geometry, step);
	if (!r.ok) return { ok: false, error: r.error.message };
	const declared = extras.declared ?? [];
	const rec: StepRecord = { op: step.op, params: step.params, ledger: [...r.ledgerEntries, ...declared], summary: r.report.summary, notes: r.report.notes, declared, ...(extras.seamEdit ? { seamEdit: extras.seamEdit } : {}) };
	return { ok: true, doc: docReplacePiece(doc, key, (q) => ({ ...q, geometry: r.piece, steps: [...q.steps, rec] })), label: extras.label ?? `${p.name}: ${r.report.summary}` };
}

/** Cut a piece along one of its style lines into two new pieces (saved as new pieces). */
export function docSeparate(doc: EditorDoc, key: string, styleLineId: string, stamp: string): DocEdit {
	const p = doc.pieces.find((q) => q.key === key);
	if (!p || p.readOnly) return { ok: false, error: CANNOT };
	const names: [string, string] = [`${p.name} — upper`, `${p.name} — lower`];
	const r = editorSeparate(p.geometry, { styleLineId, pieceNames: names });
	if (!r.ok) return { ok: false, error: r.error.message };
	const made: PieceEdit[] = r.pieces.map((g, i) => pieceEditNew(`new-${stamp}-${i}`, g, vecAdd(p.offset, { x: 0, y: i * 25 })));
	const step: PendingStep = { op: 'separate', params: { styleLineId, pieceNames: names }, sources: [{ key, recipe: recipeOf(p) }], resultKeys: made.map((m) => m.key) };
	const pieces = doc.pieces.flatMap((q) => (q.key === key ? [{ ...q, retired: true }, ...made] : [q]));
	const line = p.geometry.internalLines.find((l) => l.id === styleLineId);
	const seams = pendingSeams(r.seamPairs, made, () => `${p.name} separated at ${line?.label || 'the style line'}`);
	return {
		ok: true,
		doc: { pieces, pendingSteps: [...(doc.pendingSteps ?? []), step], pendingSeams: [...(doc.pendingSeams ?? []), ...seams] },
		label: `${p.name}: separated into ${made.length} pieces — ${r.report.summary}`,
		select: made[0]?.key ?? null
	};
}

export interface Merge {
	readonly sources: readonly string[];
	readonly made: readonly Piece[];
	readonly step: Pick<PendingStep, 'op' | 'params'>;
	readonly label: string;
	readonly seamPairs?: readonly SeamPair[];
	readonly seamLabel?: (i: number, a: PieceEdit, b: PieceEdit) => string;
}

/**
 * Panels merged into new pieces (join, carry): the step is kept to be saved as a style change (with
 * the new pieces, recomputed by the server from the sources' versions); the sources are hidden here.
 */
export function docMerge(doc: EditorDoc, m: Merge, stamp: string): DocEdit {
	const src = m.sources.map((k) => doc.pieces.find((q) => q.key === k));
	if (src.some((p) => !p || p.readOnly)) return { ok: false, error: 'These pieces cannot be changed here.' };
	if (src.some((p) => p!.steps.length > 0)) return { ok: false, error: 'Save the changes to these pieces first: a merged piece starts from saved versions.' };
	const first = src[0]!;
	const list: PieceEdit[] = m.made.map((g, i) => pieceEditNew(`new-${stamp}-${i}`, g, first.offset));
	const pending: PendingStep = { ...m.step, sources: m.sources.map((key) => ({ key, recipe: [] })), resultKeys: list.map((p) => p.key) };
	const gone = new Set(m.sources);
	const pieces = [...doc.pieces.map((q) => (gone.has(q.key) ? { ...q, retired: true } : q)), ...list];
	const seams = pendingSeams(m.seamPairs ?? [], list, m.seamLabel ?? ((i) => `seam ${i + 1}`));
	return { ok: true, doc: { pieces, pendingSteps: [...(doc.pendingSteps ?? []), pending], pendingSeams: [...(doc.pendingSeams ?? []), ...seams] }, label: m.label, select: list[0]?.key ?? null };
}

/** Lay pieces at their own (drafting) coordinates: one shared offset, no spreading. */
export function docLayAsDrafted(doc: EditorDoc, keys: readonly string[]): DocEdit {
	const first = doc.pieces.find((q) => q.key === keys[0]);
	if (!first) return { ok: false, error: 'No such piece.' };
	const gone = new Set(keys);
	return { ok: true, doc: { ...doc, pieces: doc.pieces.map((q) => (gone.has(q.key) ? { ...q, offset: first.offset } : q)) }, label: `${keys.length} pieces laid as drafted` };
}

export function docPieceMoved(doc: EditorDoc, key: string, offset: Vec): DocEdit {
	const p = doc.pieces.find((q) => q.key === key);
	if (!p) return { ok: false, error: 'No such piece.' };
	return { ok: true, doc: docReplacePiece(doc, key, (q) => ({ ...q, offset })), label: `${p.name} moved on the table` };
}

/** A piece's new state in place of the old (its key changes when a new piece is first stored). */
export function docPieceRekeyed(doc: EditorDoc, oldKey: string, next: PieceEdit): EditorDoc {
	const key = next.key;
	let d = docReplacePiece(doc, oldKey, () => next);
	if (key !== oldKey && d.pendingSeams?.length) {
		const k = (x: string) => (x === oldKey ? key : x);
		d = { ...d, pendingSeams: d.pendingSeams.map((sp) => ({ ...sp, a: { ...sp.a, pieceKey: k(sp.a.pieceKey) }, b: { ...sp.b, pieceKey: k(sp.b.pieceKey) } })) };
	}
	return d;
}

/**
 * New pieces named before their first save: the pending seams between them were labelled with the
 * provisional names ("style seam 1 (… (a))"); each label takes the name given instead.
 */
export function docPendingSeamsRenamed(doc: EditorDoc, renames: ReadonlyMap<string, string>): EditorDoc {
	if (!doc.pendingSeams?.length || renames.size === 0) return doc;
	const relabel = (label: string) => [...renames].reduce((l, [from, to]) => (from && from !== to ? l.split(`(${from})`).join(`(${to})`) : l), label);
	return { ...doc, pendingSeams: doc.pendingSeams.map((sp) => ({ ...sp, label: relabel(sp.label).slice(0, 120) })) };
}
