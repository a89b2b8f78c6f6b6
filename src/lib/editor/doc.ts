import type { Vec } from '$lib/geometry';
import type { LedgerEntry } from '$lib/pattern/ledger';
import type { CutInstruction, Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * The editor's document: immutable values, so that one history step is one replaced document and
 * undo/redo just swaps documents (structural sharing keeps it cheap).
 */

/** One step of the recipe since the base version, with what it posted to the shaping ledger. */
export interface StepRecord {
	readonly op: string;
	readonly params: unknown;
	readonly ledger: readonly LedgerEntry[];
	readonly summary: string;
	readonly notes: readonly string[];
	/** Labelled changes declared with this step (sent as the save's `declared`). */
	readonly declared?: readonly LedgerEntry[];
}

export interface PieceEdit {
	/** Server piece id, or `new-…` for a piece made in the editor (not saved yet). */
	readonly key: string;
	readonly name: string;
	readonly cut: CutInstruction;
	readonly fabric: string;
	readonly baseVersionId: string | null;
	readonly baseNumber: number;
	/** The saved geometry the steps start from (null for a new piece). */
	readonly base: Piece | null;
	readonly geometry: Piece;
	readonly steps: readonly StepRecord[];
	/** Where the piece sits on the canvas (display only, mm). */
	readonly offset: Vec;
	/** New pieces: the step that starts their history (e.g. separate_result). */
	readonly origin: RecipeStepData | null;
	/** Replaced by the panels of a separate: not drawn, not saved. */
	readonly retired: boolean;
	/** Read-only pieces (no version shown to this role). */
	readonly readOnly: boolean;
}

export interface EditorDoc {
	readonly pieces: readonly PieceEdit[];
}

export interface HistoryEntry {
	readonly doc: EditorDoc;
	readonly label: string;
}

export function pieceIsDirty(p: PieceEdit): boolean {
	return !p.retired && !p.readOnly && (p.steps.length > 0 || p.origin !== null);
}

export function docReplacePiece(doc: EditorDoc, key: string, f: (p: PieceEdit) => PieceEdit): EditorDoc {
	return { pieces: doc.pieces.map((p) => (p.key === key ? f(p) : p)) };
}
