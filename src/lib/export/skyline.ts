import type { PackItem, Packed } from './pack';

/**
 * Skyline packing of rectangles on a strip (bottom-left rule, y down): the items, tallest (or widest, or
 * largest) first, each go
 * where their top edge lies highest on the sheet (ties: furthest left), resting on the skyline of what is
 * placed. Pieces are never turned: grainlines keep their direction on the paper. Pure; millimetres.
 */
export type PackOrder = 'height' | 'width' | 'area';

type Span = { x: number; w: number; y: number };

/**
 * The skyline with the spans under [x, x + w) replaced by one span at height top (parts of spans
 * sticking out either side kept), in order of x; with `merge`, neighbours at the same height become one
 * span (the page-counting packing keeps them apart: their edges are places it tries).
 */
function skylineRaised(sky: readonly Span[], x: number, w: number, top: number, merge = true): Span[] {
	const next: Span[] = [];
	for (const s of sky) {
		const end = s.x + s.w;
		if (end <= x || s.x >= x + w) next.push(s);
		else {
			if (s.x < x) next.push({ x: s.x, w: x - s.x, y: s.y });
			if (end > x + w) next.push({ x: x + w, w: end - (x + w), y: s.y });
		}
	}
	next.push({ x, w, y: top });
	next.sort((a, b) => a.x - b.x);
	if (!merge) return next;
	return next.reduce<Span[]>((acc, s) => {
		const last = acc[acc.length - 1];
		if (last && Math.abs(last.y - s.y) < 1e-9 && Math.abs(last.x + last.w - s.x) < 1e-9) last.w += s.w;
		else acc.push({ ...s });
		return acc;
	}, []);
}

const KEY: Record<PackOrder, (i: PackItem) => number> = {
	height: (i) => i.heightMm,
	width: (i) => i.widthMm,
	area: (i) => i.widthMm * i.heightMm
};

export function skylinePack(items: readonly PackItem[], stripWidthMm: number, gapMm: number, by: PackOrder = 'height'): Packed {
	const key = KEY[by];
	const order = items.map((_, i) => i).sort((a, b) => key(items[b]) - key(items[a]) || items[b].heightMm - items[a].heightMm || a - b);
	// the skyline: spans [x, x + w) whose lowest free y is y (gap included)
	let sky: Span[] = [{ x: 0, w: Math.max(stripWidthMm, ...items.map((i) => i.widthMm)) + gapMm, y: 0 }];
	const at: { x: number; y: number }[] = items.map(() => ({ x: 0, y: 0 }));
	let widthMm = 0;
	let heightMm = 0;
	for (const i of order) {
		const w = items[i].widthMm + gapMm;
		let best: { x: number; y: number } | null = null;
		for (let s = 0; s < sky.length; s++) {
			const x = sky[s].x;
			if (x + w > stripWidthMm + gapMm + 1e-9 && x > 0) break;
			let y = 0;
			for (let t = s; t < sky.length && sky[t].x < x + w - 1e-9; t++) y = Math.max(y, sky[t].y);
			if (!best || y < best.y - 1e-9) best = { x, y };
		}
		const p = best ?? { x: 0, y: Math.max(...sky.map((s) => s.y)) };
		at[i] = p;
		widthMm = Math.max(widthMm, p.x + items[i].widthMm);
		heightMm = Math.max(heightMm, p.y + items[i].heightMm);
		// raise the skyline under the item
		sky = skylineRaised(sky, p.x, w, p.y + items[i].heightMm + gapMm);
	}
	return { at, widthMm, heightMm };
}

/** The page grid a tiled sheet is cut into: page regions start every stepX, stepY and are pageW × pageH. */
export interface PageGrid {
	readonly stepXMm: number;
	readonly stepYMm: number;
	readonly pageWidthMm: number;
	readonly pageHeightMm: number;
}

/**
 * Skyline packing that counts pages: each item (largest first) goes where it brings the fewest pages
 * into use that no earlier item uses, then where its top edge is highest, then furthest left. Positions
 * tried: the skyline's steps and the page columns' left and right edges. Pure; millimetres, y down.
 */
export function pageAwarePack(items: readonly PackItem[], stripWidthMm: number, gapMm: number, grid: PageGrid): Packed {
	const order = items.map((_, i) => i).sort((a, b) => items[b].widthMm * items[b].heightMm - items[a].widthMm * items[a].heightMm || a - b);
	const used = new Set<string>();
	const pagesOf = (x: number, y: number, w: number, h: number) => {
		const out: string[] = [];
		const c0 = Math.max(0, Math.floor((x - grid.pageWidthMm) / grid.stepXMm) + 1);
		const r0 = Math.max(0, Math.floor((y - grid.pageHeightMm) / grid.stepYMm) + 1);
		for (let c = c0; c * grid.stepXMm < x + w; c++) for (let r = r0; r * grid.stepYMm < y + h; r++) out.push(`${r},${c}`);
		return out;
	};
	let sky: Span[] = [{ x: 0, w: Math.max(stripWidthMm, ...items.map((i) => i.widthMm)) + gapMm, y: 0 }];
	const at: { x: number; y: number }[] = items.map(() => ({ x: 0, y: 0 }));
	let widthMm = 0;
	let heightMm = 0;
	const skyY = (x: number, w: number) => {
		let y = 0;
		for (const s of sky) if (s.x < x + w - 1e-9 && s.x + s.w > x + 1e-9) y = Math.max(y, s.y);
		return y;
	};
	for (const i of order) {
		const { widthMm: iw, heightMm: ih } = items[i];
		const xs = new Set<number>(sky.map((s) => s.x));
		for (let c = 0; c * grid.stepXMm < stripWidthMm; c++) {
			xs.add(c * grid.stepXMm);
			xs.add(c * grid.stepXMm + grid.pageWidthMm - iw);
		}
		let best: { x: number; y: number; fresh: number } | null = null;
		for (const x of xs) {
			if (x < 0 || (x + iw > stripWidthMm + 1e-9 && x > 0)) continue;
			const y = skyY(x, iw + gapMm);
			const fresh = pagesOf(x, y, iw, ih).filter((p) => !used.has(p)).length;
			if (!best || fresh < best.fresh || (fresh === best.fresh && (y + ih < best.y + ih - 1e-9 || (Math.abs(y - best.y) < 1e-9 && x < best.x)))) best = { x, y, fresh };
		}
		const p = best ?? { x: 0, y: skyY(0, iw + gapMm), fresh: 0 };
		at[i] = { x: p.x, y: p.y };
		for (const pg of pagesOf(p.x, p.y, iw, ih)) used.add(pg);
		widthMm = Math.max(widthMm, p.x + iw);
		heightMm = Math.max(heightMm, p.y + ih);
		sky = skylineRaised(sky, p.x, iw + gapMm, p.y + ih + gapMm, false);
	}
	return { at, widthMm, heightMm };
}
