import type { CubicSegment, Path, Segment, SegmentChain, Vec } from './types';
import { bernsteinCubicRoots } from './roots';
import { segmentPointAt } from './segment';
import { chainBoxes, clamp01, ctrlBox, curveCurve } from './curve-curve';
import { INTERSECTION_TOLERANCE_MM, PARAMETER_TOLERANCE, ROOT_TOLERANCE_MM } from './tolerance';

/**
 * Intersections. Lines against curves are solved exactly (the cubic's signed distance to the line is
 * a cubic polynomial in t, solved on monotone pieces); cubic against cubic by subdivision with
 * bounding-box rejection, then Newton refinement.
 *
 * Collinear overlaps (a query line lying along a straight segment, two overlapping straight
 * segments) are reported as the two end points of the overlap.
 */

/** A crossing of a segment with a query line: t on the segment, u along the line (point = origin + u·direction). */
export interface LineSegmentHit {
	readonly t: number;
	readonly u: number;
	readonly point: Vec;
}

/** A crossing of a query line with an outline/path: segment index and t, point, u along the line. */
export interface LineHit extends LineSegmentHit {
	readonly segmentIndex: number;
}

/** A crossing of a polyline with an outline: as LineHit plus which polyline edge (u in [0,1] along that edge). */
export interface PolylineHit extends LineHit {
	readonly polylineIndex: number;
}

/** A crossing of two segments: ta on the first, tb on the second. */
export interface SegmentPairHit {
	readonly ta: number;
	readonly tb: number;
	readonly point: Vec;
}

/** A crossing between two chains (or a chain with itself): segment indices and parameters on each. */
export interface ChainHit {
	readonly segmentIndex: number;
	readonly t: number;
	readonly otherSegmentIndex: number;
	readonly otherT: number;
	readonly point: Vec;
}

// ---------------------------------------------------------------- segment vs infinite line

/**
 * Intersections of one segment with the infinite line origin + u·direction (direction non-zero,
 * any length; u is in units of `direction`). Sorted by t.
 */
export function segmentLineIntersections(s: Segment, origin: Vec, direction: Vec, tolerance = ROOT_TOLERANCE_MM): LineSegmentHit[] {
	const dl = Math.sqrt(direction.x * direction.x + direction.y * direction.y);
	if (dl === 0) return [];
	const ux = direction.x / dl;
	const uy = direction.y / dl;
	const ox = origin.x;
	const oy = origin.y;
	const out: LineSegmentHit[] = [];
	const hit = (t: number): void => {
		const p = t === 0 ? s.p0 : t === 1 ? (s.kind === 'line' ? s.p1 : s.p3) : segmentPointAt(s, t);
		out.push({ t, u: ((p.x - ox) * ux + (p.y - oy) * uy) / dl, point: p });
	};
	if (s.kind === 'line') {
		const d0 = ux * (s.p0.y - oy) - uy * (s.p0.x - ox);
		const d1 = ux * (s.p1.y - oy) - uy * (s.p1.x - ox);
		if ((d0 > tolerance && d1 > tolerance) || (d0 < -tolerance && d1 < -tolerance)) return out;
		const z0 = Math.abs(d0) <= tolerance;
		const z1 = Math.abs(d1) <= tolerance;
		if (z0 && z1) {
			hit(0);
			hit(1);
		} else if (z0) hit(0);
		else if (z1) hit(1);
		else hit(d0 / (d0 - d1));
		return out;
	}
	const d0 = ux * (s.p0.y - oy) - uy * (s.p0.x - ox);
	const d1 = ux * (s.p1.y - oy) - uy * (s.p1.x - ox);
	const d2 = ux * (s.p2.y - oy) - uy * (s.p2.x - ox);
	const d3 = ux * (s.p3.y - oy) - uy * (s.p3.x - ox);
	for (const t of bernsteinCubicRoots(d0, d1, d2, d3, tolerance)) hit(t);
	return out;
}

// ---------------------------------------------------------------- chain vs line / ray / segment

