import type { Segment, Vec } from '../kernel';
import { segmentControlPoints, vecDistance } from '../kernel';
import type { Piece } from '../piece-schema';

/** Where two pieces that should be the same geometry differ first (null when they agree). */
export interface PieceDifference {
	readonly where: string;
	readonly distanceMm: number;
}

/** How far apart the submitted geometry may be from the server's own replay (mm). */
export const REPLAY_TOLERANCE_MM = 0.01;

function pointsDiffer(a: readonly Vec[], b: readonly Vec[], tol: number, where: string): PieceDifference | null {
	if (a.length !== b.length) return { where: `${where}: ${a.length} points instead of ${b.length}`, distanceMm: Infinity };
	for (let i = 0; i < a.length; i++) {
		const d = vecDistance(a[i], b[i]);
		if (!(d <= tol)) return { where: `${where}, point ${i + 1}`, distanceMm: d };
	}
	return null;
}

function segmentsDiffer(a: readonly Segment[], b: readonly Segment[], tol: number): PieceDifference | null {
	if (a.length !== b.length) {
		return { where: `outline has ${a.length} segments where the replay gives ${b.length}`, distanceMm: Infinity };
	}
	for (let i = 0; i < a.length; i++) {
		if (a[i].kind !== b[i].kind) return { where: `outline segment ${i + 1} is a ${a[i].kind}, the replay gives a ${b[i].kind}`, distanceMm: Infinity };
		const d = pointsDiffer(segmentControlPoints(a[i]), segmentControlPoints(b[i]), tol, `outline segment ${i + 1}`);
		if (d) return d;
	}
	return null;
}

/**
 * Compares the geometry a client submitted with what the server computed: outline, apexes, darts and
 * pleats, point by point within the tolerance. Names and labels may differ; geometry may not.
 */
export function pieceGeometryDifference(submitted: Piece, computed: Piece, tolMm = REPLAY_TOLERANCE_MM): PieceDifference | null {
	const outline = segmentsDiffer(submitted.outline.segments, computed.outline.segments, tolMm);
	if (outline) return outline;
	const apexes = pointsDiffer(submitted.apexes.map((a) => a.point), computed.apexes.map((a) => a.point), tolMm, 'apexes');
	if (apexes) return apexes;
	const darts = pointsDiffer(
		submitted.darts.flatMap((d) => [d.leg1End, d.leg2End]),
		computed.darts.flatMap((d) => [d.leg1End, d.leg2End]),
		tolMm,
		'dart legs'
	);
	if (darts) return darts;
	return pointsDiffer(
		submitted.pleats.flatMap((p) => [p.leg1End, p.leg2End]),
		computed.pleats.flatMap((p) => [p.leg1End, p.leg2End]),
		tolMm,
		'pleat legs'
	);
}
