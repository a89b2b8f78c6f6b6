import type { Path, Vec } from '$lib/geometry';
import type { LedgerEntry } from '$lib/pattern/ledger';
import type { CutInstruction, Piece } from '$lib/pattern/piece-schema';
import type { PiecesStepName } from '$lib/pattern/recipe/registry';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * The editor's document: immutable values, so that one history step is one replaced document and
 * undo/redo just swaps documents (structural sharing keeps it cheap).
 */

/**
 * A multi-piece step made in the editor and not saved yet (separate, join, carry): its sources by editor
 * key (a stored piece, or a new piece an earlier pending step made) with the steps made on each before
 * it, and the editor keys of its results. All pending steps are saved as one style change.
 */
export interface PendingStep {
	readonly op: PiecesStepName;
	readonly params: unknown;
	readonly sources: readonly { readonly key: string; readonly recipe: readonly RecipeStepData[] }[];
	readonly resultKeys: readonly string[];
}

/** One step of the recipe since the base version, with what it posted to the shaping ledger. */
export interface StepRecord {
	readonly op: string;
	readonly params: unknown;
	readonly ledger: readonly LedgerEntry[];
	readonly summary: string;
	readonly notes: readonly string[];
	/** Labelled changes declared with this step (sent as the save's `declared`). */
	readonly declared?: readonly LedgerEntry[];
	/** A stored seam pair's edge moved by this step (True seam): its new ends, sent after the save. */
	readonly seamEdit?: SeamEdit;
}

/** New ends (outline order) of one edge of a stored seam pair. */
export interface SeamEdit {
	readonly seamPairId: string;
	readonly side: 'a' | 'b';
	readonly from: Vec;
	readonly to: Vec;
}

/** A seam pair made by Separate or Carry between new pieces (editor keys), saved with the change. */
export interface PendingSeam {
	readonly label: string;
	readonly a: { readonly pieceKey: string; readonly edge: Path };
	readonly b: { readonly pieceKey: string; readonly edge: Path };
	readonly allowedEaseMm: number;
	readonly toleranceMm: number;
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
	/** New pieces: the step that starts their history (change_result: made by a pending style change). */
	readonly origin: RecipeStepData | null;
	/** Replaced by the panels of a separate: not drawn, not saved. */
	readonly retired: boolean;
	/** Read-only pieces (no version shown to this role). */
	readonly readOnly: boolean;
}

export interface EditorDoc {
	readonly pieces: readonly PieceEdit[];
	/** Multi-piece steps not saved yet: saved together as one style change (part of the document, so undo drops them). */
	readonly pendingSteps?: readonly PendingStep[];
	/** Seam pairs between new pieces, saved with the change (part of the document, so undo drops them). */
	readonly pendingSeams?: readonly PendingSeam[];
}

export function pieceIsDirty(p: PieceEdit): boolean {
	return !p.retired && !p.readOnly && (p.steps.length > 0 || p.origin !== null);
}

export function docReplacePiece(doc: EditorDoc, key: string, f: (p: PieceEdit) => PieceEdit): EditorDoc {
	return { ...doc, pieces: doc.pieces.map((p) => (p.key === key ? f(p) : p)) };
}
