import type { Vec } from '$lib/geometry';
import type { SeamPairInfo } from '../api';
import type { PieceEdit } from '../doc';
import type { Hit, Snap, SnapOptions } from '../hit';
import type { DocEdit, Merge, StepExtras } from '../state/doc-edits';
import type { LengthUnit } from '$lib/pattern/measurements/units';
import type { SelectedPart } from '../state/selection.svelte';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * What a move sees of the editor: the pieces, the style's seam pairs, the unit, pointer tolerances and
 * snapping, and the few changes a move can make. Moves never see the camera, the save or the history.
 */
/** What is selected, as the moves read it. */
export interface SelectionView {
	readonly pieceKey: string | null;
	readonly segmentIndex: number;
	readonly dartId: string | null;
	readonly apexId: string | null;
	readonly seamPairId: string | null;
	readonly panels: readonly string[];
}

export interface MoveContext {
	readonly unit: LengthUnit;
	/** The pattern paper's grid (2 cm or 1 in), for snapping. */
	readonly paperGridMm: number;
	readonly seamPairs: readonly SeamPairInfo[];
	/** Pieces on the table (not retired), in drawing order. */
	readonly visible: readonly PieceEdit[];
	/** The piece selected on the table. */
	readonly selectedKey: string | null;
	/** All that is selected: a part of the piece (dart, apex, seam pair) or several panels. */
	readonly selection: SelectionView;
	piece(key: string | null): PieceEdit | null;
	/** Piece coordinates of a world point. */
	local(key: string, world: Vec): Vec;
	/** A few screen pixels, in mm at the current zoom. */
	tolMm(px?: number): number;
	snapAt(world: Vec, opts?: SnapOptions): Snap;
	/** The snap shown on the table while a point is dragged (null hides it). */
	showSnap(snap: Snap | null): void;
	/** Select a piece (a move picked it). */
	select(key: string | null): void;
	/** Select what a click hit (the select move). */
	selectHit(hit: Hit | null): void;
	/** Select a dart, an apex or a seam pair of a piece. */
	selectPart(key: string, part: SelectedPart): void;
	/** Add a panel to the panels picked together, or take it out. */
	togglePanel(key: string): void;
	/** Apply one recipe step to a piece; an error message or null. */
	apply(key: string, step: RecipeStepData, extras?: StepExtras): string | null;
	/** Any other change to the document (separate, join, carry, laying out): one undo step. */
	edit(make: (doc: import('../doc').EditorDoc, stamp: string) => DocEdit): string | null;
	/** A change made again and again while the pointer drags: the document follows, no undo step yet; an error message or null. */
	dragChange(make: (doc: import('../doc').EditorDoc) => DocEdit): string | null;
	/** The drag ended: all it changed is one undo step under this name (none if it changed nothing). */
	dragEnd(label: string): void;
	/** Said to screen readers (and shown nowhere else). */
	announce(text: string): void;
}

export type { Merge };
