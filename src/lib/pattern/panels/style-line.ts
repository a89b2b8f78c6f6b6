import {
	outlineContainsPoint,
	outlineNearestPoint,
	pathIntersections,
	pathLength,
	pathPointAtLength,
	type Outline,
	type Path,
	type SegmentLocation,
	type Vec
} from '../kernel';
import type { Piece } from '../piece-schema';
import { dist, pathFirst, pathLast, pathWithEnds } from './chain-tools';
import { panelRefuse, panelReport, type PanelFailure, type PieceResult } from './panel-types';
import { MIN_STYLE_LINE_MM, ON_LINE_MM, SEAM_SNAP_MM, STYLE_LINE_SNAP_MM, VERTEX_SNAP_MM } from './panel-tolerances';
import { pieceProblems } from './piece-tools';

/**
 * style_line: a new line across a piece (lines and Béziers) with both ends on the outline. Ends within
 * `snapToleranceMm` of the outline are snapped onto it; farther ones are refused. The line must stay
 * inside the piece between its ends. Stored as an internal line (trade-primer §6).
 */

export interface StyleLineParams {
	readonly id: string;
	readonly path: Path;
	readonly label?: string;
	readonly snapToleranceMm?: number;
}

export interface CheckedStyleLine {
	readonly ok: true;
	readonly path: Path;
	/** Where the snapped ends are on the outline. */
	readonly startAt: SegmentLocation;
	readonly endAt: SegmentLocation;
	readonly startSnapMm: number;
	readonly endSnapMm: number;
}

/** An end this close to an outline vertex is moved onto it (no sliver segments at the cut). */
function snapToVertex(outline: Outline, n: { segmentIndex: number; t: number; point: Vec }): Vec {
	return snappedLocation(outline, n).point;
}

function snappedLocation(outline: Outline, n: { segmentIndex: number; t: number; point: Vec }): { segmentIndex: number; t: number; point: Vec } {
	const s = outline.segments[n.segmentIndex];
	const end = s.kind === 'line' ? s.p1 : s.p3;
	if (dist(n.point, s.p0) <= VERTEX_SNAP_MM) return { segmentIndex: n.segmentIndex, t: 0, point: s.p0 };
	if (dist(n.point, end) <= VERTEX_SNAP_MM) return { segmentIndex: n.segmentIndex, t: 1, point: end };
	return n;
}

/** Snap a style line's ends onto an outline and check it runs inside it. Shared by separate and carry. */
export function styleLineOnOutline(
	outline: Outline,
	path: Path,
	snapToleranceMm = STYLE_LINE_SNAP_MM,
	/** The caller has already made sure the line crosses the outline only at its ends (carry). */
	crossingsChecked = false
): CheckedStyleLine | PanelFailure {
	if (path.segments.length === 0) return panelRefuse('invalid_params', 'The style line has no segments.');
	const length = pathLength(path);
	if (!(length >= MIN_STYLE_LINE_MM)) {
		return panelRefuse('style_line_too_short', `The style line is ${length.toFixed(2)} mm long; draw at least ${MIN_STYLE_LINE_MM} mm.`);
	}
	const a = outlineNearestPoint(outline, pathFirst(path));
	const b = outlineNearestPoint(outline, pathLast(path));
	for (const [name, n] of [['start', a], ['end', b]] as const) {
		if (n.distance > snapToleranceMm) {
			return panelRefuse(
				'style_line_off_outline',
				`The style line's ${name} is ${n.distance.toFixed(1)} mm from the outline; it must end on the outline (within ${snapToleranceMm} mm).`
			);
		}
	}
	if (dist(snapToVertex(outline, a), snapToVertex(outline, b)) < MIN_STYLE_LINE_MM) {
		return panelRefuse('style_line_off_outline', 'Both ends of the style line are at the same place on the outline.');
	}
	const snapped = pathWithEnds(path, snapToVertex(outline, a), snapToVertex(outline, b));
	const ends = [snapToVertex(outline, a), snapToVertex(outline, b)];
	const startAt = snappedLocation(outline, a);
	const endAt = snappedLocation(outline, b);
	if (crossingsChecked) return { ok: true, path: snapped, startAt, endAt, startSnapMm: a.distance, endSnapMm: b.distance };
	const crossings = pathIntersections(snapped, outline).filter((h) => ends.every((e) => dist(e, h.point) > VERTEX_SNAP_MM + 0.01));
	if (crossings.length > 0) {
		const p = crossings[0].point;
		return panelRefuse(
			'style_line_leaves_piece',
			`The style line crosses the outline at (${p.x.toFixed(1)}, ${p.y.toFixed(1)}) mm before its end; it must stay inside the piece.`
		);
	}
	const total = pathLength(snapped);
	for (const f of [0.25, 0.5, 0.75]) {
		if (!outlineContainsPoint(outline, pathPointAtLength(snapped, f * total).point)) {
			return panelRefuse('style_line_leaves_piece', 'The style line runs outside the piece between its ends.');
		}
	}
	// a line lying along the edge is not inside either
	if (outlineNearestPoint(outline, pathPointAtLength(snapped, total / 2).point).distance <= SEAM_SNAP_MM) {
		return panelRefuse('style_line_leaves_piece', 'The style line runs along the edge of the piece, not across it.');
	}
	return { ok: true, path: snapped, startAt, endAt, startSnapMm: a.distance, endSnapMm: b.distance };
}

/** Add a style line to a piece as an internal line. */
export function styleLine(piece: Piece, params: StyleLineParams): PieceResult {
	if (piece.internalLines.some((l) => l.id === params.id)) {
		return panelRefuse('invalid_params', `The piece already has an internal line "${params.id}".`);
	}
	const checked = styleLineOnOutline(piece.outline, params.path, params.snapToleranceMm ?? STYLE_LINE_SNAP_MM);
	if (!checked.ok) return checked;
	const next: Piece = {
		...piece,
		internalLines: [...piece.internalLines, { id: params.id, path: checked.path, label: params.label ?? 'style line' }]
	};
	const problems = pieceProblems(next);
	if (problems.length) return panelRefuse('result_broken', `This would give a broken piece: ${problems[0]}`);
	const notes: string[] = [];
	if (checked.startSnapMm > ON_LINE_MM || checked.endSnapMm > ON_LINE_MM) {
		notes.push(`Ends snapped onto the outline (${checked.startSnapMm.toFixed(2)} mm and ${checked.endSnapMm.toFixed(2)} mm).`);
	}
	return {
		ok: true,
		piece: next,
		ledgerEntries: [],
		report: panelReport('style_line', `Style line "${params.id}" drawn across ${piece.name}.`, {
			lengthMm: pathLength(checked.path),
			startSnapMm: checked.startSnapMm,
			endSnapMm: checked.endSnapMm
		}, notes)
	};
}

export type { Vec };
