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
import { snapToAngle, snapToEdges, snapToGrid, snapToPoints, type SnapPointCandidate } from '$lib/geometry/snap';
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

export type SnapKind = 'apex' | 'point' | 'midpoint' | 'edge' | 'angle' | 'grid' | 'free';

export interface Snap {
	readonly kind: SnapKind;
	readonly world: Vec;
	readonly pieceKey: string | null;
	readonly local: Vec | null;
	readonly segmentIndex: number;
	readonly t: number;
}

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
	/** Snap to the pattern paper's grid (the editor's snapAt: on unless false). */
	readonly grid?: boolean;
	/** Only this piece's features (and then the outline's nearest point is always taken). */
	readonly onlyPiece?: string;
	readonly outlineOnly?: boolean;
	/** Snap the direction from this point (world) to 15° steps, the distance kept (a line's second end). */
	readonly angleFrom?: Vec | null;
}

export interface SnapPlaces {
	/** The paper's grid spacing in mm (2 cm or 1 in), grid nodes at multiples of it from the table's origin; 0 for none. */
	readonly gridMm: number;
}

/** Directions a line snaps to: every 15°. */
export const SNAP_ANGLE_STEP_RAD = Math.PI / 12;

interface PieceSnapPoints {
	readonly apexes: readonly SnapPointCandidate[];
	readonly ends: readonly SnapPointCandidate[];
	readonly mids: readonly SnapPointCandidate[];
}
/** A piece's snap points, made once per piece value (pieces are immutable). */
const snapPointsCache = new WeakMap<Piece, PieceSnapPoints>();
function pieceSnapPoints(piece: Piece): PieceSnapPoints {
	let c = snapPointsCache.get(piece);
	if (!c) {
		const segs = piece.outline.segments;
		c = {
			apexes: piece.apexes.map((a) => ({ point: a.point, role: 'apex' as const, id: a.id })),
			ends: segs.map((s, i) => ({ point: s.p0, role: 'segment_end' as const, id: piece.id, segmentIndex: i, controlPoint: 0 as const })),
			mids: segs.map((s, i) => ({ point: segmentPointAt(s, 0.5), role: 'mark' as const, id: piece.id, segmentIndex: i }))
		};
		snapPointsCache.set(piece, c);
	}
	return c;
}

/**
 * Snap a pointer position (world mm) with the kernel's snapping (`$lib/geometry/snap`), in this order:
 * apexes, outline points, midpoints of segments, edges, 15° from `angleFrom`, the paper's grid. Within
 * a kind the nearest target inside the radius wins.
 */
export function snapPoint(pieces: readonly PlacedPiece[], world: Vec, tolMm: number, opts: SnapOptions = {}, places: SnapPlaces = { gridMm: 0 }): Snap {
	const around = pieces.filter((pp) => (opts.onlyPiece ? pp.key === opts.onlyPiece : near(pp, world, tolMm)));
	const onPiece = (kind: SnapKind, which: (c: PieceSnapPoints) => readonly SnapPointCandidate[]): Snap | null => {
		let best: Snap | null = null;
		let bestD = tolMm;
		for (const pp of around) {
			const h = snapToPoints(vecSub(world, pp.offset), which(pieceSnapPoints(pp.piece)), bestD);
			if (h && (!best || h.distanceMm < bestD)) {
				const seg = h.target.kind === 'point' ? (h.target.segmentIndex ?? -1) : -1;
				best = { kind, world: vecAdd(h.point, pp.offset), pieceKey: pp.key, local: h.point, segmentIndex: seg, t: kind === 'midpoint' ? 0.5 : 0 };
				bestD = h.distanceMm;
			}
		}
		return best;
	};
	const found = (!opts.outlineOnly && onPiece('apex', (c) => c.apexes)) || onPiece('point', (c) => c.ends) || onPiece('midpoint', (c) => c.mids);
	if (found) return found;
	let edge: Snap | null = null;
	let edgeD = opts.onlyPiece ? Infinity : tolMm;
	for (const pp of around) {
		const h = snapToEdges(vecSub(world, pp.offset), [{ chain: pp.piece.outline, id: pp.key }], edgeD);
		if (h && h.target.kind === 'edge' && (!edge || h.distanceMm < edgeD)) {
			edge = { kind: 'edge', world: vecAdd(h.point, pp.offset), pieceKey: pp.key, local: h.point, segmentIndex: h.target.segmentIndex, t: h.target.t };
			edgeD = h.distanceMm;
		}
	}
	if (edge) return edge;
	const free = (kind: SnapKind, at: Vec): Snap => ({ kind, world: at, pieceKey: null, local: null, segmentIndex: -1, t: 0 });
	const angle = opts.angleFrom ? snapToAngle(world, { anchor: opts.angleFrom, stepRad: SNAP_ANGLE_STEP_RAD }, tolMm) : null;
	if (angle) return free('angle', angle.point);
	const grid = opts.grid && places.gridMm > 0 ? snapToGrid(world, { spacingMm: places.gridMm, origin: { x: 0, y: 0 } }, tolMm) : null;
	if (grid) return free('grid', grid.point);
	return free('free', world);
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
