import { outlineProblems, vecDistance, type OutlineCheckOptions } from './kernel';
import type { LedgerEntry } from './ledger';
import { pieceStructureProblems } from './piece';
import type { Piece } from './piece-schema';

export type OperationErrorCode =
	| 'invalid_params'
	| 'invalid_piece'
	| 'unknown_dart'
	| 'unknown_apex'
	| 'target_off_outline'
	| 'target_inside_dart'
	| 'target_on_wedge'
	| 'target_on_fold'
	| 'targets_coincide'
	| 'shares_do_not_sum'
	| 'share_not_positive'
	| 'legs_unequal'
	| 'clearance_too_long'
	| 'clearance_not_positive'
	| 'pivot_radius_too_large'
	| 'pleat_line_misses_pivot_circle'
	| 'pleat_count'
	| 'slash_off_outline'
	| 'slash_leaves_piece'
	| 'slash_lines_cross'
	| 'spread_not_positive'
	| 'spread_too_wide'
	| 'cap_not_found'
	| 'result_broken';

export interface OperationError {
	/** One of OperationErrorCode, or a panel operation's code (panels/panel-types.ts). */
	readonly code: OperationErrorCode | (string & {});
	readonly message: string;
}

/** What an operation tells the pattern cutter it did (numbers in mm, mm², radians). */
export interface OperationReport {
	readonly op: string;
	readonly summary: string;
	readonly values: Readonly<Record<string, number>>;
	readonly notes: readonly string[];
}

export type OperationResult =
	| { readonly ok: true; readonly piece: Piece; readonly ledgerEntries: readonly LedgerEntry[]; readonly report: OperationReport }
	| { readonly ok: false; readonly error: OperationError };

export function refuse(code: OperationErrorCode, message: string): OperationResult {
	return { ok: false, error: { code, message } };
}

/**
 * Problems of a finished piece that make an operation refuse: the kernel's outline checks (touching at
 * an apex is allowed: block darts that share an apex meet there) and the piece's own structure.
 * `selfIntersection: false` leaves out the crossing search (parts simple by construction); `cleanParts`
 * limits it to pairs across parts each known to be free of crossings (outlineProblems).
 */
export function resultProblems(piece: Piece, options: OutlineCheckOptions = {}): string[] {
	const apexPoints = piece.apexes.map((a) => a.point);
	const found = outlineProblems(piece.outline, {}, options);
	const outline = found.filter((p) => !(p.code === 'self-intersection' && p.point && apexPoints.some((a) => vecDistance(a, p.point!) < 1e-3)));
	// every gap was measured just now (the same 1e-3 mm): the structure check need not walk the outline again
	const closed = found.every((p) => p.code === 'self-intersection');
	return [...outline.map((p) => p.message), ...pieceStructureProblems(piece, { outlineClosed: closed })];
}

/**
 * The operation's result, after resultProblems. `checks.cleanParts`: the operation made the outline of
 * parts that are rigid images of stretches of its (checked) input, so each is clean on its own and only
 * crossings between parts are searched for (see outlineSelfIntersectionsBetweenParts). The server checks
 * every saved geometry in full all the same (versionVerify).
 */
export function succeed(piece: Piece, ledgerEntries: readonly LedgerEntry[], report: OperationReport, checks: OutlineCheckOptions = {}): OperationResult {
	const problems = resultProblems(piece, checks);
	if (problems.length > 0) {
		return refuse(
			'result_broken',
			`This would give a broken piece, so nothing was changed: ${problems.slice(0, 3).join(' ')}`
		);
	}
	return { ok: true, piece, ledgerEntries, report };
}

export const toDegrees = (rad: number) => (rad * 180) / Math.PI;
export const fmtDeg = (rad: number) => `${toDegrees(rad).toFixed(2)}°`;
export const fmtMm = (mm: number) => `${mm.toFixed(1)} mm`;
