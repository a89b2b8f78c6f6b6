/** Helpers shared by the pattern tests (test support only). */
import { outlineNearestLocation, segmentLength, segmentPointAt, vecDistance, type Outline, type Vec } from './kernel';

/** Points sampled along an outline (curves at several parameters). */
export function outlineSamples(outline: Outline, perSegment = 8): Vec[] {
	const pts: Vec[] = [];
	for (const s of outline.segments) for (let i = 0; i < perSegment; i++) pts.push(segmentPointAt(s, i / perSegment));
	return pts;
}

/** Largest distance from a sample of one outline to the other, both ways (a Hausdorff distance). */
export function outlineDistance(a: Outline, b: Outline): number {
	let d = 0;
	for (const p of outlineSamples(a)) d = Math.max(d, outlineNearestLocation(b, p).distance);
	for (const p of outlineSamples(b)) d = Math.max(d, outlineNearestLocation(a, p).distance);
	return d;
}

/** Arc length along the outline from point a forward to point b (both on the outline). */
export function outlineLengthBetween(outline: Outline, a: Vec, b: Vec): number {
	const la = outlineNearestLocation(outline, a);
	const lb = outlineNearestLocation(outline, b);
	const n = outline.segments.length;
	if (la.segmentIndex === lb.segmentIndex && lb.t >= la.t && vecDistance(a, b) > 0) {
		return segmentLength(outline.segments[la.segmentIndex], la.t, lb.t);
	}
	let total = segmentLength(outline.segments[la.segmentIndex], la.t, 1);
	for (let i = (la.segmentIndex + 1) % n; i !== lb.segmentIndex; i = (i + 1) % n) total += segmentLength(outline.segments[i]);
	return total + segmentLength(outline.segments[lb.segmentIndex], 0, lb.t);
}
