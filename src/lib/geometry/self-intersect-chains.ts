import { ScratchArrays } from './scratch';
import type { Segment } from './types';

/**
 * Candidate segment pairs for the self-crossing search of an outline or path, by monotone chains.
 *
 * Every segment is cut where its x or its y turns (a line is one piece; a cubic is cut at the roots
 * of x′ and y′, at most five pieces), so each piece is monotone in both coordinates and its box is the
 * box of its two ends. The pieces, in order, are grouped into chains along which one coordinate (the
 * "along" axis a: y or x, whichever gives fewer chains) never turns back. Two pieces of one chain lie
 * in successive ranges of a, so they can come close only where those ranges meet: the search walks
 * each chain once for that, and compares two chains only when their boxes meet, by walking both in
 * order of a (a merge). A pattern piece has a handful of chains, so the search is linear in the number
 * of segments. Outlines with very many chains (zigzags, deep scallops) answer null and are left to the
 * general search (a uniform grid, self-intersect.ts).
 *
 * A pair is a candidate when some piece of one comes within `2·reach` of some piece of the other
 * (boxes grown by `reach`), where `reach` is the farthest apart two segments can be and still be
 * reported as touching. The one pair left out on purpose: two consecutive pieces of one chain that
 * meet at the shared vertex of two neighbouring segments and go on the same way in both coordinates
 * (`skipJoins`). Each lies in the quarter-plane box on its side of the vertex, so whatever the two have
 * within `reach` of each other lies within `reach` of the vertex, where the caller ignores touching.
 */

const MAX_CHAINS = 1024;
/** The working arrays of the pieces and chains (see scratch.ts); pieces beyond the count are never read. */
const scratch = new ScratchArrays();
/** Give up (answer null) when the chain comparisons cost more than this many times the piece count. */
const WORK_PER_PIECE = 16;

interface Pieces {
	readonly count: number;
	readonly seg: Int32Array;
	readonly x0: Float64Array;
	readonly y0: Float64Array;
	readonly x1: Float64Array;
	readonly y1: Float64Array;
}

/**
 * The chains, as parallel arrays: chain c's pieces are order[from[c] … to[c] − 1], in increasing a; its
 * pieces' ranges (grown by the reach) span lo … hi along a and crossLo … crossHi across it.
 */
interface Chains {
	readonly from: Int32Array;
	readonly to: Int32Array;
	readonly lo: Float64Array;
	readonly hi: Float64Array;
	readonly crossLo: Float64Array;
	readonly crossHi: Float64Array;
}

/** Ranges of every piece along a and across it (c), grown by the reach: aLo, aHi, cLo, cHi at 4p … 4p + 3. */
type Ranges = Float64Array;

const near = (g: Ranges, p: number, q: number): boolean =>
	g[4 * q + 2] <= g[4 * p + 3] && g[4 * p + 2] <= g[4 * q + 3] && g[4 * q] <= g[4 * p + 1] && g[4 * p] <= g[4 * q + 1];

/** Collects candidate pairs as keys i·n + j (i < j); duplicates are removed at the end. */
class PairKeys {
	keys = new Float64Array(64);
	count = 0;
	constructor(readonly seg: Int32Array, readonly n: number) {}
	add(p: number, q: number): void {
		const a = this.seg[p];
		const b = this.seg[q];
		if (a === b) return;
		if (this.count === this.keys.length) {
			const k2 = new Float64Array(this.keys.length * 2);
			k2.set(this.keys);
			this.keys = k2;
		}
		this.keys[this.count++] = a < b ? a * this.n + b : b * this.n + a;
	}
	/** The pairs; `unique`: no pair can have been added twice (every segment is one piece). */
	pairs(unique: boolean): number[] {
		const k = unique ? this.keys.subarray(0, this.count) : this.keys.subarray(0, this.count).sort();
		const out: number[] = [];
		for (let t = 0; t < k.length; t++) {
			if (!unique && t > 0 && k[t] === k[t - 1]) continue;
			const i = Math.floor(k[t] / this.n);
			out.push(i, k[t] - i * this.n);
		}
		return out;
	}
}

