import type { CubicSegment, Segment, SegmentChain } from './types';
import { segmentDerivativeAt, segmentPointAt, segmentSplitAt } from './segment';
import type { SegmentPairHit } from './intersect';

/**
 * Internal helpers of the intersection searches (not re-exported by index.ts): control-point boxes,
 * cubic–cubic intersection by subdivision with box rejection, then Newton refinement.
 */

export function clamp01(t: number): number {
	return t < 0 ? 0 : t > 1 ? 1 : t;
}

export interface Box { minX: number; minY: number; maxX: number; maxY: number }
export interface IndexedBox extends Box { i: number }

export function ctrlBox(c: CubicSegment): Box {
	return {
		minX: Math.min(c.p0.x, c.p1.x, c.p2.x, c.p3.x), minY: Math.min(c.p0.y, c.p1.y, c.p2.y, c.p3.y),
		maxX: Math.max(c.p0.x, c.p1.x, c.p2.x, c.p3.x), maxY: Math.max(c.p0.y, c.p1.y, c.p2.y, c.p3.y)
	};
}

/** Guards for overlapping (coincident) curves, whose intersection is a whole stretch, not points. */
const MAX_SUBDIVISION_STEPS = 20000;
const MAX_CANDIDATES = 64;

/** Size below which curveCurve stops subdividing: a near-tangent contact is kept within twice this. */
function curveLeaf(tol: number): number {
	return Math.max(tol * 1000, 1e-5);
}

/**
 * How far apart two segments can be and still be reported as crossing or touching by
 * segmentIntersections: lines and line–curve within 2·tol, cubic–cubic within 2·leaf (a tangential
 * contact kept at its leaf).
 */
export function touchReach(tol: number): number {
	return 2 * curveLeaf(tol) + 2 * tol;
}

export function curveCurve(A: CubicSegment, B: CubicSegment, tol: number): SegmentPairHit[] {
	const candidates: [number, number][] = [];
	let steps = 0;
	const leaf = curveLeaf(tol);
	const rec = (a: CubicSegment, a0: number, a1: number, b: CubicSegment, b0: number, b1: number, depth: number): void => {
		if (++steps > MAX_SUBDIVISION_STEPS || candidates.length >= MAX_CANDIDATES) return;
		const ba = ctrlBox(a);
		const bb = ctrlBox(b);
		if (ba.minX > bb.maxX + tol || bb.minX > ba.maxX + tol || ba.minY > bb.maxY + tol || bb.minY > ba.maxY + tol) return;
		const sa = Math.max(ba.maxX - ba.minX, ba.maxY - ba.minY);
		const sb = Math.max(bb.maxX - bb.minX, bb.maxY - bb.minY);
		if ((sa <= leaf && sb <= leaf) || depth > 48) {
			candidates.push([0.5 * (a0 + a1), 0.5 * (b0 + b1)]);
			return;
		}
		if (sa >= sb) {
			const [l, r] = segmentSplitAt(a, 0.5) as [CubicSegment, CubicSegment];
			const am = 0.5 * (a0 + a1);
			rec(l, a0, am, b, b0, b1, depth + 1);
			rec(r, am, a1, b, b0, b1, depth + 1);
		} else {
			const [l, r] = segmentSplitAt(b, 0.5) as [CubicSegment, CubicSegment];
			const bm = 0.5 * (b0 + b1);
			rec(a, a0, a1, l, b0, bm, depth + 1);
			rec(a, a0, a1, r, bm, b1, depth + 1);
		}
	};
	rec(A, 0, 1, B, 0, 1, 0);
	const out: SegmentPairHit[] = [];
	for (const [s0, t0] of candidates) {
		const r = newtonPair(A, B, s0, t0);
		const pa = segmentPointAt(A, r[0]);
		const pb = segmentPointAt(B, r[1]);
		const d = Math.hypot(pa.x - pb.x, pa.y - pb.y);
		let ta = r[0], tb = r[1], p = pa;
		if (!(d <= Math.max(tol, 1e-9))) {
			// Newton failed (tangency): keep the leaf centre if it is close enough
			const qa = segmentPointAt(A, s0);
			const qb = segmentPointAt(B, t0);
			if (Math.hypot(qa.x - qb.x, qa.y - qb.y) > leaf * 2) continue;
			ta = s0; tb = t0; p = qa;
		}
		if (out.some((o) => Math.hypot(o.point.x - p.x, o.point.y - p.y) <= leaf * 2 && Math.abs(o.ta - ta) < 1e-5 && Math.abs(o.tb - tb) < 1e-5)) continue;
		out.push({ ta, tb, point: p });
	}
	out.sort((p, q) => p.ta - q.ta);
	return out;
}

function newtonPair(A: Segment, B: Segment, s: number, t: number): [number, number] {
	for (let i = 0; i < 30; i++) {
		const pa = segmentPointAt(A, s);
		const pb = segmentPointAt(B, t);
		const fx = pa.x - pb.x;
		const fy = pa.y - pb.y;
		if (Math.abs(fx) + Math.abs(fy) < 1e-13) break;
		const da = segmentDerivativeAt(A, s);
		const db = segmentDerivativeAt(B, t);
		const det = -da.x * db.y + db.x * da.y;
		if (Math.abs(det) < 1e-18) break;
		// [da.x -db.x; da.y -db.y] [ds; dt] = -[fx; fy]
		const ds = (-fx * -db.y - -db.x * -fy) / det;
		const dt = (da.x * -fy - da.y * -fx) / det;
		s = clamp01(s + ds);
		t = clamp01(t + dt);
		if (Math.abs(ds) + Math.abs(dt) < 1e-15) break;
	}
	return [s, t];
}

/** Boxes of the segments of a chain (control-point boxes for cubics), grown by `margin`, with their index. */
export function chainBoxes(chain: SegmentChain, margin: number): IndexedBox[] {
	return chain.segments.map((s, i) => {
		const b = s.kind === 'line'
			? { minX: Math.min(s.p0.x, s.p1.x), minY: Math.min(s.p0.y, s.p1.y), maxX: Math.max(s.p0.x, s.p1.x), maxY: Math.max(s.p0.y, s.p1.y) }
			: ctrlBox(s);
		return { minX: b.minX - margin, minY: b.minY - margin, maxX: b.maxX + margin, maxY: b.maxY + margin, i };
	});
}
