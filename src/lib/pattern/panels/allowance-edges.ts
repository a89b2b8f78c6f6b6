import {
	lineSegment,
	pathLength,
	segmentEnd,
	segmentTangentAt,
	vecAngleBetween,
	type Outline,
	type Path,
	type Segment,
	type Vec
} from '../kernel';
import { SEAM_CORNER_ANGLE_RAD } from '../metrics';
import { apexById, pleatWedgeSegmentRange, wedgeSegmentIndex } from '../piece';
import type { Piece } from '../piece-schema';

/**
 * The edges seam allowance is set per: the net stitching line with dart and pleat openings bridged
 * (by the dart's trued cap if it has one, else straight across the mouth), cut at corners (a turn of
 * more than 25°, the seam-corner angle of ../metrics.ts).
 */

export interface AllowanceEdge {
	readonly index: number;
	readonly path: Path;
	readonly lengthMm: number;
	/** On the piece's fold line: gets no allowance. */
	readonly isFold: boolean;
}

/** Outline with every dart and pleat opening replaced by its cap or a straight bridge. */
export function bridgedOutline(piece: Piece): Outline {
	const segs = piece.outline.segments;
	const n = segs.length;
	const replace = new Map<number, { count: number; with: Segment[] }>();
	for (const d of piece.darts) {
		const apex = apexById(piece, d.apexId);
		if (!apex) continue;
		const i = wedgeSegmentIndex(piece.outline, apex.point, d.leg1End, d.leg2End);
		if (i < 0) continue;
		replace.set(i, { count: 2, with: d.cap ? [...d.cap.edges.segments] : [lineSegment(d.leg1End, d.leg2End)] });
	}
	for (const p of piece.pleats) {
		const apex = apexById(piece, p.apexId);
		if (!apex) continue;
		const r = pleatWedgeSegmentRange(piece.outline, apex.point, p);
		if (r) replace.set(r.first, { count: r.count, with: [lineSegment(p.leg1End, p.leg2End)] });
	}
	if (replace.size === 0) return piece.outline;
	const skip = new Set<number>();
	for (const [i, r] of replace) for (let k = 0; k < r.count; k++) skip.add((i + k) % n);
	const out: Segment[] = [];
	for (let i = 0; i < n; i++) {
		const r = replace.get(i);
		if (r) out.push(...r.with);
		else if (!skip.has(i)) out.push(segs[i]);
	}
	return { segments: out };
}

function onFoldLine(piece: Piece, p: Vec): boolean {
	const f = piece.foldLine;
	if (!f) return false;
	const dx = f.to.x - f.from.x;
	const dy = f.to.y - f.from.y;
	const l = Math.hypot(dx, dy);
	return Math.abs((p.x - f.from.x) * dy - (p.y - f.from.y) * dx) / l <= 0.01;
}

/** Allowance edges of a piece in outline order (edge i starts at corner i). */
export function allowanceEdges(piece: Piece): AllowanceEdge[] {
	const outline = bridgedOutline(piece);
	const segs = outline.segments;
	const n = segs.length;
	const corner = segs.map((s, i) => {
		const prev = segs[(i - 1 + n) % n];
		return Math.abs(vecAngleBetween(segmentTangentAt(prev, 1), segmentTangentAt(s, 0))) > SEAM_CORNER_ANGLE_RAD;
	});
	const starts = corner.map((c, i) => (c ? i : -1)).filter((i) => i >= 0);
	const edges: AllowanceEdge[] = [];
	const firsts = starts.length ? starts : [0];
	for (let k = 0; k < firsts.length; k++) {
		const from = firsts[k];
		const to = k + 1 < firsts.length ? firsts[k + 1] : firsts[0] + n;
		const path: Path = { segments: Array.from({ length: to - from }, (_, j) => segs[(from + j) % n]) };
		const isFold = path.segments.every((s) => onFoldLine(piece, s.p0) && onFoldLine(piece, segmentEnd(s)) && s.kind === 'line');
		edges.push({ index: k, path, lengthMm: pathLength(path), isFold });
	}
	return edges;
}
