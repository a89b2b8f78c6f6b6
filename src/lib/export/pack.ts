/**
 * Shelf packing of rectangles (piece extents) on a strip of paper: items in order of height, left to
 * right on a shelf, a new shelf below when the next one does not fit. Pieces are never turned (their
 * grainlines keep their direction on the paper). Pure; millimetres, y down.
 */
export interface PackItem {
	readonly widthMm: number;
	readonly heightMm: number;
}

export interface Packed {
	/** Top-left corner of each item, in the order given. */
	readonly at: readonly { readonly x: number; readonly y: number }[];
	readonly widthMm: number;
	readonly heightMm: number;
}

export function shelfPack(items: readonly PackItem[], stripWidthMm: number, gapMm: number, firstStaysFirst = false): Packed {
	const order = items.map((_, i) => i).sort((a, b) => (firstStaysFirst ? Number(b === 0) - Number(a === 0) : 0) || items[b].heightMm - items[a].heightMm || a - b);
	const at: { x: number; y: number }[] = items.map(() => ({ x: 0, y: 0 }));
	let x = 0;
	let y = 0;
	let shelfHeight = 0;
	let widthMm = 0;
	for (const i of order) {
		const it = items[i];
		if (x > 0 && x + it.widthMm > stripWidthMm) {
			y += shelfHeight + gapMm;
			x = 0;
			shelfHeight = 0;
		}
		at[i] = { x, y };
		x += it.widthMm + gapMm;
		shelfHeight = Math.max(shelfHeight, it.heightMm);
		widthMm = Math.max(widthMm, x - gapMm);
	}
	return { at, widthMm, heightMm: items.length ? y + shelfHeight : 0 };
}

/** Do two placed rectangles overlap (touching is not overlapping)? */
export function rectsOverlap(
	a: { x: number; y: number; w: number; h: number },
	b: { x: number; y: number; w: number; h: number }
): boolean {
	return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}