function lineHitsOnChain(
	chain: SegmentChain,
	closed: boolean,
	origin: Vec,
	direction: Vec,
	uMin: number,
	uMax: number,
	tolerance: number
): LineHit[] {
	const segs = chain.segments;
	const n = segs.length;
	const dl = Math.sqrt(direction.x * direction.x + direction.y * direction.y);
	if (dl === 0 || n === 0) return [];
	const ux = direction.x / dl;
	const uy = direction.y / dl;
	const ox = origin.x;
	const oy = origin.y;
	// box of the query (for ray / segment queries), else infinite
	const finite = Number.isFinite(uMin) && Number.isFinite(uMax);
	let qMinX = -Infinity, qMaxX = Infinity, qMinY = -Infinity, qMaxY = Infinity;
	if (finite) {
		const ax = ox + direction.x * uMin, ay = oy + direction.y * uMin;
		const bx = ox + direction.x * uMax, by = oy + direction.y * uMax;
		qMinX = Math.min(ax, bx) - tolerance; qMaxX = Math.max(ax, bx) + tolerance;
		qMinY = Math.min(ay, by) - tolerance; qMaxY = Math.max(ay, by) + tolerance;
	}
	const hits: LineHit[] = [];
	for (let i = 0; i < n; i++) {
		const s = segs[i];
		if (s.kind === 'line') {
			// allocation-free rejection
			const d0 = ux * (s.p0.y - oy) - uy * (s.p0.x - ox);
			const d1 = ux * (s.p1.y - oy) - uy * (s.p1.x - ox);
			if ((d0 > tolerance && d1 > tolerance) || (d0 < -tolerance && d1 < -tolerance)) continue;
			if (finite) {
				if (Math.max(s.p0.x, s.p1.x) < qMinX || Math.min(s.p0.x, s.p1.x) > qMaxX) continue;
				if (Math.max(s.p0.y, s.p1.y) < qMinY || Math.min(s.p0.y, s.p1.y) > qMaxY) continue;
			}
		} else {
			const d0 = ux * (s.p0.y - oy) - uy * (s.p0.x - ox);
			const d1 = ux * (s.p1.y - oy) - uy * (s.p1.x - ox);
			const d2 = ux * (s.p2.y - oy) - uy * (s.p2.x - ox);
			const d3 = ux * (s.p3.y - oy) - uy * (s.p3.x - ox);
			if (d0 > tolerance && d1 > tolerance && d2 > tolerance && d3 > tolerance) continue;
			if (d0 < -tolerance && d1 < -tolerance && d2 < -tolerance && d3 < -tolerance) continue;
		}
		if (finite && s.kind === 'cubic') {
			if (Math.max(s.p0.x, s.p1.x, s.p2.x, s.p3.x) < qMinX || Math.min(s.p0.x, s.p1.x, s.p2.x, s.p3.x) > qMaxX) continue;
			if (Math.max(s.p0.y, s.p1.y, s.p2.y, s.p3.y) < qMinY || Math.min(s.p0.y, s.p1.y, s.p2.y, s.p3.y) > qMaxY) continue;
		}
		for (const h of segmentLineIntersections(s, origin, direction, tolerance)) {
			if (h.u < uMin - tolerance / dl || h.u > uMax + tolerance / dl) continue;
			let segmentIndex = i;
			let t = h.t;
			let point = h.point;
			if (t >= 1 - PARAMETER_TOLERANCE && (closed || i + 1 < n)) {
				segmentIndex = (i + 1) % n;
				t = 0;
				point = segs[segmentIndex].p0;
			} else if (t <= PARAMETER_TOLERANCE) {
				t = 0;
				point = s.p0;
			}
			const u = point === h.point ? h.u : ((point.x - ox) * ux + (point.y - oy) * uy) / dl;
			hits.push({ segmentIndex, t, u, point });
		}
	}
	// de-duplicate (a crossing at a shared vertex is found on both segments)
	hits.sort((a, b) => a.u - b.u || a.segmentIndex - b.segmentIndex || a.t - b.t);
	const out: LineHit[] = [];
	for (const h of hits) {
		const dup = out.some((o) => o.segmentIndex === h.segmentIndex && Math.abs(o.t - h.t) <= PARAMETER_TOLERANCE);
		if (!dup) out.push(h);
	}
	return out;
}

/**
 * Crossings of the infinite line through `origin` along `direction` with an outline, sorted by u
 * (point = origin + u·direction). A crossing at a vertex is reported once, on the segment that starts there.
 */
export function outlineLineIntersections(chain: SegmentChain, origin: Vec, direction: Vec, tolerance = ROOT_TOLERANCE_MM): LineHit[] {
	return lineHitsOnChain(chain, true, origin, direction, -Infinity, Infinity, tolerance);
}

