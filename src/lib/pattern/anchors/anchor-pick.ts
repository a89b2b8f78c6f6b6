import { vecDistance, vecSub, type Vec } from '../kernel';
import { seamLocate, type SeamEnd } from '../piece-seams';
import { anchorResolve, type Anchor, type AnchorBody, type EdgeAnchor, type LandmarkAnchor } from './anchor';
import { EDGE_SNAP_MM } from './anchor-infer';
import { landmarkAt, type Landmark } from './landmarks';

/**
 * The anchor of a point a person picked (a click or a snap in the editor), on the piece as it is before
 * the step. The rules, in order:
 *  1. within `landmarkTolMm` of a landmark (an apex, a corner) → that landmark, and the point becomes the
 *     landmark's own point (the click snapped to it);
 *  2. on the stitching line (within `edgeTolMm`) of a named seam → that seam, by fraction of its sewn
 *     length (`edgeBy: 'fraction'`, the place grades with the seam) or by distance from its nearer end
 *     (`edgeBy: 'distance'`, the place keeps its distance on every size);
 *  3. anywhere else → an offset across and down from the nearest landmark (apexes and corners before the
 *     numbered points along a seam).
 * The point returned is where the anchor resolves on the same piece, so what a step stores and what its
 * anchor says are the same point (the server checks this on saving). Pure.
 */

export interface AnchorPickOptions {
	/** How near a landmark a pick snaps to it (mm); the editor passes a few screen pixels. */
	readonly landmarkTolMm?: number;
	/** How near the stitching line a pick is on it (mm). */
	readonly edgeTolMm?: number;
	readonly edgeBy?: 'fraction' | 'distance';
}

export interface AnchorPick {
	readonly point: Vec;
	readonly anchor: Anchor;
}

/** A point as a step stores it with its anchor beside it. */
export type AnchoredPoint = Vec & { readonly anchor?: Anchor };

function nearestLandmark(landmarks: readonly Landmark[], p: Vec): Landmark | null {
	const named = landmarks.filter((l) => l.kind !== 'point');
	const pool = named.length ? named : landmarks;
	let best: Landmark | null = null;
	for (const l of pool) if (best === null || vecDistance(l.point, p) < vecDistance(best.point, p)) best = l;
	return best;
}

/** A place along a seam as an edge anchor, by fraction from its start or by distance from the nearer end. */
export function edgeAnchorAt(body: AnchorBody, p: Vec, edgeBy: 'fraction' | 'distance', tolMm: number = EDGE_SNAP_MM): EdgeAnchor | null {
	const loc = seamLocate(body.piece, body.seams, p, tolMm);
	if (!loc) return null;
	const seam = body.seams[loc.seamIndex];
	const along = Math.min(seam.lengthMm, Math.max(0, loc.fromStartMm));
	if (edgeBy === 'fraction') return { kind: 'edge', edge: seam.name, from: 'start', fraction: seam.lengthMm > 0 ? along / seam.lengthMm : 0 };
	const fromEnd = seam.lengthMm - along;
	const from: SeamEnd = along <= fromEnd ? 'start' : 'end';
	return { kind: 'edge', edge: seam.name, from, distanceMm: from === 'start' ? along : fromEnd };
}

/** An offset anchor from another anchor's point on the body to `p` (null when that anchor is not found). */
export function anchorOffsetFrom(body: AnchorBody, of: LandmarkAnchor | EdgeAnchor, p: Vec): AnchorPick | null {
	const r = anchorResolve(body, of);
	if (!r.ok) return null;
	const d = vecSub(p, r.point);
	const anchor: Anchor = { kind: 'offset', of, dxMm: d.x, dyMm: d.y };
	const back = anchorResolve(body, anchor);
	return back.ok ? { anchor, point: back.point } : null;
}

/** The anchor of a picked point (rules above); null only on a piece with no landmark and no seam. */
export function anchorPick(body: AnchorBody, p: Vec, options: AnchorPickOptions = {}): AnchorPick | null {
	const l = landmarkAt(body.landmarks, p, options.landmarkTolMm ?? 0.01);
	if (l) return { anchor: { kind: 'landmark', name: l.name }, point: l.point };
	const edge = edgeAnchorAt(body, p, options.edgeBy ?? 'fraction', options.edgeTolMm ?? EDGE_SNAP_MM);
	if (edge) {
		const r = anchorResolve(body, edge);
		if (r.ok) return { anchor: edge, point: r.point };
	}
	const near = nearestLandmark(body.landmarks, p);
	return near ? anchorOffsetFrom(body, { kind: 'landmark', name: near.name }, p) : null;
}

/** The picked point as a step stores it: its coordinates where the anchor resolves, the anchor beside them. */
export function anchoredPoint(body: AnchorBody, p: Vec, options: AnchorPickOptions = {}): AnchoredPoint {
	const pick = anchorPick(body, p, options);
	return pick ? { x: pick.point.x, y: pick.point.y, anchor: pick.anchor } : { x: p.x, y: p.y };
}
