import type { Vec } from '$lib/geometry';
import type { LedgerEntry } from '$lib/pattern/ledger';
import type { Piece } from '$lib/pattern/piece-schema';
import type { Hit, Snap } from '../hit';
import type { MoveContext } from './context';

export type MoveId =
	| 'select'
	| 'pivot'
	| 'share'
	| 'pleat'
	| 'pull_back'
	| 'cap'
	| 'style_line'
	| 'separate'
	| 'spread'
	| 'notch'
	| 'grain'
	| 'fold'
	| 'allowance'
	| 'measure'
	| 'join'
	| 'carry'
	| 'true_seam'
	| 'reshape';

export interface PointerInfo {
	readonly world: Vec;
	readonly screen: Vec;
	readonly snap: Snap;
	readonly hit: Hit | null;
	readonly shift: boolean;
}

export type OverlayItem =
	| { kind: 'line'; points: readonly Vec[]; tone: 'preview' | 'select' | 'reach' | 'measure'; dashed?: boolean }
	| { kind: 'point'; at: Vec; tone: 'preview' | 'select' | 'measure' | 'bad' }
	| { kind: 'handle'; at: Vec; active: boolean }
	| { kind: 'label'; at: Vec; text: string };

export interface Readout {
	readonly label: string;
	readonly value: string;
	readonly tone?: 'ok' | 'warn' | 'bad';
}

export interface MovePreview {
	/** Piece whose coordinates the overlay uses (null: world coordinates). */
	readonly pieceKey: string | null;
	/** The piece as it would be after the step (drawn instead of the current one). */
	readonly piece: Piece | null;
	/** Further resulting pieces (separate). */
	readonly pieces?: readonly Piece[];
	/** Vertical gap between the resulting pieces (mm; default 25, as Separate lays them). */
	readonly piecesGapMm?: number;
	/** The overlay is in world mm (not in the coordinates of `pieceKey`). */
	readonly overlayWorld?: boolean;
	/** Pieces the preview replaces (not drawn while it shows). */
	readonly hides?: readonly string[];
	readonly error: string | null;
	readonly readouts: readonly Readout[];
	readonly ledger: readonly LedgerEntry[];
	readonly overlay: readonly OverlayItem[];
	readonly notes: readonly string[];
	readonly canCommit: boolean;
}

/**
 * What a commit did: nothing to commit yet, a refusal (said beside the move), or done — and then the
 * same move starts again (`again`) or the table goes back to selecting (`select`).
 */
export type CommitOutcome = { done: false; error: string | null } | { done: true; then: 'again' | 'select'; announce?: string };

/** One move of the editor over its own state `S` (one member of the `MoveState` union). */
export interface MoveDef<S> {
	readonly id: MoveId;
	readonly name: string;
	/** tinykeys key for the move. */
	readonly key: string;
	/** Our own 24×24 icon, as SVG path data (stroked). */
	readonly icon: string;
	/** Changes pieces (hidden for read-only roles). */
	readonly edits: boolean;
	/** The move's state when it starts (from the selection), or again after a commit or a cancel (`prev`). */
	fresh(ctx: MoveContext, prev?: S): S;
	/** Something was picked or typed that a cancel would drop. */
	started(st: S): boolean;
	/** The move was chosen (once, not after each commit): e.g. carry lays its panels as drafted. */
	begin?(ctx: MoveContext, st: S): void;
	hint(ctx: MoveContext, st: S): string;
	preview?(ctx: MoveContext, st: S): MovePreview | null;
	/** Pointer pressed; return true to follow the drag. */
	down?(ctx: MoveContext, st: S, p: PointerInfo): boolean;
	move?(ctx: MoveContext, st: S, p: PointerInfo): void;
	/** Pointer released; `commit` asks the editor to apply the move if its preview can be applied. */
	up?(ctx: MoveContext, st: S, p: PointerInfo, moved: boolean): void | 'commit';
	commit?(ctx: MoveContext, st: S): CommitOutcome;
	/** Undo the last thing done inside the move (a reshape's last drag): its name, or null when there is none (the document's history undoes then). */
	undo?(ctx: MoveContext, st: S): string | null;
	redo?(ctx: MoveContext, st: S): string | null;
}

export const emptyPreview = (pieceKey: string | null, error: string | null = null): MovePreview => ({
	pieceKey,
	piece: null,
	error,
	readouts: [],
	ledger: [],
	overlay: [],
	notes: [],
	canCommit: false
});

export const NOTHING: CommitOutcome = { done: false, error: null };
/** The outcome of a change that answered an error message or null. */
export const outcome = (error: string | null, then: 'again' | 'select' = 'again', announce?: string): CommitOutcome =>
	error ? { done: false, error } : { done: true, then, ...(announce ? { announce } : {}) };
