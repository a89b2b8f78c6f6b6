import { anchorBody, type AnchorBody } from '$lib/pattern/anchors/anchor';
import type { Piece } from '$lib/pattern/piece-schema';

const bodies = new WeakMap<Piece, AnchorBody>();

/** The anchor body of a piece value (its landmarks and named seams), made once: pieces are immutable. */
export function bodyOf(piece: Piece): AnchorBody {
	let b = bodies.get(piece);
	if (!b) bodies.set(piece, (b = anchorBody(piece)));
	return b;
}
