import type { Path } from '../kernel';
import type { LedgerEntry } from '../ledger';
import type { OperationReport } from '../operation-result';
import type { Piece } from '../piece-schema';

/**
 * Result types of the panel operations. They follow the dart operations' contract
 * (`{ ok: true, piece, ledgerEntries, report } | { ok: false, error: { code, message } }`, see
 * ../operation-result.ts); multi-piece operations return `pieces` and `seamPairs` instead of `piece`.
 * The error codes are the panel operations' own (the dart operations' union does not list them).
 */

export type PanelErrorCode =
	| 'invalid_params'
	| 'invalid_piece'
	| 'style_line_too_short'
	| 'style_line_off_outline'
	| 'style_line_leaves_piece'
	| 'unknown_internal_line'
	| 'cut_crosses_dart'
	| 'seam_not_on_piece'
	| 'seam_gap_too_wide'
	| 'seam_edges_differ'
	| 'no_divergence_point'
	| 'wedge_not_closing'
	| 'style_line_misses_panel'
	| 'seam_end_not_at_vertex'
	| 'point_off_outline'
	| 'point_outside_piece'
	| 'fold_edge_curved'
	| 'fold_not_on_outline'
	| 'no_fold'
	| 'allowance_failed'
	| 'result_broken';

export interface PanelError {
	readonly code: PanelErrorCode;
	readonly message: string;
}

export type PanelFailure = { readonly ok: false; readonly error: PanelError };

/** One side of a seam: the piece and its stitching-line edge as a path. */
export interface SeamEdge {
	readonly pieceId: string;
	readonly edge: Path;
}

/**
 * Two edges that are sewn together. Convention: both edges run the same way along the seam (each
 * starts at the shared start of the seam), so equal arc lengths from the start are matching points.
 */
export interface SeamPair {
	readonly id: string;
	readonly a: SeamEdge;
	readonly b: SeamEdge;
	/** Designed length difference a − b (ease, mm); 0 for seams that must match. */
	readonly allowedEaseMm: number;
	/** Accepted deviation from the allowed ease (mm). */
	readonly toleranceMm: number;
}

export type PieceResult =
	| {
			readonly ok: true;
			readonly piece: Piece;
			readonly ledgerEntries: readonly LedgerEntry[];
			readonly report: OperationReport;
	  }
	| PanelFailure;

export type PiecesResult =
	| {
			readonly ok: true;
			readonly pieces: readonly Piece[];
			readonly seamPairs: readonly SeamPair[];
			readonly ledgerEntries: readonly LedgerEntry[];
			readonly report: OperationReport;
	  }
	| PanelFailure;

export function panelRefuse(code: PanelErrorCode, message: string): PanelFailure {
	return { ok: false, error: { code, message } };
}

export function panelReport(
	op: string,
	summary: string,
	values: Record<string, number> = {},
	notes: string[] = []
): OperationReport {
	return { op, summary, values, notes };
}