/** Pieces monotone in x and in y, in outline order; null if a coordinate is not finite. */
function monotonePieces(segs: readonly Segment[]): Pieces | null {
	const turns = new Float64Array(4);
	let cap = 0;
	for (const s of segs) cap += s.kind === 'line' ? 1 : 1 + cubicTurns(s, turns);
	const seg = scratch.int32(0, cap);
	const x0 = scratch.float64(0, cap);
	const y0 = scratch.float64(1, cap);
	const x1 = scratch.float64(2, cap);
	const y1 = scratch.float64(3, cap);
	let m = 0;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		seg[m] = i;
		x0[m] = s.p0.x;
		y0[m] = s.p0.y;
		if (s.kind === 'line') {
			x1[m] = s.p1.x;
			y1[m++] = s.p1.y;
			continue;
		}
		const k = cubicTurns(s, turns);
		for (let q = 0; q < k; q++) {
			const t = turns[q];
			const mt = 1 - t;
			const b0 = mt * mt * mt, b1 = 3 * mt * mt * t, b2 = 3 * mt * t * t, b3 = t * t * t;
			const qx = b0 * s.p0.x + b1 * s.p1.x + b2 * s.p2.x + b3 * s.p3.x;
			const qy = b0 * s.p0.y + b1 * s.p1.y + b2 * s.p2.y + b3 * s.p3.y;
			x1[m] = qx;
			y1[m++] = qy;
			seg[m] = i;
			x0[m] = qx;
			y0[m] = qy;
		}
		x1[m] = s.p3.x;
		y1[m++] = s.p3.y;
	}
	for (let p = 0; p < m; p++) {
		// written so that NaN fails too
		if (!(Math.abs(x0[p]) + Math.abs(y0[p]) + Math.abs(x1[p]) + Math.abs(y1[p]) < Infinity)) return null;
	}
	return { count: m, seg, x0, y0, x1, y1 };
}

/**
 * Parameters in (0, 1) where x or y of a cubic turns (roots of the derivative), written in increasing
 * order into `out` without repeats; returns how many. A coordinate whose control values are monotone
 * cannot turn and is not solved.
 */
function cubicTurns(s: Segment & { kind: 'cubic' }, out: Float64Array): number {
	let k = axisTurns(s.p0.x, s.p1.x, s.p2.x, s.p3.x, out, 0);
	k = axisTurns(s.p0.y, s.p1.y, s.p2.y, s.p3.y, out, k);
	// sort (at most four) and drop repeats
	for (let a = 1; a < k; a++) {
		const v = out[a];
		let b = a - 1;
		while (b >= 0 && out[b] > v) {
			out[b + 1] = out[b];
			b--;
		}
		out[b + 1] = v;
	}
	let w = 0;
	for (let a = 0; a < k; a++) if (w === 0 || out[a] > out[w - 1]) out[w++] = out[a];
	return w;
}

/** Roots in (0, 1) of one coordinate's derivative (as the kernel's quadraticRoots), appended at out[k]. */
function axisTurns(a: number, b: number, c: number, d: number, out: Float64Array, k: number): number {
	const e0 = b - a, e1 = c - b, e2 = d - c;
	if ((e0 >= 0 && e1 >= 0 && e2 >= 0) || (e0 <= 0 && e1 <= 0 && e2 <= 0)) return k;
	const A = e0 - 2 * e1 + e2;
	const B = 2 * (e1 - e0);
	const C = e0;
	const scale = Math.max(Math.abs(A), Math.abs(B), Math.abs(C));
	let r1 = NaN;
	let r2 = NaN;
	if (Math.abs(A) <= 1e-12 * scale) {
		if (Math.abs(B) > 1e-14 * scale) r1 = -C / B;
	} else {
		const disc = B * B - 4 * A * C;
		if (disc < 0) {
			if (disc > -1e-14 * B * B) r1 = -B / (2 * A);
		} else {
			const sq = Math.sqrt(disc);
			const q = -0.5 * (B + (B >= 0 ? sq : -sq));
			r1 = q / A;
			r2 = q !== 0 ? C / q : r1;
		}
	}
	// NaN fails both comparisons
	if (r1 > 0 && r1 < 1) out[k++] = r1;
	if (r2 > 0 && r2 < 1) out[k++] = r2;
	return k;
}

const sign = (v: number): number => (v > 0 ? 1 : v < 0 ? -1 : 0);

/**
 * Where chains start (piece indices), along coordinate a (c across it). A piece flat in a does not
 * turn a chain, but a run of flat pieces must keep going the same way along c.
 */
function chainStarts(a0: Float64Array, a1: Float64Array, c0: Float64Array, c1: Float64Array, m: number): number[] {
	const starts = [0];
	let dir = 0;
	let lastFlatDir = 0;
	for (let p = 0; p < m; p++) {
		const sd = sign(a1[p] - a0[p]);
		if (sd === 0) {
			const od = sign(c1[p] - c0[p]);
			if (lastFlatDir !== 0 && od !== lastFlatDir && p > starts[starts.length - 1]) {
				starts.push(p);
				dir = 0;
			}
			lastFlatDir = od;
			continue;
		}
		lastFlatDir = 0;
		if (dir === 0) dir = sd;
		else if (sd !== dir) {
			starts.push(p);
			dir = sd;
		}
		if (starts.length > MAX_CHAINS) break;
	}
	return starts;
}

