import type { Outline, Segment, Vec } from '../kernel';
import { vecAdd, vecDistance, vecLerp, vecScale, vecSub } from '../kernel';
import { apexById, pleatWedgeSegmentRange } from '../piece';
import type { Piece, Pleat } from '../piece-schema';

/**
 * How a pleat or tuck is marked on a pattern for cutting: not as its whole opening down to the apex
 * (that is only how the opening is computed), but as the seam running across its mouth, and, over
 * the stitched length from the seam, the fold line, the placement line and an arrow from the fold
 * toward the placement line.
 */

/**
 * Length of the fold and placement marks of a pleat that is held only by the seam (no stitched
 * length given): a short mark from the seam to lay the fold by (common practice, CP; our own figure).
 */
export const PLEAT_MARK_LENGTH_MM = 25;

export interface PleatMarks {
	readonly fold: readonly [Vec, Vec];
	readonly placement: readonly [Vec, Vec];
	/** From the fold line toward the placement line, halfway down the marks. */
	readonly arrow: { readonly from: Vec; readonly to: Vec };
	readonly lengthMm: number;
}

/** Point `lengthMm` from `from` toward `to` (never past `to`). */
function toward(from: Vec, to: Vec, lengthMm: number): Vec {
	const d = vecDistance(from, to);
	if (d < 1e-9) return from;
	return vecLerp(from, to, Math.min(1, lengthMm / d));
}

/** The marks of one pleat: fold and placement lines from the seam over the stitched length, and the fold arrow. */
export function pleatMarks(pleat: Pleat): PleatMarks {
	const want = pleat.stitchLengthMm && pleat.stitchLengthMm > 0 ? pleat.stitchLengthMm : PLEAT_MARK_LENGTH_MM;
	const lengthMm = Math.min(want, vecDistance(pleat.foldLine.from, pleat.foldLine.to), vecDistance(pleat.placementLine.from, pleat.placementLine.to));
	const fold = [pleat.foldLine.from, toward(pleat.foldLine.from, pleat.foldLine.to, lengthMm)] as const;
	const placement = [pleat.placementLine.from, toward(pleat.placementLine.from, pleat.placementLine.to, lengthMm)] as const;
	const a = vecLerp(fold[0], fold[1], 0.5);
	const b = vecLerp(placement[0], placement[1], 0.5);
	// keep the arrow a little clear of both lines
	const inset = vecScale(vecSub(b, a), 0.15);
	return { fold, placement, arrow: { from: vecAdd(a, inset), to: vecSub(b, inset) }, lengthMm };
}

/**
 * The stitching line as the pattern shows it: each pleat's opening replaced by the seam straight
 * across its mouth (the cloth of the pleat is part of the piece). Darts keep their wedges.
 */
export function outlinePleatsAcross(piece: Piece): Outline {
	const n = piece.outline.segments.length;
	const drop = new Set<number>();
	const bridgeAt = new Map<number, Segment>();
	for (const p of piece.pleats) {
		const apex = apexById(piece, p.apexId);
		if (!apex) continue;
		const r = pleatWedgeSegmentRange(piece.outline, apex.point, p);
		if (!r) continue;
		for (let k = 0; k < r.count; k++) drop.add((r.first + k) % n);
		bridgeAt.set(r.first % n, { kind: 'line', p0: p.leg1End, p1: p.leg2End });
	}
	if (drop.size === 0) return piece.outline;
	const segments: Segment[] = [];
	for (let i = 0; i < n; i++) {
		const bridge = bridgeAt.get(i);
		if (bridge) segments.push(bridge);
		if (!drop.has(i)) segments.push(piece.outline.segments[i]);
	}
	return { segments };
}
