import { CLOSURE_TOLERANCE_MM, MIN_SEGMENT_LENGTH_MM, outlineClosureProblems, outlineShortSegmentProblems, type Outline, type Vec } from '../kernel';
import { resultProblems } from '../operation-result';
import { pieceStructureProblems } from '../piece';
import { chainSelfIntersection } from './chain-self-intersection';
import { segmentsTouch } from './segment-touch';
import type { Piece } from '../piece-schema';

/**
 * The finished-piece check used by the panel operations. Outlines with curves, or with few segments,
 * go through the kernel's outlineProblems (via ../operation-result resultProblems). Large all-straight
 * outlines (digitised or flattened pieces, hundreds to tens of thousands of vertices) are checked the
 * same way — closure, segment length, self-intersection, piece structure — but the self-intersection
 * search follows monotone chains (or a uniform grid for outlines with many chains) instead of the kernel's
 * sweep, so it stays linear in the vertex count.
 * Touching at an apex is allowed, as in resultProblems.
 */

const GRID_FROM_SEGMENTS = 400;

export function panelPieceProblems(piece: Piece, options: { selfIntersection?: boolean } = {}): string[] {
	if (options.selfIntersection === false) return [...closureAndLengthProblems(piece.outline), ...pieceStructureProblems(piece)];
	const cached = fullCheckCache.get(piece);
	if (cached) return cached;
	const problems = fullProblems(piece);
	fullCheckCache.set(piece, problems);
	return problems;
}

/**
 * Pieces are immutable data: the full check of one piece object is kept (weakly) and reused, e.g. while
 * a style line is dragged across unchanged panels.
 */
const fullCheckCache = new WeakMap<Piece, string[]>();

function fullProblems(piece: Piece): string[] {
	const segs = piece.outline.segments;
	const xy = segs.length < GRID_FROM_SEGMENTS ? null : straightCoords(piece.outline);
	if (!xy) return resultProblems(piece);
	const apexes = piece.apexes.map((a) => a.point);
	const crossing = straightSelfIntersection(piece.outline, xy).filter((p) => !apexes.some((a) => Math.hypot(a.x - p.x, a.y - p.y) < 1e-3));
	return [
		...closureAndLengthProblems(piece.outline, xy),
		...crossing.slice(0, 1).map((p) => `The outline crosses itself at (${p.x.toFixed(1)}, ${p.y.toFixed(1)}) mm.`),
		...structureProblems(piece)
	];
}

/**
 * The ends of every segment of an all-straight outline, read once into one array (x0, y0, x1, y1 per
 * segment) so that the checks below run over numbers rather than objects; null if any segment is a curve.
 */
export function straightCoords(outline: Outline): Float64Array | null {
	const segs = outline.segments;
	const xy = new Float64Array(4 * segs.length);
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		if (s.kind !== 'line') return null;
		xy[4 * i] = s.p0.x;
		xy[4 * i + 1] = s.p0.y;
		xy[4 * i + 2] = s.p1.x;
		xy[4 * i + 3] = s.p1.y;
	}
	return xy;
}

/**
 * The kernel's closure and segment-length problems. A straight outline is first measured in one lean
 * pass (squared gaps and lengths); only when that finds something do the kernel checks run, for their
 * messages.
 */
function closureAndLengthProblems(outline: Outline, xy: Float64Array | null = straightCoords(outline)): string[] {
	if (xy && straightClean(xy)) return [];
	return [...outlineClosureProblems(outline).map((p) => p.message), ...outlineShortSegmentProblems(outline).map((p) => p.message)];
}

function straightClean(xy: Float64Array): boolean {
	const n = xy.length / 4;
	const gap2 = CLOSURE_TOLERANCE_MM * CLOSURE_TOLERANCE_MM;
	const min2 = MIN_SEGMENT_LENGTH_MM * MIN_SEGMENT_LENGTH_MM;
	for (let i = 0; i < n; i++) {
		const k = 4 * i;
		const next = i + 1 === n ? 0 : k + 4;
		const gx = xy[k + 2] - xy[next];
		const gy = xy[k + 3] - xy[next + 1];
		// written so that NaN fails
		if (!(gx * gx + gy * gy <= gap2)) return false;
		const lx = xy[k + 2] - xy[k];
		const ly = xy[k + 3] - xy[k + 1];
		if (!(lx * lx + ly * ly >= min2)) return false;
	}
	return true;
}

/** pieceStructureProblems, skipped when there is nothing it could find beyond closure (checked apart). */
function structureProblems(piece: Piece): string[] {
	if (piece.darts.length || piece.pleats.length) return pieceStructureProblems(piece);
	const ids = new Set<string>();
	const out: string[] = [];
	for (const a of piece.apexes) {
		if (ids.has(a.id)) out.push(`apex id "${a.id}" is used twice`);
		ids.add(a.id);
	}
	return out;
}

/** Points where a closed all-straight outline crosses or touches itself: by monotone chains, or on a grid when the outline has too many chains. */
export function straightSelfIntersection(outline: Outline, xy: Float64Array | null = straightCoords(outline)): Vec[] {
	if (!xy) throw new Error('straightSelfIntersection takes all-straight outlines');
	return [...neighbourFoldBacks(xy), ...(chainSelfIntersection(xy) ?? gridSelfIntersection(outline))];
}