/** Crossings of the ray origin + u·direction, u ≥ 0, with an outline, nearest first. */
export function outlineRayIntersections(chain: SegmentChain, origin: Vec, direction: Vec, tolerance = ROOT_TOLERANCE_MM): LineHit[] {
	return lineHitsOnChain(chain, true, origin, direction, 0, Infinity, tolerance);
}

/** Crossings of the straight segment a→b with an outline, from a to b (u ∈ [0,1], point = a + u·(b − a)). */
export function outlineSegmentIntersections(chain: SegmentChain, a: Vec, b: Vec, tolerance = ROOT_TOLERANCE_MM): LineHit[] {
	return lineHitsOnChain(chain, true, a, { x: b.x - a.x, y: b.y - a.y }, 0, 1, tolerance);
}

/** Same as outlineLineIntersections for an open path (no wrap from last segment to first). */
export function pathLineIntersections(path: Path, origin: Vec, direction: Vec, tolerance = ROOT_TOLERANCE_MM): LineHit[] {
	return lineHitsOnChain(path, false, origin, direction, -Infinity, Infinity, tolerance);
}

/** Crossings of a polyline (open, through `points`) with an outline, in polyline order. */
export function outlinePolylineIntersections(chain: SegmentChain, points: readonly Vec[], tolerance = ROOT_TOLERANCE_MM): PolylineHit[] {
	const out: PolylineHit[] = [];
	for (let k = 0; k + 1 < points.length; k++) {
		for (const h of outlineSegmentIntersections(chain, points[k], points[k + 1], tolerance)) {
			// a crossing exactly at an inner polyline vertex is found on both edges: keep the first
			if (k > 0 && h.u <= PARAMETER_TOLERANCE) {
				const prev = out[out.length - 1];
				if (prev && prev.polylineIndex === k - 1 && prev.u >= 1 - PARAMETER_TOLERANCE) continue;
			}
			out.push({ ...h, polylineIndex: k });
		}
	}
	return out;
}

// ---------------------------------------------------------------- segment vs segment

function lineLine(a: Segment & { kind: 'line' }, b: Segment & { kind: 'line' }, tol: number): SegmentPairHit[] {
	const rx = a.p1.x - a.p0.x, ry = a.p1.y - a.p0.y;
	const sx = b.p1.x - b.p0.x, sy = b.p1.y - b.p0.y;
	const qpx = b.p0.x - a.p0.x, qpy = b.p0.y - a.p0.y;
	const denom = rx * sy - ry * sx;
	const rl = Math.sqrt(rx * rx + ry * ry);
	const sl = Math.sqrt(sx * sx + sy * sy);
	if (rl === 0 || sl === 0) return [];
	if (Math.abs(denom) <= 1e-12 * rl * sl) {
		// parallel: collinear?
		const dist = Math.abs(qpx * ry - qpy * rx) / rl;
		if (dist > tol) return [];
		const out: SegmentPairHit[] = [];
		const rr = rl * rl;
		const ss = sl * sl;
		const candidates: [number, number, Vec][] = [];
		const tb0 = (qpx * rx + qpy * ry) / rr; // b.p0 on a
		const tb1 = ((b.p1.x - a.p0.x) * rx + (b.p1.y - a.p0.y) * ry) / rr; // b.p1 on a
		const ta0 = ((a.p0.x - b.p0.x) * sx + (a.p0.y - b.p0.y) * sy) / ss; // a.p0 on b
		const ta1 = ((a.p1.x - b.p0.x) * sx + (a.p1.y - b.p0.y) * sy) / ss; // a.p1 on b
		const eps = tol / rl;
		const epsb = tol / sl;
		if (ta0 >= -epsb && ta0 <= 1 + epsb) candidates.push([0, clamp01(ta0), a.p0]);
		if (ta1 >= -epsb && ta1 <= 1 + epsb) candidates.push([1, clamp01(ta1), a.p1]);
		if (tb0 >= -eps && tb0 <= 1 + eps) candidates.push([clamp01(tb0), 0, b.p0]);
		if (tb1 >= -eps && tb1 <= 1 + eps) candidates.push([clamp01(tb1), 1, b.p1]);
		candidates.sort((p, q) => p[0] - q[0]);
		for (const c of candidates) {
			if (out.some((o) => Math.abs(o.ta - c[0]) <= eps)) continue;
			out.push({ ta: c[0], tb: c[1], point: c[2] });
		}
		if (out.length > 2) return [out[0], out[out.length - 1]];
		return out;
	}
	const ta = (qpx * sy - qpy * sx) / denom;
	const tb = (qpx * ry - qpy * rx) / denom;
	const ea = tol / rl;
	const eb = tol / sl;
	if (ta < -ea || ta > 1 + ea || tb < -eb || tb > 1 + eb) return [];
	const t = clamp01(ta);
	return [{ ta: t, tb: clamp01(tb), point: segmentPointAt(a, t) }];
}

