import type { Vec } from '$lib/geometry';
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
