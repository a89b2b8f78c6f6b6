import type { SegmentChain, Vec } from './types';
import { pathNearestPoint } from './nearest';
import { POINT_TOLERANCE_MM } from './tolerance';

/**
 * Snapping a dragged point (an outline point or a Bézier handle) to what is near it: points
 * (segment ends, handles, apexes, notches), the nearest point on edges (lines and cubics), a grid,
 * and angles (the direction from an anchor rounded to a step, the length kept). Units mm, y down,
 * radians. The snap radius is in mm (a screen radius divided by the zoom); nothing farther than it
 * snaps. Kinds are tried in a priority order; the first kind with a target inside the radius wins,
 * and within a kind the nearest target.
 */

export type SnapKind = 'point' | 'edge' | 'angle' | 'grid';

/** Points first (they are what a pattern cutter aims at), then edges, then angles, then the grid. */
export const SNAP_ORDER_DEFAULT: readonly SnapKind[] = ['point', 'edge', 'angle', 'grid'];

/** What a snap point is on the piece: an end of a segment, a Bézier handle, an apex, a notch, or any other mark. */
export type SnapPointRole = 'segment_end' | 'handle' | 'apex' | 'notch' | 'mark';

export interface SnapPointCandidate {
	readonly point: Vec;
	readonly role: SnapPointRole;
	/** The caller's id of what the point belongs to (a piece, an apex, a notch). */
	readonly id: string;
	/** For segment ends and handles: the segment and which of its control points (p0…p3). */
	readonly segmentIndex?: number;
	readonly controlPoint?: 0 | 1 | 2 | 3;
}

export interface SnapEdgeCandidate {
	readonly chain: SegmentChain;
	/** The caller's id of the chain (e.g. the piece whose outline it is). */
	readonly id: string;
	/** Segments not to snap to (those that move with the dragged point). */
	readonly skipSegments?: readonly number[];
}

export interface SnapGrid {
	/** Distance between grid lines (e.g. 20 mm, or 25.4 mm for an inch grid). */
	readonly spacingMm: number;
	readonly origin: Vec;
}

export interface SnapAngle {
	/** The point the direction is measured from (e.g. the other end of the segment, or a handle's end point). */
	readonly anchor: Vec;
	/** Step of the allowed directions, e.g. 15° in radians; directions are measured from +x toward +y. */
	readonly stepRad: number;
}

export interface SnapOptions {
	readonly radiusMm: number;
	readonly points?: readonly SnapPointCandidate[];
	readonly edges?: readonly SnapEdgeCandidate[];
	readonly grid?: SnapGrid | null;
	readonly angle?: SnapAngle | null;
	/** Priority of the kinds; kinds left out are not tried. */
	readonly order?: readonly SnapKind[];
}

export type SnapTarget =
	| { readonly kind: 'none' }
	| {
			readonly kind: 'point';
			readonly role: SnapPointRole;
			readonly id: string;
			readonly segmentIndex?: number;
			readonly controlPoint?: 0 | 1 | 2 | 3;
	  }
	| { readonly kind: 'edge'; readonly id: string; readonly segmentIndex: number; readonly t: number }
	| { readonly kind: 'grid'; readonly column: number; readonly row: number }
	| { readonly kind: 'angle'; readonly anchor: Vec; readonly angleRad: number; readonly step: number };

export interface SnapResult {
	/** The snapped point, or the given point when nothing is inside the radius. */
	readonly point: Vec;
	readonly target: SnapTarget;
	/** How far the point moved to snap (mm). */
	readonly distanceMm: number;
}

interface Hit {
	readonly point: Vec;
	readonly target: SnapTarget;
	readonly distanceMm: number;
}

const distance = (a: Vec, b: Vec) => Math.hypot(a.x - b.x, a.y - b.y);

/** The nearest candidate point within the radius, or null. */
export function snapToPoints(p: Vec, points: readonly SnapPointCandidate[], radiusMm: number): Hit | null {
	let best: SnapPointCandidate | null = null;
	let bestD2 = radiusMm * radiusMm;
	for (const c of points) {
		const dx = c.point.x - p.x;
		const dy = c.point.y - p.y;
		const d2 = dx * dx + dy * dy;
		if (d2 <= bestD2) {
			bestD2 = d2;
			best = c;
		}
	}
	if (!best) return null;
	const target: SnapTarget = { kind: 'point', role: best.role, id: best.id, ...(best.segmentIndex !== undefined ? { segmentIndex: best.segmentIndex } : {}), ...(best.controlPoint !== undefined ? { controlPoint: best.controlPoint } : {}) };
	return { point: best.point, target, distanceMm: Math.sqrt(bestD2) };
}

