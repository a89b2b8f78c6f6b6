import {
	pathConcat,
	pathIntersections,
	pathLengthAt,
	pathPointAtLength,
	pathSplitAt,
	segmentWithEnd,
	segmentWithStart,
	type Path,
	type SegmentLocation,
	type Vec
} from '../kernel';
import type { Piece } from '../piece-schema';
import { dist } from './chain-tools';
import type { SeamPair } from './panel-types';
import { SEAM_SNAP_MM } from './panel-tolerances';
import { divergenceCandidates, seamWedge } from './seam-wedge';

/**
 * Walking a wedge's legs equal before it is closed (common practice in the trade: a dart's or a seam
 * wedge's legs are trued to one length before they are sewn or closed, or the closed seam is left with
 * a step). Where the style line crosses both legs of a panel seam's wedge at different distances from
 * the divergence point D, both crossings are moved along their legs to the mean distance, and the
 * style line is bent to pass through the moved points (each piece of the line keeps its shape; only
 * its ends move, by half the difference at most).
 */

/** What was done at one panel seam whose wedge the style line crosses. */
export interface LegWalk {
	readonly seamId: string;
	/** The distances from D at which the line crossed leg a and leg b, as drawn. */
	readonly drawnMm: readonly [number, number];
	/** The distance both legs are cut at now. */
	readonly walkedMm: number;
	/** Where the line crosses leg a and leg b now. */
	readonly a: Vec;
	readonly b: Vec;
}

/** Legs within this of each other are left as drawn. */
const EQUAL_LEGS_MM = 0.01;

interface Move {
	readonly at: SegmentLocation;
	readonly to: Vec;
}

/**
 * The style line with every crossed wedge's legs walked equal, and what was done at each seam. Seams
 * without a wedge, or whose wedge the line does not cross on both legs, are left to carry to judge.
 */
export function styleLineWalkedEqual(panels: readonly Piece[], seams: readonly SeamPair[], line: Path): { line: Path; walks: LegWalk[] } {
	const walks: LegWalk[] = [];
	const moves: Move[] = [];
	seams.forEach((pair, k) => {
		const left = panels[k];
		const right = panels[k + 1];
		if (!left || !right || pair.a.pieceId !== left.id || pair.b.pieceId !== right.id) return;
		const D = divergenceCandidates(left, right, pair.a.edge, pair.b.edge, SEAM_SNAP_MM)[0];
		if (!D) return;
		const w = seamWedge(pair.a.edge, pair.b.edge, D, SEAM_SNAP_MM);
		if (typeof w === 'string') return;
		const ha = pathIntersections(w.openA, line)[0];
		const hb = pathIntersections(w.openB, line)[0];
		// a line through D itself (or touching it) leaves nothing to walk
		if (!ha || !hb || dist(ha.point, D.point) <= SEAM_SNAP_MM || dist(hb.point, D.point) <= SEAM_SNAP_MM) return;
		const da = pathLengthAt(w.openA, ha);
		const db = pathLengthAt(w.openB, hb);
		const equal = Math.abs(da - db) <= EQUAL_LEGS_MM;
		const d = equal ? da : (da + db) / 2;
		const a = equal ? ha.point : pathPointAtLength(w.openA, d).point;
		const b = equal ? hb.point : pathPointAtLength(w.openB, d).point;
		walks.push({ seamId: pair.id, drawnMm: [da, db], walkedMm: d, a, b });
		// every crossing is a fixed point of the bent line (moved or not), so bending the line at one seam
		// never shifts where it crosses another
		moves.push({ at: { segmentIndex: ha.otherSegmentIndex, t: ha.otherT }, to: a });
		moves.push({ at: { segmentIndex: hb.otherSegmentIndex, t: hb.otherT }, to: b });
	});
	if (!walks.some((w) => Math.abs(w.drawnMm[0] - w.drawnMm[1]) > EQUAL_LEGS_MM)) return { line, walks };
	return { line: lineThrough(line, moves), walks };
}

/** The line split at the moves' locations, each junction moved to its new point. */
function lineThrough(line: Path, moves: readonly Move[]): Path {
	const sorted = [...moves].sort((p, q) => p.at.segmentIndex - q.at.segmentIndex || p.at.t - q.at.t);
	const pieces = pathSplitAt(line, sorted.map((m) => m.at));
	// pathSplitAt gives one piece more than the locations it cut at (locations at the very ends cut nothing)
	if (pieces.length !== sorted.length + 1) return line;
	const moved = pieces.map((p, i) => {
		const segs = [...p.segments];
		if (i > 0) segs[0] = segmentWithStart(segs[0], sorted[i - 1].to);
		if (i < sorted.length) segs[segs.length - 1] = segmentWithEnd(segs[segs.length - 1], sorted[i].to);
		return { segments: segs };
	});
	return pathConcat(moved);
}
