// The next version of a drafted front bodice block as a pattern cutter saves it again and again: its
// shoulder dart pivoted to the side seam, then back to the shoulder (trade-primer §1), on the head read.
import { pivot } from '../../src/lib/pattern/operations/pivot';
import type { Piece } from '../../src/lib/pattern/piece-schema';

/** Where the demo block's shoulder dart goes: the side seam, and back to the shoulder. */
export const SIDE_SEAM = { x: 235 - 10 / 3, y: 300 };
export const SHOULDER = { x: 117, y: 15.75 };

/** The body of POST …/pieces/{pieceId}/versions that moves the head's shoulder dart to the other place. */
export function pivotSaveBody(head: { id: string; geometry: Piece }) {
	const dart = head.geometry.darts.find((d) => d.id === 'shoulder-dart');
	if (!dart) throw new Error('the piece has no shoulder dart');
	const to = dart.leg1End.y < 100 ? SIDE_SEAM : SHOULDER;
	const r = pivot(head.geometry, { dartId: 'shoulder-dart', to });
	if (!r.ok) throw new Error(r.error.message);
	return {
		baseVersionId: head.id,
		message: `dart to the ${to === SIDE_SEAM ? 'side seam' : 'shoulder'}`,
		geometry: r.piece,
		recipe: [{ op: 'pivot', params: { dartId: 'shoulder-dart', to } }]
	};
}
