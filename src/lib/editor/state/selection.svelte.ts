import type { Vec } from '$lib/geometry';
import type { Hit, Snap } from '../hit';

/** A part of the selected piece the moves apply to: a dart, an apex, or a stored seam pair. */
export interface SelectedPart {
	readonly dartId?: string;
	readonly apexId?: string;
	readonly seamPairId?: string;
}

/**
 * What is selected on the table — a piece, one of its edges or points, a dart, an apex, a seam pair, or
 * several panels — and what the pointer is over. `fix` keeps the selection on a piece still shown.
 */
export class Selection {
	pieceKey = $state<string | null>(null);
	segmentIndex = $state(-1);
	point = $state<Vec | null>(null);
	dartId = $state<string | null>(null);
	apexId = $state<string | null>(null);
	seamPairId = $state<string | null>(null);
	/** Panels picked together (Shift+click): join two, carry a row. */
	panels = $state<string[]>([]);
	hover = $state.raw<Hit | null>(null);
	/** The piece was picked by the user (a click, the list), not by opening the style: its moves show beside it. */
	boxed = $state(false);
	snapShown = $state.raw<Snap | null>(null);

	private clearParts() {
		this.segmentIndex = -1;
		this.point = null;
		this.dartId = null;
		this.apexId = null;
		this.seamPairId = null;
	}
	/** A piece as a whole. */
	piece(key: string | null) {
		this.pieceKey = key;
		this.boxed = key !== null;
		this.clearParts();
		this.panels = [];
	}
	/** What a click hit: its piece, and the edge or point when it was one. */
	hit(h: Hit | null) {
		this.clearParts();
		this.panels = [];
		if (!h) return;
		this.pieceKey = h.pieceKey;
		this.boxed = true;
		this.segmentIndex = h.kind === 'edge' || h.kind === 'point' ? h.segmentIndex : -1;
		this.point = h.kind === 'point' || h.kind === 'apex' ? h.local : null;
	}
	/** A dart, an apex or a seam pair of a piece (the piece stays selected). */
	part(key: string, part: SelectedPart) {
		if (key !== this.pieceKey) this.piece(key);
		this.dartId = part.dartId ?? null;
		this.apexId = part.apexId ?? null;
		this.seamPairId = part.seamPairId ?? null;
	}
	/** Shift+click: a panel added to (or taken from) the panels picked together. */
	togglePanel(key: string) {
		const start = this.panels.length ? this.panels : this.pieceKey && this.pieceKey !== key ? [this.pieceKey] : [];
		this.panels = start.includes(key) ? start.filter((k) => k !== key) : [...start, key];
		this.pieceKey = key;
		this.clearParts();
	}
	/** Only the piece stays selected. */
	clearPart() {
		this.clearParts();
		this.panels = [];
	}
	fix(shown: readonly { key: string }[]) {
		if (!shown.some((p) => p.key === this.pieceKey)) this.piece(shown[0]?.key ?? null);
		this.panels = this.panels.filter((k) => shown.some((p) => p.key === k));
	}
	/** A piece's key changed (a new piece stored for the first time). */
	rekey(oldKey: string, key: string) {
		if (this.pieceKey === oldKey) this.pieceKey = key;
		this.panels = this.panels.map((k) => (k === oldKey ? key : k));
	}
}
