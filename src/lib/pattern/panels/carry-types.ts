import type { Path } from '../kernel';
import type { LedgerEntry } from '../ledger';
import type { OperationReport } from '../operation-result';
import type { Piece } from '../piece-schema';
import type { PanelFailure, SeamPair } from './panel-types';
import type { LegWalk } from './carry-walk';

/** What carry takes and gives (carry.ts). */

export interface CarryParams {
	readonly styleLine: Path;
	/** Side of the style line whose parts are joined into one piece (y down: 'above' = smaller y). */
	readonly fuse: 'above' | 'below';
	readonly residualAs?: 'dart' | 'pleats';
	readonly pieceId?: string;
	readonly name?: string;
	readonly styleSeamId?: string;
	/**
	 * Walk the legs of every wedge the style line crosses to one length before closing it (carry-walk.ts);
	 * on unless false.
	 */
	readonly walkLegs?: boolean;
}

export interface CarryPlacement {
	readonly panelId: string;
	readonly angleRad: number;
	readonly dxMm: number;
	readonly dyMm: number;
}

export type SeamOutcome = 'closed' | 'residual' | 'plain';

export interface CarrySeam {
	readonly seamId: string;
	readonly apexId: string;
	readonly outcome: SeamOutcome;
	readonly angleRad: number;
	/** Distance from D to the style line along the seam (0 when it reaches D). */
	readonly distanceMm: number;
	/** Width the wedge takes out of the style line (outcome 'closed'). */
	readonly closedAtLineMm: number;
}

export interface CarryResidual {
	readonly seamId: string;
	readonly apexId: string;
	/** How far the style line passes from D (mm). */
	readonly distanceMm: number;
	readonly angleRad: number;
	readonly angleDeg: number;
	/** Width of the residual at the style line: 2·h·tan(θ/2) for a line square to its centre line. */
	readonly widthAtLineMm: number;
	/** Straight distance across the opening as it lies on the joined piece. */
	readonly openingChordMm: number;
	readonly leftAs: 'dart' | 'pleats';
	readonly markingId: string;
	readonly message: string;
}

export type CarryResult =
	| {
			readonly ok: true;
			/** The joined piece first, then the parts on the other side of the style line (unchanged). */
			readonly pieces: readonly Piece[];
			readonly seamPairs: readonly SeamPair[];
			readonly seams: readonly CarrySeam[];
			readonly residuals: readonly CarryResidual[];
			readonly reachLine: Path;
			/** The style line as cut: as drawn, bent where wedge legs were walked equal. */
			readonly styleLine: Path;
			/** Every panel seam whose wedge the line crosses: where its legs were cut, walked or not. */
			readonly legWalks: readonly LegWalk[];
			/**
			 * Where each panel's part on the chosen side was laid in the joined piece: a rigid turn by angleRad
			 * followed by a shift, p ↦ R(angleRad)·p + (dxMm, dyMm), in the order the panels were given (panel 0
			 * stays put). Its inverse lays a part back as drafted (un-carry).
			 */
			readonly placements: readonly CarryPlacement[];
			readonly styleSeamEdges: readonly Path[];
			readonly styleSeamLengthMm: number;
			/** The style line across the other side as drawn (its parts plus what stays open between them). */
			readonly otherSideSeamLengthMm: number;
			/** otherSideSeamLengthMm − styleSeamLengthMm: the width of shaping taken out of the style seam. */
			readonly shapingMovedMm: number;
			readonly ledgerEntries: readonly LedgerEntry[];
			readonly report: OperationReport;
	  }
	| PanelFailure;
