import type { Piece, CutInstruction } from '$lib/pattern/piece-schema';
import { ApiFailure, changeSave, pieceLoad, seamPairPatch, versionSave, type SaveResult, type SeamPairInfo } from '../api';
import { changeBodyBuild, changeNewPieces, changeSourceNames, namingProblem, pieceRenamed } from '../change-save';
import { docReplacePiece, type PieceEdit, type SeamEdit } from '../doc';
import { editorApply } from '../ops';
import type { StepRecord } from '../doc';
import { declaredOf, docPendingSeamsRenamed, docPieceRekeyed, recipeOf } from './doc-edits';
import type { DocumentStore } from './document.svelte';

export interface SaveReport {
	readonly pieceKey: string;
	readonly name: string;
	readonly number: number;
	readonly message: string;
	readonly checks: SaveResult['checks'];
	readonly warnings: SaveResult['warnings'];
	/** Set on the pieces one style change stored together (the key of its first piece): one report for them. */
	readonly change?: string;
}

export interface Conflict {
	readonly pieceKey: string;
	readonly name: string;
	readonly message: string;
	readonly headId: string;
	readonly headNumber: number;
	readonly head: Piece | null;
	readonly headMessage: string;
	readonly headAuthor: string;
	readonly saveMessage: string;
}

/** What a save needs of the editor. */
export interface SaveHost {
	readonly studioId: string;
	readonly styleId: string;
	readonly docs: DocumentStore;
	readonly seamPairs: readonly SeamPairInfo[];
	seamPairsRefresh(): Promise<void>;
	/** A piece's key changed (a new piece stored for the first time). */
	rekeyed(oldKey: string, key: string): void;
	announce(text: string): void;
}

type Naming = { key: string; name: string; cut: CutInstruction }[];

/**
 * The save session: the changed pieces saved as versions (the new pieces of a style change first, as
 * one change, after their names are asked), progress, refusals, and the answer to a 409.
 */
export class SaveSession {
	saving = $state<{ done: number; total: number; name: string } | null>(null);
	saveError = $state<string | null>(null);
	saveReports = $state.raw<readonly SaveReport[]>([]);
	conflict = $state.raw<Conflict | null>(null);
	/** New pieces of a multi-piece change to name before it is saved (the dialog shows while set). */
	naming = $state<Naming | null>(null);
	namingError = $state<string | null>(null);
	private namingDone = false;
	private namingMessage = '';
	private readonly host: SaveHost;

	constructor(host: SaveHost) {
		this.host = host;
	}

	/** The document changed: names given for an earlier save are asked again. */
	changed() {
		this.namingDone = false;
	}

	async save(message: string): Promise<void> {
		const docs = this.host.docs;
		if (this.saving) return;
		const todo = docs.dirty;
		if (!todo.length) return void (this.saveError = 'Nothing to save: no piece has changed since its version.');
		if (!message.trim()) return void (this.saveError = 'Say what changed in a few words before saving.');
		const news = changeNewPieces(docs.doc);
		if (news.length && !this.namingDone) {
			// a new piece gets its own name and cut instruction, asked for on saving
			this.naming = news.map((p) => ({ key: p.key, name: p.name, cut: p.cut }));
			this.namingError = null;
			this.namingMessage = message;
			return;
		}
		this.saveError = null;
		this.conflict = null;
		const reports: SaveReport[] = [];
		const singles = todo.filter((p) => !p.origin);
		const total = singles.length + (news.length ? 1 : 0);
		this.saving = { done: 0, total, name: news.length ? 'the new pieces' : todo[0].name };
		try {
			if (news.length) {
				const r = await this.saveChange(message);
				if (!r) return;
				reports.push(...r);
				this.saveReports = [...reports];
			}
			for (const [i, p] of singles.entries()) {
				this.saving = { done: i + (news.length ? 1 : 0), total, name: p.name };
				const r = await this.saveOne(p, message);
				if (!r) return;
				reports.push(r);
				this.saveReports = [...reports];
				await this.storeSeamEdits(p);
			}
			docs.historyClear();
			this.host.announce(`Saved ${reports.map((r) => `${r.name} version ${r.number}`).join(', ')}.`);
			await this.host.seamPairsRefresh();
		} finally {
			this.saving = null;
			this.namingDone = false;
		}
	}

	/** The naming dialog's answer: the new pieces take their names and cuts, then the save goes on. */
	async namingConfirm(entries: readonly { key: string; name: string; cut: CutInstruction }[]): Promise<void> {
		const docs = this.host.docs;
		const problem = namingProblem(entries, changeSourceNames(docs.doc));
		if (problem) return void (this.namingError = problem);
		let doc = docs.doc;
		const renames = new Map<string, string>();
		for (const e of entries) {
			const name = e.name.trim();
			const before = doc.pieces.find((q) => q.key === e.key)?.name;
			if (before) renames.set(before, name);
			doc = docReplacePiece(doc, e.key, (q) => ({ ...q, name, cut: e.cut, base: q.base && pieceRenamed(q.base, name, e.cut), geometry: pieceRenamed(q.geometry, name, e.cut) }));
		}
		docs.replace(docPendingSeamsRenamed(doc, renames));
		this.naming = null;
		this.namingError = null;
		this.namingDone = true;
		await this.save(this.namingMessage);
	}
	namingCancel() {
		this.naming = null;
		this.namingError = null;
	}

	private rekey(oldKey: string, next: PieceEdit) {
		this.host.docs.replace(docPieceRekeyed(this.host.docs.doc, oldKey, next));
		this.host.rekeyed(oldKey, next.key);
	}

