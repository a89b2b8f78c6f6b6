import type { CubicSegment, LineSegment, Segment, SegmentChain } from './types';
import { chainBoxes, curveCurve, touchReach, type IndexedBox } from './curve-curve';
import { segmentIntersections, type ChainHit, type SegmentPairHit } from './intersect';
import { quadraticRoots } from './roots';
import { segmentBetween, segmentPointAt } from './segment';
import { monotoneChainPairs } from './self-intersect-chains';
import { CLOSURE_TOLERANCE_MM, INTERSECTION_TOLERANCE_MM } from './tolerance';

/**
 * Where an outline or path crosses or touches itself. Which segment pairs are tested comes from the
 * monotone-chain search (self-intersect-chains.ts), or, for outlines with very many chains, from a
 * uniform grid over the segments' boxes (the general search, also `outlineSelfIntersectionsByGrid`).
 * Either way every pair is tested the same way, so both give the same crossings.
 */

/**
 * Calls `visit` once for every pair of overlapping boxes, using a uniform grid (about one cell per
 * box), so that the cost stays near-linear for outlines whose boxes are small relative to the whole.
 */
function boxPairs(boxes: readonly IndexedBox[], visit: (a: IndexedBox, b: IndexedBox) => void): void {
	const n = boxes.length;
	if (n < 2) return;
	let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
	for (const b of boxes) {
		if (b.minX < minX) minX = b.minX; if (b.minY < minY) minY = b.minY;
		if (b.maxX > maxX) maxX = b.maxX; if (b.maxY > maxY) maxY = b.maxY;
	}
	const side = Math.max(1, Math.min(1024, Math.ceil(Math.sqrt(n))));
	const cw = (maxX - minX) / side || 1;
	const ch = (maxY - minY) / side || 1;
	const col = (x: number): number => Math.min(side - 1, Math.max(0, Math.floor((x - minX) / cw)));
	const row = (y: number): number => Math.min(side - 1, Math.max(0, Math.floor((y - minY) / ch)));
	const cells: (IndexedBox[] | undefined)[] = new Array(side * side);
	for (const b of boxes) {
		const c0 = col(b.minX), c1 = col(b.maxX), r0 = row(b.minY), r1 = row(b.maxY);
		for (let r = r0; r <= r1; r++) {
			for (let c = c0; c <= c1; c++) {
				const k = r * side + c;
				(cells[k] ??= []).push(b);
			}
		}
	}
	for (let k = 0; k < cells.length; k++) {
		const list = cells[k];
		if (!list || list.length < 2) continue;
		const r = Math.floor(k / side);
		const c = k - r * side;
		for (let u = 0; u < list.length; u++) {
			const a = list[u];
			for (let v = u + 1; v < list.length; v++) {
				const b = list[v];
				if (a.minX > b.maxX || b.minX > a.maxX || a.minY > b.maxY || b.minY > a.maxY) continue;
				// visit the pair only in the cell holding the low corner of the overlap
				if (col(Math.max(a.minX, b.minX)) !== c || row(Math.max(a.minY, b.minY)) !== r) continue;
				visit(a, b);
			}
		}
	}
}

/**
 * Places where an outline crosses or touches itself (other than consecutive segments meeting at
 * their shared vertex): exact segment–segment tests on the pairs that come close (found along
 * monotone chains, or on a grid for outlines with very many chains), plus loops inside single cubics.
 * `closed` = treat last and first segments as neighbours.
 */
export function outlineSelfIntersections(chain: SegmentChain, closed = true, tolerance = INTERSECTION_TOLERANCE_MM, vertexTolerance = CLOSURE_TOLERANCE_MM): ChainHit[] {
	const segs = chain.segments;
	const reach = touchReach(tolerance);
	const pairs = monotoneChainPairs(segs, reach, reach + 1e-9 <= vertexTolerance);
	if (!pairs) return outlineSelfIntersectionsByGrid(chain, closed, tolerance, vertexTolerance);
	const out = loopHits(segs);
	for (let k = 0; k < pairs.length; k += 2) pairHits(segs, pairs[k], pairs[k + 1], closed, tolerance, vertexTolerance, out);
	out.sort((p, q) => p.segmentIndex - q.segmentIndex || p.t - q.t);
	return out;
}

/**
 * outlineSelfIntersections by the general search: a uniform grid over the segments' control-point
 * boxes gives every pair whose boxes meet. Slower on large outlines; the reference the chain search is
 * tested against.
 */
