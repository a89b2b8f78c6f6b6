import { vecDistance, type Vec } from '$lib/geometry';
import { anchorResolve } from '$lib/pattern/anchors/anchor';
import { anchorInferAmong } from '$lib/pattern/anchors/anchor-infer';
import { anchoredPoint, anchorOffsetFrom, type AnchoredPoint } from '$lib/pattern/anchors/anchor-pick';
import type { Piece } from '$lib/pattern/piece-schema';
import { bodyOf } from '../anchor-body';
import type { MoveContext } from './context';

/**
 * Points a move takes from a click or a snap, stored with their anchor (what they are on the piece:
 * a landmark, a place along a named seam, an offset from a landmark) so that a size run finds them
 * again on every size. The reading is the pure `anchorPick`; the hits and snaps have already put a
 * click on an apex or outline point exactly there, so a landmark is taken only where the point is.
 */

/** A point picked on a piece of the table, with its anchor: along a seam by fraction (grades with it) or by distance from the nearer end. */
export function pickedPoint(ctx: MoveContext, key: string | null, local: Vec, edgeBy: 'fraction' | 'distance' = 'fraction'): AnchoredPoint {
	const piece = ctx.piece(key)?.geometry;
	return piece ? anchoredPoint(bodyOf(piece), local, { edgeBy }) : { x: local.x, y: local.y };
}

/** A point on a given piece with its anchor (one it carries already is kept). */
export function anchoredOn(piece: Piece, p: AnchoredPoint, edgeBy: 'fraction' | 'distance' = 'fraction'): AnchoredPoint {
	return p.anchor ? p : anchoredPoint(bodyOf(piece), p, { edgeBy });
}

/** A reshape's move: the point taken by its anchor, where it goes as an offset from that anchor. */
export function anchoredMove(piece: Piece, m: { from: Vec; to: Vec }): { from: AnchoredPoint; to: AnchoredPoint } {
	const body = bodyOf(piece);
	const from = anchoredPoint(body, m.from);
	const a = from.anchor;
	const off = a && a.kind !== 'offset' ? anchorOffsetFrom(body, a, m.to) : null;
	return { from, to: off ? { x: off.point.x, y: off.point.y, anchor: off.anchor } : anchoredPoint(body, m.to) };
}

/**
 * A point of a step spanning pieces (a carry's style line) with its anchor among the sources, in their
 * order (the anchor names its source): read by the rules a size run reads a point without one, kept only
 * where it gives the point again, and the point left as it is (the pieces made from it do not move).
 */
export function anchoredAmong(pieces: readonly Piece[], p: Vec): AnchoredPoint {
	const bodies = pieces.map(bodyOf);
	const a = anchorInferAmong(bodies, p, bodies.map((_, k) => k));
	const body = a ? bodies[(a.kind === 'offset' ? a.of.piece : a.piece) ?? 0] : undefined;
	const r = a && body ? anchorResolve(body, a) : null;
	return a && r?.ok && vecDistance(r.point, p) < 1e-6 ? { x: p.x, y: p.y, anchor: a } : { x: p.x, y: p.y };
}
