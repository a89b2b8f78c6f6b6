import type { Vec } from '$lib/geometry';
import type { PlacedPiece } from '../hit';
import { pieceIsDirty, type EditorDoc, type PieceEdit } from '../doc';
import { historyEmpty, historyPush, historyRedo, historyUndo, type History, type HistoryEntry } from './history';

/**
 * The document store: the pieces on the table and the pending style change (one immutable document),
 * with undo and redo. A mark (`begin`) lets a drag change the document many times and leave one undo
 * step (`commit`), or none (`rollback`).
 */
export class DocumentStore {
	doc = $state.raw<EditorDoc>({ pieces: [] });
	private history = $state.raw<History<EditorDoc>>(historyEmpty());
	/** The document when the open mark was set. */
	private marked: EditorDoc | null = null;

	past = $derived<readonly HistoryEntry<EditorDoc>[]>(this.history.past);
	future = $derived<readonly HistoryEntry<EditorDoc>[]>(this.history.future);
	visible = $derived(this.doc.pieces.filter((p) => !p.retired));
	placed = $derived<PlacedPiece[]>(this.visible.map((p) => ({ key: p.key, piece: p.geometry, offset: p.offset })));
	dirty = $derived(this.doc.pieces.filter(pieceIsDirty));

	piece(key: string | null): PieceEdit | null {
		return key ? (this.doc.pieces.find((p) => p.key === key) ?? null) : null;
	}

	/** A new document and no history (a load). */
	reset(doc: EditorDoc) {
		this.doc = doc;
		this.history = historyEmpty();
		this.marked = null;
	}
	/** Forget undo and redo (after a save: the versions are the new starting point). */
	historyClear() {
		this.history = historyEmpty();
	}
	/** Replace the document without an undo step (a rename on saving, a key the server gave). */
	replace(doc: EditorDoc) {
		this.doc = doc;
	}
	/** One change, one undo step. */
	push(next: EditorDoc, label: string) {
		if (this.marked) this.commit(label);
		this.history = historyPush(this.history, this.doc, label);
		this.doc = next;
	}

	/** Start a run of changes that will be one undo step. */
	begin() {
		this.marked = this.doc;
	}
	get marking(): boolean {
		return this.marked !== null;
	}
	/** A change inside the run (no undo step of its own). */
	update(next: EditorDoc) {
		if (!this.marked) this.marked = this.doc;
		this.doc = next;
	}
	/** Close the run: one undo step back to the document at the mark (none if nothing changed). */
	commit(label: string): boolean {
		const before = this.marked;
		this.marked = null;
		if (!before || before === this.doc) return false;
		this.history = historyPush(this.history, before, label);
		return true;
	}
	/** Drop the run: the document as it was at the mark. */
	rollback() {
		if (this.marked) this.doc = this.marked;
		this.marked = null;
	}

	undo(): string | null {
		this.rollback();
		const r = historyUndo(this.history, this.doc);
		if (!r) return null;
		this.history = r.history;
		this.doc = r.doc;
		return r.label;
	}
	redo(): string | null {
		this.rollback();
		const r = historyRedo(this.history, this.doc);
		if (!r) return null;
		this.history = r.history;
		this.doc = r.doc;
		return r.label;
	}

	/** Where the piece sits on the table (display only). */
	offsetOf(key: string): Vec {
		return this.piece(key)?.offset ?? { x: 0, y: 0 };
	}
}
