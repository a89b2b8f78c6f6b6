import {
	boundingBoxContainsPoint,
	outlineContainsPoint,
	outlineNearestPoint,
	segmentPointAt,
	vecAdd,
	vecDistance,
	vecSub,
	type Vec
} from '$lib/geometry';
import type { Piece } from '$lib/pattern/piece-schema';
import { pieceDrawing } from './drawing';

/** Pure hit testing and snapping on the editor's pieces (world mm = piece mm + layout offset). */

export interface PlacedPiece {
	readonly key: string;
	readonly piece: Piece;
	readonly offset: Vec;
}

export type HitKind = 'apex' | 'point' | 'edge' | 'inside';

export interface Hit {
	readonly pieceKey: string;
	readonly kind: HitKind;
	/** Point in the piece's own coordinates (snapped onto the feature). */
	readonly local: Vec;
	readonly segmentIndex: number;
	readonly t: number;
}

export type SnapKind = 'apex' | 'point' | 'midpoint' | 'edge' | 'grid' | 'free';

export interface Snap {
	readonly kind: SnapKind;
	readonly world: Vec;
	readonly pieceKey: string | null;
	readonly local: Vec | null;
	readonly segmentIndex: number;
	readonly t: number;
}

export const GRID_MM = 10;

function near(p: PlacedPiece, world: Vec, tol: number): boolean {
	return boundingBoxContainsPoint(pieceDrawing(p.piece).bbox, vecSub(world, p.offset), tol);
}

/** What lies under the pointer: an apex, an outline point, an edge, or the inside of a piece (topmost first). */
export function hitTest(pieces: readonly PlacedPiece[], world: Vec, tolMm: number): Hit | null {
	let inside: Hit | null = null;
	for (let i = pieces.length - 1; i >= 0; i--) {
		const pp = pieces[i];
		if (!near(pp, world, tolMm)) continue;
		const local = vecSub(world, pp.offset);
		for (const a of pp.piece.apexes) {
			if (vecDistance(a.point, local) <= tolMm) return { pieceKey: pp.key, kind: 'apex', local: a.point, segmentIndex: -1, t: 0 };
		}
		const segs = pp.piece.outline.segments;
		for (let s = 0; s < segs.length; s++) {
			if (vecDistance(segs[s].p0, local) <= tolMm) return { pieceKey: pp.key, kind: 'point', local: segs[s].p0, segmentIndex: s, t: 0 };
		}
		const n = outlineNearestPoint(pp.piece.outline, local);
		if (n.distance <= tolMm) return { pieceKey: pp.key, kind: 'edge', local: n.point, segmentIndex: n.segmentIndex, t: n.t };
		if (!inside && outlineContainsPoint(pp.piece.outline, local)) inside = { pieceKey: pp.key, kind: 'inside', local, segmentIndex: -1, t: 0 };
	}
	return inside;
}

export interface SnapOptions {
	readonly grid?: boolean;
	/** Only this piece's features (and then the outline's nearest point is always taken). */
	readonly onlyPiece?: string;
	readonly outlineOnly?: boolean;
}

/** Snap a pointer position to apexes, outline points, midpoints, edges, then the 10 mm grid. */
export function snapPoint(pieces: readonly PlacedPiece[], world: Vec, tolMm: number, opts: SnapOptions = {}): Snap {
	let best: Snap | null = null;
	let bestD = Infinity;
	const rank: Record<SnapKind, number> = { apex: 0, point: 1, midpoint: 2, edge: 3, grid: 4, free: 5 };
	const consider = (s: Snap, d: number) => {
		if (d > tolMm) return;
		if (!best || rank[s.kind] < rank[best.kind] || (rank[s.kind] === rank[best.kind] && d < bestD)) {
			best = s;
			bestD = d;
		}
	};
	for (const pp of pieces) {
		if (opts.onlyPiece && pp.key !== opts.onlyPiece) continue;
		if (!opts.onlyPiece && !near(pp, world, tolMm)) continue;
		const local = vecSub(world, pp.offset);
		const mk = (kind: SnapKind, l: Vec, segmentIndex = -1, t = 0): Snap => ({ kind, world: vecAdd(l, pp.offset), pieceKey: pp.key, local: l, segmentIndex, t });
		if (!opts.outlineOnly) for (const a of pp.piece.apexes) consider(mk('apex', a.point), vecDistance(a.point, local));
		const segs = pp.piece.outline.segments;
		for (let s = 0; s < segs.length; s++) {
			consider(mk('point', segs[s].p0, s, 0), vecDistance(segs[s].p0, local));
			const m = segmentPointAt(segs[s], 0.5);
			consider(mk('midpoint', m, s, 0.5), vecDistance(m, local));
		}
		const n = outlineNearestPoint(pp.piece.outline, local);
		const e = mk('edge', n.point, n.segmentIndex, n.t);
		if (opts.onlyPiece) consider(e, Math.min(n.distance, tolMm));
		else consider(e, n.distance);
	}
	if (best) return best;
	if (opts.grid) {
		const g = { x: Math.round(world.x / GRID_MM) * GRID_MM, y: Math.round(world.y / GRID_MM) * GRID_MM };
		if (vecDistance(g, world) <= tolMm) return { kind: 'grid', world: g, pieceKey: null, local: null, segmentIndex: -1, t: 0 };
	}
	return { kind: 'free', world, pieceKey: null, local: null, segmentIndex: -1, t: 0 };
}

/** Distance from p to the segment ab. */
export function distanceToSegment(p: Vec, a: Vec, b: Vec): number {
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	const l2 = dx * dx + dy * dy;
	const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / l2));
	return Math.hypot(a.x + t * dx - p.x, a.y + t * dy - p.y);
}

/** The dart nearest to a point of the piece (its legs or mouth), within tol. */
export function dartNear(piece: Piece, local: Vec, tolMm: number): string | null {
	let best: string | null = null;
	let bestD = tolMm;
	for (const d of piece.darts) {
		const apex = piece.apexes.find((a) => a.id === d.apexId)?.point;
		if (!apex) continue;
		const dist = Math.min(distanceToSegment(local, apex, d.leg1End), distanceToSegment(local, apex, d.leg2End), distanceToSegment(local, d.leg1End, d.leg2End));
		if (dist <= bestD) {
			bestD = dist;
			best = d.id;
		}
	}
	return best;
}

/** The internal line nearest to a point of the piece, within tol. */
export function internalLineNear(piece: Piece, local: Vec, tolMm: number): string | null {
	let best: string | null = null;
	let bestD = tolMm;
	for (const l of piece.internalLines) {
		const n = outlineNearestPoint(l.path, local);
		if (n.distance <= bestD) {
			bestD = n.distance;
			best = l.id;
		}
	}
	return best;
}
