import type { Vec } from '$lib/geometry';
import type { Hit, Snap } from '../hit';

/**
 * What is selected on the table (a piece, one of its edges or points) and what the pointer is over.
 * `fix` keeps the selection on a piece that is still shown (after undo, a separate, a join).
 */
export class Selection {
	pieceKey = $state<string | null>(null);
	segmentIndex = $state(-1);
	point = $state<Vec | null>(null);
	hover = $state.raw<Hit | null>(null);
	snapShown = $state.raw<Snap | null>(null);

	/** A piece as a whole. */
	piece(key: string | null) {
		this.pieceKey = key;
		this.segmentIndex = -1;
		this.point = null;
	}
	/** What a click hit: its piece, and the edge or point when it was one. */
	hit(h: Hit | null) {
		if (!h) {
			this.segmentIndex = -1;
			this.point = null;
			return;
		}
		this.pieceKey = h.pieceKey;
		this.segmentIndex = h.kind === 'edge' || h.kind === 'point' ? h.segmentIndex : -1;
		this.point = h.kind === 'point' || h.kind === 'apex' ? h.local : null;
	}
	/** Only the piece stays selected. */
	clearPart() {
		this.segmentIndex = -1;
		this.point = null;
	}
	fix(shown: readonly { key: string }[]) {
		if (!shown.some((p) => p.key === this.pieceKey)) this.piece(shown[0]?.key ?? null);
	}
	/** A piece's key changed (a new piece stored for the first time). */
	rekey(oldKey: string, key: string) {
		if (this.pieceKey === oldKey) this.pieceKey = key;
	}
}