/** The nearest point on the edges (exact on lines and cubics, `pathNearestPoint`) within the radius, or null. */
export function snapToEdges(p: Vec, edges: readonly SnapEdgeCandidate[], radiusMm: number): Hit | null {
	let best: Hit | null = null;
	for (const e of edges) {
		let chain = e.chain;
		let indexOf = (i: number) => i;
		if (e.skipSegments?.length) {
			const skip = new Set(e.skipSegments);
			const kept: number[] = [];
			e.chain.segments.forEach((_, i) => {
				if (!skip.has(i)) kept.push(i);
			});
			chain = { segments: kept.map((i) => e.chain.segments[i]) };
			indexOf = (i) => kept[i];
		}
		if (chain.segments.length === 0) continue;
		const r = pathNearestPoint(chain, p);
		if (r.distance <= radiusMm && (!best || r.distance < best.distanceMm)) {
			best = { point: r.point, target: { kind: 'edge', id: e.id, segmentIndex: indexOf(r.segmentIndex), t: r.t }, distanceMm: r.distance };
		}
	}
	return best;
}

/** The nearest grid node within the radius, or null. */
export function snapToGrid(p: Vec, grid: SnapGrid, radiusMm: number): Hit | null {
	if (!(grid.spacingMm > 0)) return null;
	const column = Math.round((p.x - grid.origin.x) / grid.spacingMm);
	const row = Math.round((p.y - grid.origin.y) / grid.spacingMm);
	const point = { x: grid.origin.x + column * grid.spacingMm, y: grid.origin.y + row * grid.spacingMm };
	const d = distance(p, point);
	return d <= radiusMm ? { point, target: { kind: 'grid', column, row }, distanceMm: d } : null;
}

/**
 * The direction from the anchor rounded to the nearest multiple of the step, the distance from the
 * anchor kept; null when that moves the point farther than the radius or the point is on the anchor.
 */
export function snapToAngle(p: Vec, angle: SnapAngle, radiusMm: number): Hit | null {
	const dx = p.x - angle.anchor.x;
	const dy = p.y - angle.anchor.y;
	const lengthMm = Math.hypot(dx, dy);
	if (lengthMm === 0 || !(angle.stepRad > 0)) return null;
	const step = Math.round(Math.atan2(dy, dx) / angle.stepRad);
	const angleRad = step * angle.stepRad;
	const point = { x: angle.anchor.x + lengthMm * Math.cos(angleRad), y: angle.anchor.y + lengthMm * Math.sin(angleRad) };
	const d = distance(p, point);
	return d <= radiusMm ? { point, target: { kind: 'angle', anchor: angle.anchor, angleRad, step }, distanceMm: d } : null;
}

/** Snaps a dragged point: the first kind in the order with a target inside the radius, its nearest target. */
export function pointSnap(p: Vec, options: SnapOptions): SnapResult {
	const radius = options.radiusMm;
	if (radius >= 0) {
		for (const kind of options.order ?? SNAP_ORDER_DEFAULT) {
			let hit: Hit | null = null;
			if (kind === 'point' && options.points?.length) hit = snapToPoints(p, options.points, radius);
			else if (kind === 'edge' && options.edges?.length) hit = snapToEdges(p, options.edges, radius);
			else if (kind === 'angle' && options.angle) hit = snapToAngle(p, options.angle, radius);
			else if (kind === 'grid' && options.grid) hit = snapToGrid(p, options.grid, radius);
			if (hit) return hit;
		}
	}
	return { point: p, target: { kind: 'none' }, distanceMm: 0 };
}

/**
 * The snap points of an outline or path: every segment's start (and the end of an open path's last
 * segment) as `segment_end`, every cubic's two handles as `handle`. Segments in `skipSegments`
 * contribute nothing (the segments that move with the dragged point).
 */
export function chainSnapPoints(chain: SegmentChain, id: string, skipSegments: readonly number[] = []): SnapPointCandidate[] {
	const skip = new Set(skipSegments);
	const out: SnapPointCandidate[] = [];
	const segs = chain.segments;
	segs.forEach((s, i) => {
		if (skip.has(i)) return;
		out.push({ point: s.p0, role: 'segment_end', id, segmentIndex: i, controlPoint: 0 });
		if (s.kind === 'cubic') {
			out.push({ point: s.p1, role: 'handle', id, segmentIndex: i, controlPoint: 1 });
			out.push({ point: s.p2, role: 'handle', id, segmentIndex: i, controlPoint: 2 });
		}
		const end = s.kind === 'line' ? s.p1 : s.p3;
		const next = segs[i + 1] ?? segs[0];
		// the end is the next segment's start unless the chain is open (or the next segment is skipped)
		if (skip.has((i + 1) % segs.length) || distance(end, next.p0) > POINT_TOLERANCE_MM) {
			out.push({ point: end, role: 'segment_end', id, segmentIndex: i, controlPoint: s.kind === 'line' ? 1 : 3 });
		}
	});
	return out;
}