/**
 * Candidate pairs of segment indices [i0, j0, i1, j1, …] (i < j, each pair once) whose pieces come
 * within 2·reach of each other, or null when the outline has too many chains for this search.
 */
export function monotoneChainPairs(segs: readonly Segment[], reach: number, skipJoins: boolean): number[] | null {
	const pieces = monotonePieces(segs);
	if (!pieces) return null;
	const m = pieces.count;
	const { seg, x0, y0, x1, y1 } = pieces;
	const sy = chainStarts(y0, y1, x0, x1, m);
	const sx = chainStarts(x0, x1, y0, y1, m);
	const alongY = sy.length <= sx.length;
	const starts = alongY ? sy : sx;
	if (starts.length > MAX_CHAINS) return null;
	const [A0, A1, C0, C1] = alongY ? [y0, y1, x0, x1] : [x0, x1, y0, y1];
	const g: Ranges = scratch.float64(4, 4 * m);
	for (let p = 0; p < m; p++) {
		g[4 * p] = Math.min(A0[p], A1[p]) - reach;
		g[4 * p + 1] = Math.max(A0[p], A1[p]) + reach;
		g[4 * p + 2] = Math.min(C0[p], C1[p]) - reach;
		g[4 * p + 3] = Math.max(C0[p], C1[p]) + reach;
	}
	const found = new PairKeys(seg, segs.length);
	let work = 0;
	const budget = WORK_PER_PIECE * m + 1024;

	const order = scratch.int32(1, m);
	const count = starts.length;
	const ch: Chains = {
		from: new Int32Array(count),
		to: new Int32Array(count),
		lo: new Float64Array(count),
		hi: new Float64Array(count),
		crossLo: new Float64Array(count),
		crossHi: new Float64Array(count)
	};
	for (let c = 0; c < count; c++) {
		const from = starts[c];
		const to = c + 1 < count ? starts[c + 1] : m;
		const rising = A1[to - 1] >= A0[from];
		let lo = Infinity, hi = -Infinity, crossLo = Infinity, crossHi = -Infinity;
		for (let p = from; p < to; p++) {
			order[p] = rising ? p : to - 1 - (p - from);
			lo = Math.min(lo, g[4 * p]);
			hi = Math.max(hi, g[4 * p + 1]);
			crossLo = Math.min(crossLo, g[4 * p + 2]);
			crossHi = Math.max(crossHi, g[4 * p + 3]);
		}
		ch.from[c] = from;
		ch.to[c] = to;
		ch.lo[c] = lo;
		ch.hi[c] = hi;
		ch.crossLo[c] = crossLo;
		ch.crossHi[c] = crossHi;
		// within the chain: each piece against the ones that follow it while their ranges of a still meet
		for (let k = from; k < to; k++) {
			const p = order[k];
			for (let r = k + 1; r < to; r++) {
				const q = order[r];
				if (r > k + 1 && g[4 * q] > g[4 * p + 1]) break;
				if (++work > budget) return null;
				if (seg[p] === seg[q] || !near(g, p, q)) continue;
				if (r === k + 1 && skipJoins && joinGoesOn(pieces, Math.min(p, q), Math.max(p, q))) continue;
				found.add(p, q);
			}
		}
	}

	// along each chain in order of a: the largest hi so far and the smallest lo from here on (pieces that
	// meet at a vertex within the closure tolerance may step back a little, so the ranges themselves are
	// not quite in order, these are)
	const upHi = scratch.float64(5, m);
	const downLo = scratch.float64(6, m);
	for (let c = 0; c < count; c++) {
		const from = ch.from[c], to = ch.to[c];
		let run = -Infinity;
		for (let k = from; k < to; k++) upHi[k] = run = Math.max(run, g[4 * order[k] + 1]);
		run = Infinity;
		for (let k = to - 1; k >= from; k--) downLo[k] = run = Math.min(run, g[4 * order[k]]);
	}
	// pairs of chains whose boxes meet (a sweep along a over the chains in order of lo), each compared by a
	// merge along a
	const byLo = indicesByKey(ch.lo);
	for (let a = 0; a < count; a++) {
		const A = byLo[a];
		const hiA = ch.hi[A], crossLoA = ch.crossLo[A], crossHiA = ch.crossHi[A];
		for (let b = a + 1; b < count; b++) {
			const B = byLo[b];
			if (ch.lo[B] > hiA) break;
			if (++work > budget) return null;
			if (crossHiA < ch.crossLo[B] || ch.crossHi[B] < crossLoA) continue;
			work += ch.to[A] - ch.from[A] + ch.to[B] - ch.from[B];
			if (work > budget) return null;
			mergeChains(ch, A, B, order, g, upHi, downLo, found);
		}
	}
	return found.pairs(m === segs.length);
}

