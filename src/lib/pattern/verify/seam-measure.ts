import type { Vec } from '../kernel';
import { outlineBetween, outlineNearestLocation } from '../kernel';
import { sewnLength } from '../panels/seam-measure';
import type { Piece } from '../piece-schema';

/** One side of a seam: the piece's stitching line from `from` to `to`, in outline order. */
export interface SeamEdgeData {
	readonly from: Vec;
	readonly to: Vec;
}

export interface SeamPairData {
	readonly id: string;
	readonly label: string;
	readonly a: SeamEdgeData;
	readonly b: SeamEdgeData;
	readonly allowedEaseMm: number;
	readonly toleranceMm: number;
}

export interface SeamPairMeasure {
	readonly seamPairId: string;
	readonly label: string;
	readonly aLengthMm: number;
	readonly bLengthMm: number;
	/** a − b − allowed ease: zero when the seam is true. */
	readonly differenceMm: number;
	readonly withinTolerance: boolean;
	readonly message: string;
}

/** How far an edge end may lie off the stitching line and still be found on it (mm). */
export const SEAM_END_SNAP_MM = 0.5;

/**
 * Length of a seam edge with darts and pleats folded out (trade practice: measure mating stitching
 * lines with the suppression closed): the stretch of outline from `from` to `to`, without the legs
 * of any dart or pleat wedge inside it. Null when an end is not on the stitching line.
 */
export function seamEdgeLength(piece: Piece, edge: SeamEdgeData): number | null {
	const a = outlineNearestLocation(piece.outline, edge.from);
	const b = outlineNearestLocation(piece.outline, edge.to);
	if (a.distance > SEAM_END_SNAP_MM || b.distance > SEAM_END_SNAP_MM) return null;
	return sewnLength(piece, outlineBetween(piece.outline, a, b));
}

/** Measures a seam pair: both edges, their difference against the allowed ease, within tolerance or not. */
export function seamPairMeasure(pair: SeamPairData, a: Piece, b: Piece): SeamPairMeasure {
	const la = seamEdgeLength(a, pair.a);
	const lb = seamEdgeLength(b, pair.b);
	const name = pair.label || 'seam';
	if (la === null || lb === null) {
		return {
			seamPairId: pair.id,
			label: pair.label,
			aLengthMm: la ?? NaN,
			bLengthMm: lb ?? NaN,
			differenceMm: NaN,
			withinTolerance: false,
			message: `${name}: an end of the ${la === null ? 'first' : 'second'} edge is no longer on the stitching line; redraw the seam pair.`
		};
	}
	const differenceMm = la - lb - pair.allowedEaseMm;
	const ok = Math.abs(differenceMm) <= pair.toleranceMm;
	const ease = pair.allowedEaseMm ? ` with ${pair.allowedEaseMm.toFixed(1)} mm ease allowed` : '';
	return {
		seamPairId: pair.id,
		label: pair.label,
		aLengthMm: la,
		bLengthMm: lb,
		differenceMm,
		withinTolerance: ok,
		message: ok
			? `${name}: ${la.toFixed(1)} mm and ${lb.toFixed(1)} mm${ease}: true within ${pair.toleranceMm} mm.`
			: `${name}: ${la.toFixed(1)} mm against ${lb.toFixed(1)} mm${ease}: ${Math.abs(differenceMm).toFixed(1)} mm ${differenceMm > 0 ? 'too long' : 'too short'} (tolerance ${pair.toleranceMm} mm). True the seam before sign-off.`
	};
}
