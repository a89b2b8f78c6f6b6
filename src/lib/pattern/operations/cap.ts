import { z } from 'zod';
import {
	lineSegment,
	segmentBetween,
	segmentLineIntersections,
	segmentMirrorAcross,
	segmentReverse,
	segmentTangentAt,
	segmentWithEnd,
	segmentWithStart,
	vecAdd,
	vecDistance,
	vecScale,
	type Segment,
	type Vec
} from '../kernel';
import { fmtMm, refuse, succeed, type OperationResult } from '../operation-result';
import { apexById, dartById, wedgeGeometry, wedgeSegmentIndex } from '../piece';
import { legSideSchema, type Piece } from '../piece-schema';
import { LEG_EQUALITY_TOLERANCE_MM } from './pull-back';

export const capParamsSchema = z.object({
	dartId: z.string().min(1),
	/** Side the sewn dart is pressed toward. */
	pressToward: legSideSchema
});
export type CapParams = z.infer<typeof capParamsSchema>;

/**
 * cap (primer §5): true a dart. Fold it closed toward the pressing side and redraw the seam across:
 * the cap edge leaving the pressing-side leg is the mirror image, across that leg, of the seam segment
 * next to it, up to the bisector; the other edge mirrors the first across the bisector. The cap is
 * stored on the dart (the outline keeps the block dart); the cut line runs leg1End → peak → leg2End.
 */
export function cap(piece: Piece, params: CapParams): OperationResult {
	const dart = dartById(piece, params.dartId);
	if (!dart) return refuse('unknown_dart', `There is no dart "${params.dartId}" on this piece.`);
	const apex = apexById(piece, dart.apexId);
	if (!apex) return refuse('unknown_apex', `Dart "${dart.id}" refers to apex "${dart.apexId}", which is not on the piece.`);
	const k = wedgeSegmentIndex(piece.outline, apex.point, dart.leg1End, dart.leg2End);
	if (k < 0) return refuse('invalid_piece', `Dart "${dart.id}" is not a wedge in the outline.`);
	const tip = dart.pullBack?.sewnPoint ?? apex.point;
	const g = wedgeGeometry(tip, dart.leg1End, dart.leg2End);
	if (Math.abs(g.leg1LengthMm - g.leg2LengthMm) > LEG_EQUALITY_TOLERANCE_MM) {
		return refuse('legs_unequal', `Dart "${dart.id}": the legs are ${fmtMm(g.leg1LengthMm)} and ${fmtMm(g.leg2LengthMm)}; true them to equal length before shaping the cap.`);
	}
	const n = piece.outline.segments.length;
	const pressLeg1 = params.pressToward === 'leg1';
	const E = pressLeg1 ? dart.leg1End : dart.leg2End;
	// seam segment next to the pressing-side leg, oriented away from the dart
	const seam: Segment = pressLeg1
		? segmentReverse(piece.outline.segments[(k - 1 + n) % n])
		: piece.outline.segments[(k + 2) % n];
	const mirrored = segmentMirrorAcross(seam, tip, E);
	// peak: where the mirrored seam meets the bisector line
	const hits = segmentLineIntersections(mirrored, tip, g.bisector).filter((h) => h.t > 1e-9 && h.u > 0);
	let edge: Segment;
	let peak: Vec;
	if (hits.length > 0) {
		const h = hits[0];
		peak = h.point;
		edge = segmentBetween(mirrored, 0, h.t);
	} else {
		// the seam segment is too short to reach the bisector: carry on along its direction at the leg end
		const dir = segmentTangentAt(mirrored, 0);
		const line = segmentLineIntersections(lineSegment(E, vecAdd(E, vecScale(dir, 1e4))), tip, g.bisector).filter((h) => h.t > 1e-12 && h.u > 0);
		if (line.length === 0) {
			return refuse('cap_not_found', `Dart "${dart.id}": the seam folded across the dart never meets the dart's centre line, so no cap can be drawn.`);
		}
		peak = line[0].point;
		edge = lineSegment(E, peak);
	}
	const mirroredEdge = segmentMirrorAcross(edge, tip, vecAdd(tip, g.bisector));
	const raw = pressLeg1 ? [edge, segmentReverse(mirroredEdge)] : [mirroredEdge, segmentReverse(edge)];
	// exact shared points: leg1End → peak → leg2End
	const segments = [segmentWithEnd(segmentWithStart(raw[0], dart.leg1End), peak), segmentWithEnd(segmentWithStart(raw[1], peak), dart.leg2End)];
	const depth = vecDistance(peak, vecScale(vecAdd(dart.leg1End, dart.leg2End), 0.5));
	const next: Piece = {
		...piece,
		darts: piece.darts.map((d) => (d.id === dart.id ? { ...d, pressToward: params.pressToward, cap: { pressToward: params.pressToward, peak, edges: { segments } } } : d))
	};
	return succeed(next, [], {
		op: 'cap',
		summary: `Dart "${dart.id}" trued for pressing toward ${params.pressToward === 'leg1' ? 'leg 1' : 'leg 2'}: the cap peaks ${fmtMm(depth)} beyond the straight mouth.`,
		values: { capHeightMm: depth, peakDistanceFromTipMm: vecDistance(peak, tip), peakOffsetFromBisectorMm: Math.abs((peak.x - tip.x) * g.bisector.y - (peak.y - tip.y) * g.bisector.x) },
		notes: []
	});
}
