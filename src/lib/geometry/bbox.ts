import type { BoundingBox, Segment, SegmentChain, Vec } from './types';
import { quadraticRoots } from './roots';

/** Exact bounding boxes (cubic extremes from the roots of the derivative). */

export const BOUNDING_BOX_EMPTY: BoundingBox = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };

function cubicAxisExtremes(a: number, b: number, c: number, d: number, out: number[]): void {
	// derivative of Bernstein cubic /3: e0=b-a, e1=c-b, e2=d-c → A t² + B t + C
	const e0 = b - a, e1 = c - b, e2 = d - c;
	const roots = quadraticRoots(e0 - 2 * e1 + e2, 2 * (e1 - e0), e0);
	for (const t of roots) {
		if (t > 0 && t < 1) {
			const mt = 1 - t;
			out.push(mt * mt * mt * a + 3 * mt * mt * t * b + 3 * mt * t * t * c + t * t * t * d);
		}
	}
}

/** Tight bounding box of one segment. */
export function segmentBoundingBox(s: Segment): BoundingBox {
	if (s.kind === 'line') {
		return {
			minX: Math.min(s.p0.x, s.p1.x), minY: Math.min(s.p0.y, s.p1.y),
			maxX: Math.max(s.p0.x, s.p1.x), maxY: Math.max(s.p0.y, s.p1.y)
		};
	}
	const xs = [s.p0.x, s.p3.x];
	const ys = [s.p0.y, s.p3.y];
	cubicAxisExtremes(s.p0.x, s.p1.x, s.p2.x, s.p3.x, xs);
	cubicAxisExtremes(s.p0.y, s.p1.y, s.p2.y, s.p3.y, ys);
	return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
}

/** Box of the control points (contains the curve; cheaper than the tight box). */
export function segmentControlBoundingBox(s: Segment): BoundingBox {
	if (s.kind === 'line') return segmentBoundingBox(s);
	return {
		minX: Math.min(s.p0.x, s.p1.x, s.p2.x, s.p3.x), minY: Math.min(s.p0.y, s.p1.y, s.p2.y, s.p3.y),
		maxX: Math.max(s.p0.x, s.p1.x, s.p2.x, s.p3.x), maxY: Math.max(s.p0.y, s.p1.y, s.p2.y, s.p3.y)
	};
}

/** Tight bounding box of an outline or path (BOUNDING_BOX_EMPTY when it has no segments). */
export function pathBoundingBox(chain: SegmentChain): BoundingBox {
	let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
	for (const s of chain.segments) {
		const b = s.kind === 'line'
			? null
			: segmentBoundingBox(s);
		if (b === null) {
			const { p0, p1 } = s;
			if (p0.x < minX) minX = p0.x; if (p0.x > maxX) maxX = p0.x;
			if (p0.y < minY) minY = p0.y; if (p0.y > maxY) maxY = p0.y;
			if (p1.x < minX) minX = p1.x; if (p1.x > maxX) maxX = p1.x;
			if (p1.y < minY) minY = p1.y; if (p1.y > maxY) maxY = p1.y;
		} else {
			if (b.minX < minX) minX = b.minX; if (b.maxX > maxX) maxX = b.maxX;
			if (b.minY < minY) minY = b.minY; if (b.maxY > maxY) maxY = b.maxY;
		}
	}
	return { minX, minY, maxX, maxY };
}

/** Same as pathBoundingBox, named for outlines. */
export const outlineBoundingBox = pathBoundingBox;

/** Bounding box of points. */
export function pointsBoundingBox(points: readonly Vec[]): BoundingBox {
	let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
	for (const p of points) {
		if (p.x < minX) minX = p.x; if (p.x > maxX) maxX = p.x;
		if (p.y < minY) minY = p.y; if (p.y > maxY) maxY = p.y;
	}
	return { minX, minY, maxX, maxY };
}

export function boundingBoxOverlaps(a: BoundingBox, b: BoundingBox, margin = 0): boolean {
	return a.minX <= b.maxX + margin && b.minX <= a.maxX + margin && a.minY <= b.maxY + margin && b.minY <= a.maxY + margin;
}

export function boundingBoxContainsPoint(b: BoundingBox, p: Vec, margin = 0): boolean {
	return p.x >= b.minX - margin && p.x <= b.maxX + margin && p.y >= b.minY - margin && p.y <= b.maxY + margin;
}

export function boundingBoxUnion(a: BoundingBox, b: BoundingBox): BoundingBox {
	return { minX: Math.min(a.minX, b.minX), minY: Math.min(a.minY, b.minY), maxX: Math.max(a.maxX, b.maxX), maxY: Math.max(a.maxY, b.maxY) };
}
