import { segmentEnd, segmentLength, segmentParameterAtLength, segmentPointAt, type Path, type Segment, type Vec } from '../kernel';
import type { Piece } from '../piece-schema';
import { dist } from './chain-tools';
import { ON_LINE_MM } from './panel-tolerances';

/**
 * Seam lengths measured on the curves with darts and pleats folded out (trade-primer §7): segments of the
 * edge that are legs of a dart or pleat opening of the piece are skipped.
 */

function wedgeLegs(piece: Piece): [Vec, Vec][] {
	const legs: [Vec, Vec][] = [];
	const apex = new Map(piece.apexes.map((a) => [a.id, a.point]));
	for (const d of piece.darts) {
		const a = apex.get(d.apexId);
		if (a) legs.push([d.leg1End, a], [a, d.leg2End]);
	}
	for (const p of piece.pleats) {
		const a = apex.get(p.apexId);
		if (!a) continue;
		const pts = [p.leg1End, ...(p.pivot1 ? [p.pivot1] : []), a, ...(p.pivot2 ? [p.pivot2] : []), p.leg2End];
		for (let i = 0; i + 1 < pts.length; i++) legs.push([pts[i], pts[i + 1]]);
	}
	return legs;
}

/** Which segments of an edge are sewn (not wedge legs). */
export function sewnMask(piece: Piece, edge: Path): boolean[] {
	const legs = wedgeLegs(piece);
	return edge.segments.map((s: Segment) => {
		if (s.kind !== 'line') return true;
		return !legs.some(([u, v]) => (dist(u, s.p0) <= ON_LINE_MM && dist(v, s.p1) <= ON_LINE_MM) || (dist(v, s.p0) <= ON_LINE_MM && dist(u, s.p1) <= ON_LINE_MM));
	});
}

/** Length of an edge with the piece's darts and pleats folded out. */
export function sewnLength(piece: Piece, edge: Path): number {
	const mask = sewnMask(piece, edge);
	return edge.segments.reduce((s, seg, i) => s + (mask[i] ? segmentLength(seg) : 0), 0);
}

/** Point at a sewn arc length from the start of the edge (darts folded out). */
export function sewnPointAt(piece: Piece, edge: Path, lengthMm: number): Vec {
	const mask = sewnMask(piece, edge);
	let left = lengthMm;
	for (let i = 0; i < edge.segments.length; i++) {
		if (!mask[i]) continue;
		const s = edge.segments[i];
		const l = segmentLength(s);
		if (left <= l) return segmentPointAt(s, segmentParameterAtLength(s, left, l));
		left -= l;
	}
	return segmentEnd(edge.segments[edge.segments.length - 1]);
}
