import type { Segment, SegmentChain, Vec } from './types';
import { segmentDerivativeAt, segmentPointAt, segmentSecondDerivativeAt } from './segment';

/** Nearest point on a segment / outline / path to a given point. */

export interface NearestPoint {
	readonly segmentIndex: number;
	readonly t: number;
	readonly point: Vec;
	readonly distance: number;
}

const SAMPLES = 24;

/** Nearest point on one segment: {t, point, distance}. Cubics: sampling, then Newton on (B − p)·B' = 0. */
export function segmentNearestPoint(s: Segment, p: Vec): { t: number; point: Vec; distance: number } {
	if (s.kind === 'line') {
		const dx = s.p1.x - s.p0.x, dy = s.p1.y - s.p0.y;
		const l2 = dx * dx + dy * dy;
		let t = l2 === 0 ? 0 : ((p.x - s.p0.x) * dx + (p.y - s.p0.y) * dy) / l2;
		t = t < 0 ? 0 : t > 1 ? 1 : t;
		const q = t === 0 ? s.p0 : t === 1 ? s.p1 : { x: s.p0.x + t * dx, y: s.p0.y + t * dy };
		return { t, point: q, distance: Math.hypot(q.x - p.x, q.y - p.y) };
	}
	const d2 = new Array<number>(SAMPLES + 1);
	for (let i = 0; i <= SAMPLES; i++) {
		const q = segmentPointAt(s, i / SAMPLES);
		d2[i] = (q.x - p.x) ** 2 + (q.y - p.y) ** 2;
	}
	let bestT = 0;
	let bestD = d2[0];
	if (d2[SAMPLES] < bestD) { bestD = d2[SAMPLES]; bestT = 1; }
	for (let i = 0; i <= SAMPLES; i++) {
		const isLocalMin = (i === 0 || d2[i] <= d2[i - 1]) && (i === SAMPLES || d2[i] <= d2[i + 1]);
		if (!isLocalMin) continue;
		// golden-section search on the bracket around the sample (robust), then Newton polish (fast, exact)
		let lo = Math.max(0, (i - 1) / SAMPLES);
		let hi = Math.min(1, (i + 1) / SAMPLES);
		const dist2 = (u: number): number => {
			const q = segmentPointAt(s, u);
			return (q.x - p.x) ** 2 + (q.y - p.y) ** 2;
		};
		const g = 0.6180339887498949;
		let x1 = hi - g * (hi - lo);
		let x2 = lo + g * (hi - lo);
		let f1 = dist2(x1);
		let f2 = dist2(x2);
		for (let k = 0; k < 40; k++) {
			if (f1 <= f2) { hi = x2; x2 = x1; f2 = f1; x1 = hi - g * (hi - lo); f1 = dist2(x1); }
			else { lo = x1; x1 = x2; f1 = f2; x2 = lo + g * (hi - lo); f2 = dist2(x2); }
		}
		let t = f1 <= f2 ? x1 : x2;
		let ft = Math.min(f1, f2);
		for (let k = 0; k < 8; k++) {
			const q = segmentPointAt(s, t);
			const d1 = segmentDerivativeAt(s, t);
			const dd = segmentSecondDerivativeAt(s, t);
			const ex = q.x - p.x, ey = q.y - p.y;
			const f = ex * d1.x + ey * d1.y;
			const fp = d1.x * d1.x + d1.y * d1.y + ex * dd.x + ey * dd.y;
			if (fp <= 0) break;
			const next = Math.min(1, Math.max(0, t - f / fp));
			const fn = dist2(next);
			if (!(fn < ft)) break;
			t = next;
			ft = fn;
		}
		const q = segmentPointAt(s, t);
		const d = (q.x - p.x) ** 2 + (q.y - p.y) ** 2;
		if (d < bestD) { bestD = d; bestT = t; }
	}
	const point = bestT === 0 ? s.p0 : bestT === 1 ? s.p3 : segmentPointAt(s, bestT);
	return { t: bestT, point, distance: Math.sqrt(bestD) };
}

/** Nearest point on an outline or path (segment index, t, point, distance). Segments whose box is farther than the best so far are skipped. */
export function pathNearestPoint(chain: SegmentChain, p: Vec): NearestPoint {
	let best: NearestPoint = { segmentIndex: -1, t: 0, point: { x: NaN, y: NaN }, distance: Infinity };
	// straight segments are measured in place (squared distance, no allocation); the winner is built at the end
	let bestD2 = Infinity;
	let bestLine = -1;
	const segs = chain.segments;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		if (s.kind === 'line') {
			const x0 = s.p0.x, y0 = s.p0.y;
			const dx = s.p1.x - x0, dy = s.p1.y - y0;
			// lower bound: distance to the segment's box
			const bx = p.x < Math.min(x0, x0 + dx) ? Math.min(x0, x0 + dx) - p.x : p.x > Math.max(x0, x0 + dx) ? p.x - Math.max(x0, x0 + dx) : 0;
			const by = p.y < Math.min(y0, y0 + dy) ? Math.min(y0, y0 + dy) - p.y : p.y > Math.max(y0, y0 + dy) ? p.y - Math.max(y0, y0 + dy) : 0;
			if (bx * bx + by * by > bestD2) continue;
			const l2 = dx * dx + dy * dy;
			let t = l2 === 0 ? 0 : ((p.x - x0) * dx + (p.y - y0) * dy) / l2;
			t = t < 0 ? 0 : t > 1 ? 1 : t;
			const ex = x0 + t * dx - p.x, ey = y0 + t * dy - p.y;
			const d2 = ex * ex + ey * ey;
			if (d2 < bestD2) {
				bestD2 = d2;
				bestLine = i;
			}
			continue;
		}
		const minX = Math.min(s.p0.x, s.p1.x, s.p2.x, s.p3.x), maxX = Math.max(s.p0.x, s.p1.x, s.p2.x, s.p3.x);
		const minY = Math.min(s.p0.y, s.p1.y, s.p2.y, s.p3.y), maxY = Math.max(s.p0.y, s.p1.y, s.p2.y, s.p3.y);
		const bx = p.x < minX ? minX - p.x : p.x > maxX ? p.x - maxX : 0;
		const by = p.y < minY ? minY - p.y : p.y > maxY ? p.y - maxY : 0;
		if (bx * bx + by * by > bestD2) continue;
		const r = segmentNearestPoint(s, p);
		if (r.distance * r.distance < bestD2) {
			best = { segmentIndex: i, t: r.t, point: r.point, distance: r.distance };
			bestD2 = r.distance * r.distance;
			bestLine = -1;
		}
	}
	if (bestLine >= 0) {
		const r = segmentNearestPoint(segs[bestLine], p);
		best = { segmentIndex: bestLine, t: r.t, point: r.point, distance: r.distance };
	}
	return best;
}

export const outlineNearestPoint = pathNearestPoint;
