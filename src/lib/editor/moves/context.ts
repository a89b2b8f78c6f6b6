import type { Vec } from '$lib/geometry';
import type { SeamPairInfo } from '../api';
import type { PieceEdit } from '../doc';
import type { Hit, Snap, SnapOptions } from '../hit';
import type { DocEdit, Merge, StepExtras } from '../state/doc-edits';
import type { LengthUnit } from '../units';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';

/**
 * What a move sees of the editor: the pieces, the style's seam pairs, the unit, pointer tolerances and
 * snapping, and the few changes a move can make. Moves never see the camera, the save or the history.
 */
export interface MoveContext {
	readonly unit: LengthUnit;
	readonly seamPairs: readonly SeamPairInfo[];
	/** Pieces on the table (not retired), in drawing order. */
	readonly visible: readonly PieceEdit[];
	/** The piece selected on the table. */
	readonly selectedKey: string | null;
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
	/** Apply one recipe step to a piece; an error message or null. */
	apply(key: string, step: RecipeStepData, extras?: StepExtras): string | null;
	/** Any other change to the document (separate, join, carry, laying out): one undo step. */
	edit(make: (doc: import('../doc').EditorDoc, stamp: string) => DocEdit): string | null;
	/** Said to screen readers (and shown nowhere else). */
	announce(text: string): void;
}

export type { Merge };