export function outlineSelfIntersectionsByGrid(chain: SegmentChain, closed = true, tolerance = INTERSECTION_TOLERANCE_MM, vertexTolerance = CLOSURE_TOLERANCE_MM): ChainHit[] {
	const segs = chain.segments;
	const out = loopHits(segs);
	boxPairs(chainBoxes(chain, tolerance), (x, y) => pairHits(segs, Math.min(x.i, y.i), Math.max(x.i, y.i), closed, tolerance, vertexTolerance, out));
	out.sort((p, q) => p.segmentIndex - q.segmentIndex || p.t - q.t);
	return out;
}

/**
 * outlineSelfIntersections by testing every pair of segments (n² work): the brute-force reference both
 * searches are property-tested against. Not for use on large outlines.
 */
export function outlineSelfIntersectionsByAllPairs(chain: SegmentChain, closed = true, tolerance = INTERSECTION_TOLERANCE_MM, vertexTolerance = CLOSURE_TOLERANCE_MM): ChainHit[] {
	const segs = chain.segments;
	const out = loopHits(segs);
	for (let i = 0; i < segs.length; i++) for (let j = i + 1; j < segs.length; j++) pairHits(segs, i, j, closed, tolerance, vertexTolerance, out);
	out.sort((p, q) => p.segmentIndex - q.segmentIndex || p.t - q.t);
	return out;
}

/** Loops inside single cubics (only the segments `only` accepts, when given; internal, for self-intersect-parts.ts). */
export function loopHits(segs: readonly Segment[], only?: (i: number) => boolean): ChainHit[] {
	const out: ChainHit[] = [];
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		if (only && !only(i)) continue;
		// a loop needs both x and y to turn back; a coordinate with monotone control values cannot
		if (s.kind === 'line' || monotone(s.p0.x, s.p1.x, s.p2.x, s.p3.x) || monotone(s.p0.y, s.p1.y, s.p2.y, s.p3.y)) continue;
		for (const h of segmentSelfIntersection(s)) out.push({ segmentIndex: i, t: h.ta, otherSegmentIndex: i, otherT: h.tb, point: h.point });
	}
	return out;
}

/**
 * False when two straight segments certainly give segmentIntersections nothing that pairHits keeps, so
 * the exact test can be skipped: one lies wholly on one side of the other's line, farther than the
 * tolerance (no crossing, no touching, no overlap); or they are neighbours meeting at one shared point
 * at an angle, where the only crossing is that shared vertex (lineLine finds it at ta = 1, tb = 0
 * exactly: the same products cancel), which pairHits drops.
 */
function linesMayTouch(a: LineSegment, b: LineSegment, nextOfA: boolean, bEndIsAStart: boolean, tolerance: number, vertexTolerance: number): boolean {
	const rx = a.p1.x - a.p0.x, ry = a.p1.y - a.p0.y;
	const sx = b.p1.x - b.p0.x, sy = b.p1.y - b.p0.y;
	const rl = Math.sqrt(rx * rx + ry * ry);
	const sl = Math.sqrt(sx * sx + sy * sy);
	if (rl === 0 || sl === 0) return true;
	const margin = 2 * tolerance;
	// b against a's line, a against b's line (cross products = signed distance × length)
	const b0 = rx * (b.p0.y - a.p0.y) - ry * (b.p0.x - a.p0.x);
	const b1 = rx * (b.p1.y - a.p0.y) - ry * (b.p1.x - a.p0.x);
	if ((b0 > margin * rl && b1 > margin * rl) || (b0 < -margin * rl && b1 < -margin * rl)) return false;
	const a0 = sx * (a.p0.y - b.p0.y) - sy * (a.p0.x - b.p0.x);
	const a1 = sx * (a.p1.y - b.p0.y) - sy * (a.p1.x - b.p0.x);
	if ((a0 > margin * sl && a1 > margin * sl) || (a0 < -margin * sl && a1 < -margin * sl)) return false;
	const shared = (nextOfA && a.p1.x === b.p0.x && a.p1.y === b.p0.y) || (bEndIsAStart && b.p1.x === a.p0.x && b.p1.y === a.p0.y);
	const atAnAngle = Math.abs(rx * sy - ry * sx) > 1e-12 * rl * sl;
	return !(shared && atAnAngle && vertexTolerance >= 1e-9);
}

const monotone = (a: number, b: number, c: number, d: number): boolean => (a <= b && b <= c && c <= d) || (a >= b && b >= c && c >= d);