function lineCurve(line: Segment & { kind: 'line' }, curve: CubicSegment, tol: number, lineFirst: boolean): SegmentPairHit[] {
	const dir = { x: line.p1.x - line.p0.x, y: line.p1.y - line.p0.y };
	const len = Math.sqrt(dir.x * dir.x + dir.y * dir.y);
	if (len === 0) return [];
	const out: SegmentPairHit[] = [];
	for (const h of segmentLineIntersections(curve, line.p0, dir, tol)) {
		if (h.u < -tol / len || h.u > 1 + tol / len) continue;
		const u = clamp01(h.u);
		out.push(lineFirst ? { ta: u, tb: h.t, point: h.point } : { ta: h.t, tb: u, point: h.point });
	}
	return out;
}

/** All intersections of two segments (ta on a, tb on b), sorted by ta. */
export function segmentIntersections(a: Segment, b: Segment, tolerance = INTERSECTION_TOLERANCE_MM): SegmentPairHit[] {
	if (a.kind === 'line' && b.kind === 'line') return lineLine(a, b, tolerance);
	if (a.kind === 'line' && b.kind === 'cubic') return lineCurve(a, b, tolerance, true);
	if (a.kind === 'cubic' && b.kind === 'line') return lineCurve(b, a, tolerance, false);
	return curveCurve(a as CubicSegment, b as CubicSegment, tolerance);
}

// ---------------------------------------------------------------- chains

/** All crossings of two chains (outline/path against outline/path), bounding-box rejection first. */
export function pathIntersections(a: SegmentChain, b: SegmentChain, tolerance = INTERSECTION_TOLERANCE_MM): ChainHit[] {
	// the shorter chain's boxes are sorted by left edge; each segment of the longer chain scans them up to its right edge
	const aShorter = a.segments.length <= b.segments.length;
	const sorted = chainBoxes(aShorter ? a : b, tolerance).sort((p, q) => p.minX - q.minX);
	const scanned = (aShorter ? b : a).segments;
	const out: ChainHit[] = [];
	for (let k = 0; k < scanned.length; k++) {
		const s = scanned[k];
		let minX: number, maxX: number, minY: number, maxY: number;
		if (s.kind === 'line') {
			minX = Math.min(s.p0.x, s.p1.x); maxX = Math.max(s.p0.x, s.p1.x);
			minY = Math.min(s.p0.y, s.p1.y); maxY = Math.max(s.p0.y, s.p1.y);
		} else {
			const c = ctrlBox(s);
			minX = c.minX; maxX = c.maxX; minY = c.minY; maxY = c.maxY;
		}
		for (const x of sorted) {
			if (x.minX > maxX + tolerance) break;
			if (x.maxX < minX - tolerance || x.minY > maxY + tolerance || x.maxY < minY - tolerance) continue;
			const ia = aShorter ? x.i : k;
			const ib = aShorter ? k : x.i;
			for (const h of segmentIntersections(a.segments[ia], b.segments[ib], tolerance)) {
				out.push({ segmentIndex: ia, t: h.ta, otherSegmentIndex: ib, otherT: h.tb, point: h.point });
			}
		}
	}
	// de-duplicate crossings at shared vertices
	out.sort((p, q) => p.segmentIndex + p.t - (q.segmentIndex + q.t));
	const res: ChainHit[] = [];
	for (const h of out) {
		if (res.some((r) => Math.hypot(r.point.x - h.point.x, r.point.y - h.point.y) <= Math.max(tolerance, 1e-9) * 10)) continue;
		res.push(h);
	}
	return res;
}

export const outlinePathIntersections = pathIntersections;