	/** Every pending multi-piece step as one style change: all stored, or nothing (the server's answer). */
	private async saveChange(message: string): Promise<SaveReport[] | null> {
		const docs = this.host.docs;
		const built = changeBodyBuild(docs.doc, message, recipeOf, declaredOf);
		if (typeof built === 'string') {
			this.saveError = built;
			return null;
		}
		try {
			const r = await changeSave(this.host.studioId, this.host.styleId, built.body);
			const reports: SaveReport[] = [];
			for (const [i, key] of built.newKeys.entries()) {
				const p = docs.piece(key)!;
				const made = r.pieces[i];
				const head = made.versions[made.versions.length - 1];
				this.rekey(key, { ...p, key: made.id, base: p.geometry, baseVersionId: head.id, baseNumber: head.number, steps: [], origin: null });
				reports.push({ pieceKey: made.id, name: p.name, number: head.number, message, checks: r.checks, warnings: r.warnings, change: r.pieces[0].id });
			}
			docs.replace({ ...docs.doc, pendingSteps: [], pendingSeams: [] });
			return reports;
		} catch (e) {
			const why = e instanceof Error ? e.message : String(e);
			this.saveError = e instanceof ApiFailure && e.status === 409 ? `The change was not saved: ${why}` : `The change was not saved: ${why} Your edits are kept.`;
			return null;
		}
	}

	private async saveOne(p: PieceEdit, message: string): Promise<SaveReport | null> {
		try {
			const r = await versionSave(this.host.studioId, p.key, { baseVersionId: p.baseVersionId, message, geometry: p.geometry, recipe: recipeOf(p), declared: declaredOf(p) });
			this.rekey(p.key, { ...p, base: p.geometry, baseVersionId: r.version.id, baseNumber: r.version.number, steps: [], origin: null });
			return { pieceKey: p.key, name: p.name, number: r.version.number, message, checks: r.checks, warnings: r.warnings };
		} catch (e) {
			if (e instanceof ApiFailure && e.status === 409) {
				await this.openConflict(p, e, message);
				this.saveError = `${p.name}: ${e.message}`;
			} else {
				this.saveError = `${p.name} was not saved: ${e instanceof Error ? e.message : String(e)} Your edits are kept.`;
			}
			return null;
		}
	}

	/** A saved piece's trued seams: move the stored pairs' edge ends so the server measures the trued edges. */
	private async storeSeamEdits(p: PieceEdit): Promise<void> {
		// the last edit of each edge wins
		const edits = new Map<string, SeamEdit>();
		for (const st of p.steps) if (st.seamEdit) edits.set(`${st.seamEdit.seamPairId}:${st.seamEdit.side}`, st.seamEdit);
		for (const e of edits.values()) {
			try {
				await seamPairPatch(this.host.studioId, this.host.styleId, e.seamPairId, { [e.side]: { from: e.from, to: e.to } });
			} catch (err) {
				const name = this.host.seamPairs.find((x) => x.id === e.seamPairId)?.label || 'a seam pair';
				this.saveError = `${p.name} was saved, but ${name} still has its old edge ends: ${err instanceof Error ? err.message : String(err)}`;
			}
		}
	}

	private async openConflict(p: PieceEdit, e: ApiFailure, saveMessage: string) {
		let head: Piece | null = null;
		let headId = e.headers?.get('x-head-version') ?? '';
		let headNumber = Number(e.headers?.get('x-head-number') ?? 0);
		let headMessage = '';
		let headAuthor = '';
		try {
			const d = await pieceLoad(this.host.studioId, p.key);
			head = d.shown?.geometry ?? null;
			headId = d.shown?.id ?? headId;
			headNumber = d.shown?.number ?? headNumber;
			const v = d.versions.find((x) => x.id === headId);
			headMessage = v?.message ?? '';
			headAuthor = v?.authorName ?? '';
		} catch {
			/* shown without details */
		}
		this.conflict = { pieceKey: p.key, name: p.name, message: e.message, headId, headNumber, head, headMessage, headAuthor, saveMessage };
	}

	/** Drop my steps on this piece and take the server's head. */
	conflictReload() {
		const c = this.conflict;
		if (!c || !c.head) return;
		const docs = this.host.docs;
		docs.replace(docReplacePiece(docs.doc, c.pieceKey, (q) => ({ ...q, base: c.head, geometry: c.head!, baseVersionId: c.headId, baseNumber: c.headNumber, steps: [] })));
		docs.historyClear();
		this.conflict = null;
		this.saveError = null;
		this.host.announce(`Reloaded version ${c.headNumber} of ${c.name}.`);
	}

	/** Re-apply my steps on the server's head, then save on top of it. */
	async conflictSaveOnTop(): Promise<void> {
		const c = this.conflict;
		const docs = this.host.docs;
		const p = c && docs.piece(c.pieceKey);
		if (!c || !p || !c.head) return;
		let g = c.head;
		const steps: StepRecord[] = [];
		for (const [i, s] of p.steps.entries()) {
			const r = editorApply(g, { op: s.op, params: s.params });
			if (!r.ok) {
				this.saveError = `Step ${i + 1} (${s.op}) does not apply to version ${c.headNumber}: ${r.error.message} Your edits are kept; reload or change the step.`;
				return;
			}
			g = r.piece;
			steps.push({ ...s, ledger: r.ledgerEntries, summary: r.report.summary, notes: r.report.notes });
		}
		docs.replace(docReplacePiece(docs.doc, c.pieceKey, (q) => ({ ...q, base: c.head, geometry: g, baseVersionId: c.headId, baseNumber: c.headNumber, steps })));
		this.conflict = null;
		this.saveError = null;
		await this.save(c.saveMessage);
	}
}
