import { outlineClosureProblems, outlineShortSegmentProblems, type Outline, type Vec } from '../kernel';
import { resultProblems } from '../operation-result';
import { pieceStructureProblems } from '../piece';
import type { Piece } from '../piece-schema';

/**
 * The finished-piece check used by the panel operations. Outlines with curves, or with few segments,
 * go through the kernel's outlineProblems (via ../operation-result resultProblems). Large all-straight
 * outlines (digitised or flattened pieces, hundreds to tens of thousands of vertices) are checked the
 * same way — closure, segment length, self-intersection, piece structure — but the self-intersection
 * search uses a uniform grid instead of the kernel's sweep, so it stays linear in the vertex count.
 * Touching at an apex is allowed, as in resultProblems.
 */

const GRID_FROM_SEGMENTS = 400;

export function panelPieceProblems(piece: Piece, options: { selfIntersection?: boolean } = {}): string[] {
	const segs = piece.outline.segments;
	if (options.selfIntersection === false) {
		return [
			...outlineClosureProblems(piece.outline).map((p) => p.message),
			...outlineShortSegmentProblems(piece.outline).map((p) => p.message),
			...pieceStructureProblems(piece)
		];
	}
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
	if (segs.length < GRID_FROM_SEGMENTS || segs.some((s) => s.kind !== 'line')) return resultProblems(piece);
	const apexes = piece.apexes.map((a) => a.point);
	const crossing = gridSelfIntersection(piece.outline).filter((p) => !apexes.some((a) => Math.hypot(a.x - p.x, a.y - p.y) < 1e-3));
	return [
		...outlineClosureProblems(piece.outline).map((p) => p.message),
		...outlineShortSegmentProblems(piece.outline).map((p) => p.message),
		...crossing.slice(0, 1).map((p) => `The outline crosses itself at (${p.x.toFixed(1)}, ${p.y.toFixed(1)}) mm.`),
		...structureProblems(piece)
	];
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

function segmentsTouch(a: Vec, b: Vec, c: Vec, d: Vec): Vec | null {
	// bounding-box rejection first: most pairs sharing a grid cell are merely close
	if (Math.max(a.x, b.x) < Math.min(c.x, d.x) - 1e-9 || Math.max(c.x, d.x) < Math.min(a.x, b.x) - 1e-9) return null;
	if (Math.max(a.y, b.y) < Math.min(c.y, d.y) - 1e-9 || Math.max(c.y, d.y) < Math.min(a.y, b.y) - 1e-9) return null;
	const rx = b.x - a.x;
	const ry = b.y - a.y;
	const sx = d.x - c.x;
	const sy = d.y - c.y;
	const den = rx * sy - ry * sx;
	const qx = c.x - a.x;
	const qy = c.y - a.y;
	const rl = Math.hypot(rx, ry);
	if (Math.abs(den) <= 1e-12 * rl * Math.hypot(sx, sy)) {
		// parallel: touching only if collinear and overlapping
		if (Math.abs(qx * ry - qy * rx) > 1e-9 * rl) return null;
		const rr = rx * rx + ry * ry;
		const t0 = (qx * rx + qy * ry) / rr;
		const t1 = t0 + (sx * rx + sy * ry) / rr;
		const lo = Math.max(0, Math.min(t0, t1));
		const hi = Math.min(1, Math.max(t0, t1));
		return lo <= hi ? { x: a.x + lo * rx, y: a.y + lo * ry } : null;
	}
	const t = (qx * sy - qy * sx) / den;
	const u = (qx * ry - qy * rx) / den;
	const e = 1e-12;
	if (t < -e || t > 1 + e || u < -e || u > 1 + e) return null;
	return { x: a.x + t * rx, y: a.y + t * ry };
}
