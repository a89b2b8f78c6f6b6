/**
 * The one place the pattern model imports the geometry kernel from.
 * (Re-exports from src/lib/geometry; switch to '$lib/geometry' index when it is complete.)
 */
export type { Vec, Segment, LineSegment, CubicSegment, Outline, Path, SegmentLocation } from '../geometry/types';
export {
	vec,
	vecAdd,
	vecSub,
	vecScale,
	vecDot,
	vecCross,
	vecLength,
	vecDistance,
	vecNormalize,
	vecLerp,
	vecPerp
} from '../geometry/vec';
export { vecAngleBetween, vecAngle, angleToDegrees, angleFromDegrees, chordWidth, chordAngle } from '../geometry/angle';
export {
	lineSegment,
	cubicSegment,
	segmentStart,
	segmentEnd,
	segmentPointAt,
	segmentTangentAt,
	segmentReverse,
	segmentSplitAt,
	segmentBetween,
	segmentMapPoints
} from '../geometry/segment';
export {
	pointRotateAbout,
	pointTranslate,
	pointMirrorAcross,
	segmentRotateAbout,
	segmentTranslate,
	segmentMirrorAcross,
	pathMirrorAcross
} from '../geometry/transform';
export { outlineSignedArea, outlineArea } from '../geometry/outline-area';
export { segmentLength } from '../geometry/segment-length';
export { outlinePerimeter, pathLength } from '../geometry/outline-length';