/** Vertices where a segment turns straight back along the one before it (a zero-width spike): the two overlap. */
export function neighbourFoldBacks(xy: Float64Array): Vec[] {
	const n = xy.length / 4;
	const out: Vec[] = [];
	if (n < 3) return out;
	for (let i = 0; i < n; i++) {
		const k = 4 * i;
		const m = i + 1 === n ? 0 : k + 4;
		const rx = xy[k + 2] - xy[k];
		const ry = xy[k + 3] - xy[k + 1];
		const sx = xy[m + 2] - xy[m];
		const sy = xy[m + 3] - xy[m + 1];
		if (rx * sx + ry * sy < 0 && Math.abs(rx * sy - ry * sx) <= 1e-12 * Math.hypot(rx, ry) * Math.hypot(sx, sy)) out.push({ x: xy[k + 2], y: xy[k + 3] });
	}
	return out;
}

/** Points where a closed all-straight outline crosses or touches itself (non-neighbouring segments). */
export function gridSelfIntersection(outline: Outline): Vec[] {
	const segs = outline.segments as readonly { p0: Vec; p1: Vec }[];
	const n = segs.length;
	let minX = Infinity;
	let minY = Infinity;
	let maxX = -Infinity;
	let maxY = -Infinity;
	let total = 0;
	for (const s of segs) {
		minX = Math.min(minX, s.p0.x, s.p1.x);
		maxX = Math.max(maxX, s.p0.x, s.p1.x);
		minY = Math.min(minY, s.p0.y, s.p1.y);
		maxY = Math.max(maxY, s.p0.y, s.p1.y);
		total += Math.hypot(s.p1.x - s.p0.x, s.p1.y - s.p0.y);
	}
	const cell = Math.max((2 * total) / n, 1e-6);
	const nx = Math.max(1, Math.ceil((maxX - minX) / cell) + 3);
	const eps = 1e-9;
	// (cell key, segment) pairs, grouped by cell with a radix sort (11 bits a pass): runs of equal keys
	// are the cells
	let keys = new Float64Array(Math.max(16, 4 * n));
	let vals = new Uint32Array(keys.length);
	let m = 0;
	const push = (key: number, i: number) => {
		if (m === keys.length) {
			const k2 = new Float64Array(keys.length * 2);
			k2.set(keys);
			keys = k2;
			const v2 = new Uint32Array(vals.length * 2);
			v2.set(vals);
			vals = v2;
		}
		keys[m] = key;
		vals[m++] = i;
	};
	for (let i = 0; i < n; i++) {
		const s = segs[i];
		// long segments are walked in cell-sized pieces so only the cells along them are visited
		const len = Math.hypot(s.p1.x - s.p0.x, s.p1.y - s.p0.y);
		const k = Math.max(1, Math.ceil(len / cell));
		let last = -1;
		for (let q = 0; q < k; q++) {
			const ax = s.p0.x + ((s.p1.x - s.p0.x) * q) / k;
			const ay = s.p0.y + ((s.p1.y - s.p0.y) * q) / k;
			const bx = s.p0.x + ((s.p1.x - s.p0.x) * (q + 1)) / k;
			const by = s.p0.y + ((s.p1.y - s.p0.y) * (q + 1)) / k;
			const x0 = Math.floor((Math.min(ax, bx) - minX - eps) / cell) + 1;
			const x1 = Math.floor((Math.max(ax, bx) - minX + eps) / cell) + 1;
			const y0 = Math.floor((Math.min(ay, by) - minY - eps) / cell) + 1;
			const y1 = Math.floor((Math.max(ay, by) - minY + eps) / cell) + 1;
			for (let gx = x0; gx <= x1; gx++) {
				for (let gy = y0; gy <= y1; gy++) {
					const key = gy * nx + gx;
					if (key !== last) push(key, i);
					last = key;
				}
			}
		}
	}
	const order = radixOrder(keys, m);
	const out: Vec[] = [];
	const seen = new Set<number>();
	let start = 0;
	while (start < m) {
		const key = keys[order[start]];
		let end = start + 1;
		while (end < m && keys[order[end]] === key) end++;
		for (let a = start; a < end; a++) {
			const ia = vals[order[a]];
			for (let b = a + 1; b < end; b++) {
				const ib = vals[order[b]];
				const i = Math.min(ia, ib);
				const j = Math.max(ia, ib);
				if (i === j || j - i === 1 || (i === 0 && j === n - 1)) continue;
				const p = segmentsTouch(segs[i].p0, segs[i].p1, segs[j].p0, segs[j].p1);
				if (!p) continue;
				const pk = i * n + j;
				if (seen.has(pk)) continue;
				seen.add(pk);
				out.push(p);
			}
		}
		start = end;
	}
	return out;
}

/** Indices 0..m−1 ordered by their (non-negative integer) key: stable LSD radix sort, 11 bits a pass. */
function radixOrder(keys: Float64Array, m: number): Uint32Array {
	let maxKey = 0;
	for (let i = 0; i < m; i++) if (keys[i] > maxKey) maxKey = keys[i];
	let idx = new Uint32Array(m);
	let tmp = new Uint32Array(m);
	for (let i = 0; i < m; i++) idx[i] = i;
	const count = new Uint32Array(2048);
	for (let div = 1; div <= maxKey; div *= 2048) {
		count.fill(0);
		for (let i = 0; i < m; i++) count[Math.floor(keys[idx[i]] / div) % 2048]++;
		let sum = 0;
		for (let b = 0; b < 2048; b++) {
			const c = count[b];
			count[b] = sum;
			sum += c;
		}
		for (let i = 0; i < m; i++) {
			const v = idx[i];
			tmp[count[Math.floor(keys[v] / div) % 2048]++] = v;
		}
		[idx, tmp] = [tmp, idx];
	}
	return idx;
}
