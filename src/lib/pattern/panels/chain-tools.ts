import {
	pathLength,
	pathNearestPoint,
	pathReverse,
	segmentEnd,
	segmentLength,
	segmentNearestPoint,
	segmentPointAt,
	type Path,
	type Segment,
	type SegmentChain,
	type SegmentLocation,
	type Vec
} from '../kernel';

/** Small path helpers of the panel operations (private to panels/). */

export const dist = (a: Vec, b: Vec): number => Math.hypot(a.x - b.x, a.y - b.y);

export function pathFirst(p: SegmentChain): Vec {
	return p.segments[0].p0;
}

export function pathLast(p: SegmentChain): Vec {
	return segmentEnd(p.segments[p.segments.length - 1]);
}

/** Sample points along a chain (both ends of every segment plus `perSegment − 1` inner points on curves). */
export function chainSamples(chain: SegmentChain, perCurve = 8): Vec[] {
	const out: Vec[] = [];
	for (const s of chain.segments) {
		out.push(s.p0);
		if (s.kind === 'cubic') for (let i = 1; i < perCurve; i++) out.push(segmentPointAt(s, i / perCurve));
		else out.push({ x: (s.p0.x + s.p1.x) / 2, y: (s.p0.y + s.p1.y) / 2 });
	}
	if (chain.segments.length) out.push(pathLast(chain));
	return out;
}

/**
 * Largest distance from a sample of `a` to the chain `b`. Both are walked in order with a cursor on
 * `b` (they run along each other), falling back to a full search when the cursor loses its way.
 */
export function chainDeviation(a: SegmentChain, b: SegmentChain, perCurve = 8): number {
	const bs = b.segments;
	if (bs.length === 0 || a.segments.length === 0) return Infinity;
	let cursor = 0;
	let worst = 0;
	for (const p of chainSamples(a, perCurve)) {
		let best = Infinity;
		let bestI = cursor;
		const lo = Math.max(0, cursor - 2);
		const hi = Math.min(bs.length - 1, cursor + 6);
		for (let i = lo; i <= hi; i++) {
			const d = segmentNearestPoint(bs[i], p).distance;
			if (d < best) {
				best = d;
				bestI = i;
			}
		}
		if (best > 1e-6) {
			const full = pathNearestPoint(b, p);
			if (full.distance < best) {
				best = full.distance;
				bestI = full.segmentIndex;
			}
		}
		cursor = bestI;
		if (best > worst) worst = best;
	}
	return worst;
}

/** Symmetric deviation (Hausdorff distance on samples) of two chains, either direction of travel. */
export function chainsDeviation(a: SegmentChain, b: SegmentChain): number {
	const sameWay = dist(pathFirst(a), pathFirst(b)) + dist(pathLast(a), pathLast(b));
	const otherWay = dist(pathFirst(a), pathLast(b)) + dist(pathLast(a), pathFirst(b));
	const bb = otherWay < sameWay ? pathReverse(b) : b;
	return Math.max(chainDeviation(a, bb), chainDeviation(bb, a));
}

/** Arc length from the start of a path to a location on it. */
export function lengthTo(path: SegmentChain, at: SegmentLocation): number {
	let s = 0;
	for (let i = 0; i < at.segmentIndex; i++) s += segmentLength(path.segments[i]);
	return s + (at.t > 0 ? segmentLength(path.segments[at.segmentIndex], 0, at.t) : 0);
}

/** Arc length along a path to the point nearest `p`, with the distance to it. */
export function lengthAlong(path: SegmentChain, p: Vec): { lengthMm: number; distanceMm: number; at: SegmentLocation } {
	const n = pathNearestPoint(path, p);
	return { lengthMm: lengthTo(path, n), distanceMm: n.distance, at: { segmentIndex: n.segmentIndex, t: n.t } };
}

/** Path with its first point moved to `p0` and its last to `p1` (tiny snaps only). */
export function pathWithEnds(path: Path, p0: Vec, p1: Vec): Path {
	const segs = [...path.segments];
	const n = segs.length;
	segs[0] = withStart(segs[0], p0);
	segs[n - 1] = withEnd(segs[n - 1], p1);
	return { segments: segs };
}

function withStart(s: Segment, p: Vec): Segment {
	return s.kind === 'line' ? { ...s, p0: p } : { ...s, p0: p };
}
function withEnd(s: Segment, p: Vec): Segment {
	return s.kind === 'line' ? { ...s, p1: p } : { ...s, p3: p };
}

/** Polygon centroid (area-weighted) of points, used to place copied markings inside a piece. */
export function polygonCentroid(pts: readonly Vec[]): Vec {
	let a = 0;
	let cx = 0;
	let cy = 0;
	for (let i = 0; i < pts.length; i++) {
		const p = pts[i];
		const q = pts[(i + 1) % pts.length];
		const c = p.x * q.y - q.x * p.y;
		a += c;
		cx += (p.x + q.x) * c;
		cy += (p.y + q.y) * c;
	}
	if (Math.abs(a) < 1e-12) return pts[0];
	return { x: cx / (3 * a), y: cy / (3 * a) };
}

export { pathLength };
