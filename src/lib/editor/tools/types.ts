import type { Vec } from '$lib/geometry';
import type { LedgerEntry } from '$lib/pattern/ledger';
import type { Piece } from '$lib/pattern/piece-schema';
import type { EditorState } from '../editor-state.svelte';
import type { Hit, Snap } from '../hit';

export type ToolId =
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
	| 'true_seam';

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

export interface ToolPreview {
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

export interface ToolDef {
	readonly id: ToolId;
	readonly name: string;
	/** tinykeys key for the tool. */
	readonly key: string;
	/** Our own 24×24 icon, as SVG path data (stroked). */
	readonly icon: string;
	/** Changes pieces (hidden for read-only roles). */
	readonly edits: boolean;
	hint(s: EditorState): string;
	/** Defaults picked when the tool is chosen. */
	start?(s: EditorState): void;
	preview?(s: EditorState): ToolPreview | null;
	/** Pointer pressed; return true to follow the drag. */
	down?(s: EditorState, p: PointerInfo): boolean;
	move?(s: EditorState, p: PointerInfo): void;
	up?(s: EditorState, p: PointerInfo, moved: boolean): void;
	commit?(s: EditorState): void;
}

export const emptyPreview = (pieceKey: string | null, error: string | null = null): ToolPreview => ({
	pieceKey,
	piece: null,
	error,
	readouts: [],
	ledger: [],
	overlay: [],
	notes: [],
	canCommit: false
});