/** Crossings of segments i < j, without the touching of neighbours at their shared vertex (internal, for self-intersect-parts.ts). */
export function pairHits(segs: readonly Segment[], i: number, j: number, closed: boolean, tolerance: number, vertexTolerance: number, out: ChainHit[]): void {
	const n = segs.length;
	const nextOfI = j === i + 1;
	const wrap = closed && i === 0 && j === n - 1 && n > 1;
	const si = segs[i];
	const sj = segs[j];
	if (si.kind === 'line' && sj.kind === 'line' && !linesMayTouch(si, sj, nextOfI, wrap, tolerance, vertexTolerance)) return;
	const endI = si.kind === 'line' ? si.p1 : si.p3;
	const hits = (nextOfI || wrap) && si.kind === 'cubic' && sj.kind === 'cubic'
		? neighbourCubicHits(si, sj, nextOfI, wrap, tolerance, vertexTolerance)
		: segmentIntersections(si, sj, tolerance);
	for (const h of hits) {
		// consecutive segments meet at their shared vertex: not a self-intersection
		if (nextOfI && Math.hypot(h.point.x - endI.x, h.point.y - endI.y) <= vertexTolerance && h.ta > 0.5 && h.tb < 0.5) continue;
		if (wrap && Math.hypot(h.point.x - si.p0.x, h.point.y - si.p0.y) <= vertexTolerance && h.ta < 0.5 && h.tb > 0.5) continue;
		out.push({ segmentIndex: i, t: h.ta, otherSegmentIndex: j, otherT: h.tb, point: h.point });
	}
}

/**
 * Where a single cubic crosses itself (a loop), closed form: with B(t) = a t³ + b t² + c t + d,
 * B(s) = B(t), s ≠ t ⇔ a(σ² − π) + bσ + c = 0 with σ = s + t, π = s·t. Returns [] or one hit.
 */
export function segmentSelfIntersection(s: Segment): SegmentPairHit[] {
	if (s.kind === 'line') return [];
	const { p0, p1, p2, p3 } = s;
	const ax = -p0.x + 3 * p1.x - 3 * p2.x + p3.x, ay = -p0.y + 3 * p1.y - 3 * p2.y + p3.y;
	const bx = 3 * p0.x - 6 * p1.x + 3 * p2.x, by = 3 * p0.y - 6 * p1.y + 3 * p2.y;
	const cx = -3 * p0.x + 3 * p1.x, cy = -3 * p0.y + 3 * p1.y;
	const den = bx * ay - by * ax;
	if (Math.abs(den) < 1e-14) return [];
	const sigma = (cy * ax - cx * ay) / den;
	const pi = Math.abs(ax) >= Math.abs(ay) ? sigma * sigma + (bx * sigma + cx) / ax : sigma * sigma + (by * sigma + cy) / ay;
	if (!Number.isFinite(pi)) return [];
	const roots = quadraticRoots(1, -sigma, pi);
	if (roots.length !== 2) return [];
	const [t1, t2] = roots;
	if (t1 < 0 || t2 > 1 || t2 - t1 < 1e-9) return [];
	return [{ ta: t1, tb: t2, point: segmentPointAt(s, t1) }];
}

/** Parameter span at a cubic's end that stays within `distance` of that end (|B'| ≤ 3·longest leg). */
function endSpan(c: CubicSegment, distance: number): number {
	const leg = Math.max(
		Math.hypot(c.p1.x - c.p0.x, c.p1.y - c.p0.y),
		Math.hypot(c.p2.x - c.p1.x, c.p2.y - c.p1.y),
		Math.hypot(c.p3.x - c.p2.x, c.p3.y - c.p2.y)
	);
	return leg === 0 ? 0 : Math.min(0.25, distance / (3 * leg));
}

/**
 * Crossings of two neighbouring cubics away from their shared vertex: the bits within
 * `vertexTolerance` of the shared vertex are cut off first, so the subdivision does not dig into
 * the (ignored) touching point. Parameters are mapped back to the whole segments.
 */
function neighbourCubicHits(a: CubicSegment, b: CubicSegment, aEndMeetsBStart: boolean, bEndMeetsAStart: boolean, tol: number, vertexTolerance: number): SegmentPairHit[] {
	const ea = endSpan(a, vertexTolerance * 0.5);
	const eb = endSpan(b, vertexTolerance * 0.5);
	const a0 = bEndMeetsAStart ? ea : 0;
	const a1 = aEndMeetsBStart ? 1 - ea : 1;
	const b0 = aEndMeetsBStart ? eb : 0;
	const b1 = bEndMeetsAStart ? 1 - eb : 1;
	const hits = curveCurve(segmentBetween(a, a0, a1) as CubicSegment, segmentBetween(b, b0, b1) as CubicSegment, tol);
	return hits.map((h) => ({ ta: a0 + h.ta * (a1 - a0), tb: b0 + h.tb * (b1 - b0), point: h.point }));
}