/**
 * Indices 0 … n − 1 in increasing order of key (ties in index order): an insertion sort into runs of
 * 16 and bottom-up merges, on typed arrays (a comparator callback costs more than the sort here).
 */
export function indicesByKey(key: Float64Array): Int32Array {
	const n = key.length;
	let a = new Int32Array(n);
	let b = new Int32Array(n);
	for (let i = 0; i < n; i++) a[i] = i;
	const RUN = 16;
	for (let lo = 0; lo < n; lo += RUN) {
		const hi = Math.min(n, lo + RUN);
		for (let i = lo + 1; i < hi; i++) {
			const v = a[i];
			const kv = key[v];
			let j = i - 1;
			while (j >= lo && key[a[j]] > kv) {
				a[j + 1] = a[j];
				j--;
			}
			a[j + 1] = v;
		}
	}
	for (let width = RUN; width < n; width *= 2) {
		for (let lo = 0; lo < n; lo += 2 * width) {
			const mid = Math.min(n, lo + width), hi = Math.min(n, lo + 2 * width);
			let i = lo, j = mid, o = lo;
			while (i < mid && j < hi) b[o++] = key[a[j]] < key[a[i]] ? a[j++] : a[i++];
			while (i < mid) b[o++] = a[i++];
			while (j < hi) b[o++] = a[j++];
		}
		const t = a;
		a = b;
		b = t;
	}
	return a;
}

/** First index k in from … to − 1 with upHi[k] ≥ v (upHi is in order along a chain), or to. */
function firstReaching(upHi: Float64Array, from: number, to: number, v: number): number {
	let lo = from, hi = to;
	while (lo < hi) {
		const mid = (lo + hi) >> 1;
		if (upHi[mid] >= v) hi = mid;
		else lo = mid + 1;
	}
	return lo;
}

/**
 * Piece pairs of chains A and B whose ranges meet, both walked in order of a from where their ranges
 * along a begin to meet to where they stop meeting.
 */
function mergeChains(ch: Chains, A: number, B: number, order: Int32Array, g: Ranges, upHi: Float64Array, downLo: Float64Array, found: PairKeys): void {
	const toA = ch.to[A], toB = ch.to[B];
	const crossLoB = ch.crossLo[B], crossHiB = ch.crossHi[B], hiB = ch.hi[B];
	// pieces of A before this reach no piece of B along a
	const k0 = firstReaching(upHi, ch.from[A], toA, ch.lo[B]);
	if (k0 === toA) return;
	let j0 = firstReaching(upHi, ch.from[B], toB, g[4 * order[k0]]);
	for (let k = k0; k < toA; k++) {
		// this piece and all after it lie past B along a
		if (downLo[k] > hiB) break;
		const p = order[k];
		while (j0 < toB && g[4 * order[j0] + 1] < g[4 * p]) j0++;
		// a piece outside B's range across a meets none of B's pieces
		if (g[4 * p + 3] < crossLoB || g[4 * p + 2] > crossHiB) continue;
		for (let r = j0; r < toB; r++) {
			const q = order[r];
			if (g[4 * q] > g[4 * p + 1]) break;
			if (near(g, p, q)) found.add(p, q);
		}
	}
}

/**
 * Pieces p and p + 1 end and start at the same point, the shared vertex of two neighbouring segments,
 * and go on the same way in x and in y (either may stand still in one).
 */
function joinGoesOn(pc: Pieces, p: number, q: number): boolean {
	if (q !== p + 1 || pc.seg[q] !== pc.seg[p] + 1) return false;
	if (Math.abs(pc.x1[p] - pc.x0[q]) > 1e-9 || Math.abs(pc.y1[p] - pc.y0[q]) > 1e-9) return false;
	return sign(pc.x1[p] - pc.x0[p]) * sign(pc.x1[q] - pc.x0[q]) >= 0 && sign(pc.y1[p] - pc.y0[p]) * sign(pc.y1[q] - pc.y0[q]) >= 0;
}
