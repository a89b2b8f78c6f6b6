import { outlineBetween, outlineNearestPoint, pathFromPolyline, pathLength, type Path, type Vec } from '../kernel';
import type { Piece } from '../piece-schema';

/**
 * Seam edges as the style stores them: the stretch of a piece's stitching line from `from` to `to`,
 * walking the outline forward. Shared by the browser (pairing seams by hand, storing the pairs an
 * operation made) and the server (the pairs drafting makes).
 */

/** The stretch of the outline from `from` to `to` in outline order. */
export function edgeInOrder(piece: Piece, from: Vec, to: Vec): Path {
	return outlineBetween(piece.outline, outlineNearestPoint(piece.outline, from), outlineNearestPoint(piece.outline, to));
}

const first = (p: Path): Vec => p.segments[0].p0;
const last = (p: Path): Vec => {
	const s = p.segments[p.segments.length - 1];
	return s.kind === 'line' ? s.p1 : s.p3;
};

/**
 * An edge's ends in the piece's outline order: walking the outline forward from the path's first point
 * to its last should give about the path's length; if the other way round comes closer, the path runs
 * against the outline and its ends are swapped.
 */
export function edgeEnds(piece: Piece, edge: Path): { from: Vec; to: Vec } {
	const a = first(edge);
	const b = last(edge);
	const len = pathLength(edge);
	const fwd = pathLength(edgeInOrder(piece, a, b));
	const back = pathLength(edgeInOrder(piece, b, a));
	return Math.abs(fwd - len) <= Math.abs(back - len) ? { from: a, to: b } : { from: b, to: a };
}

/** The same for an edge given as the corners it passes through. */
export function polylineEdgeEnds(piece: Piece, pts: readonly Vec[]): { from: Vec; to: Vec } {
	return edgeEnds(piece, pathFromPolyline([...pts]));
}
