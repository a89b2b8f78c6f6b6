import type { Outline, Vec } from '../kernel';
import { segmentsTouch } from './segment-touch';

/**
 * Self-crossing search for closed all-straight outlines, by monotone chains.
 *
 * The outline is cut into chains along which one coordinate (x or y, whichever gives fewer chains)
 * never turns back. Two segments of one chain cannot cross: their ranges in that coordinate meet at
 * most at one value, where only a shared vertex or a run of same-way straight segments can lie. Two
 * chains are compared only if their boxes meet, by walking both in order of the coordinate (a merge),
 * so the work is the sum of the lengths of the chains that come close. A pattern piece has a handful
 * of chains, so the search is linear; outlines with very many chains (zigzags, deep scallops) answer
 * null and are left to the grid search (fast-checks.ts).
 */

const EPS = 1e-9;
const MAX_CHAINS = 256;

interface Chain {
	/** Segment indices of the chain in order of increasing coordinate. */
	readonly order: Int32Array;
	readonly lo: number;
	readonly hi: number;
	readonly crossLo: number;
	readonly crossHi: number;
}

type Seg = { readonly p0: Vec; readonly p1: Vec };

/** Coordinates of every segment end along one axis and across it. */
interface Coords {
	readonly a0: Float64Array;
	readonly a1: Float64Array;
	readonly c0: Float64Array;
	readonly c1: Float64Array;
}

function coordsOf(segs: readonly Seg[], axis: 'x' | 'y'): Coords {
	const n = segs.length;
	const a0 = new Float64Array(n);
	const a1 = new Float64Array(n);
	const c0 = new Float64Array(n);
	const c1 = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		const s = segs[i];
		if (axis === 'y') {
			a0[i] = s.p0.y;
			a1[i] = s.p1.y;
			c0[i] = s.p0.x;
			c1[i] = s.p1.x;
		} else {
			a0[i] = s.p0.x;
			a1[i] = s.p1.x;
			c0[i] = s.p0.y;
			c1[i] = s.p1.y;
		}
	}
	return { a0, a1, c0, c1 };
}

function chainStarts(k: Coords): number[] {
	const n = k.a0.length;
	const starts = [0];
	let dir = 0;
	let lastFlatDir = 0;
	for (let i = 0; i < n; i++) {
		const d = k.a1[i] - k.a0[i];
		const sd = d > 0 ? 1 : d < 0 ? -1 : 0;
		if (sd === 0) {
			// a run of flat segments must keep going the same way along the other coordinate
			const o = k.c1[i] - k.c0[i];
			const od = o > 0 ? 1 : o < 0 ? -1 : 0;
			if (lastFlatDir !== 0 && od !== lastFlatDir && i > starts[starts.length - 1]) {
				starts.push(i);
				dir = 0;
			}
			lastFlatDir = od;
			continue;
		}
		lastFlatDir = 0;
		if (dir === 0) dir = sd;
		else if (sd !== dir) {
			starts.push(i);
			dir = sd;
		}
	}
	return starts;
}

function chainsOf(k: Coords, starts: readonly number[]): Chain[] {
	const n = k.a0.length;
	const out: Chain[] = [];
	for (let c = 0; c < starts.length; c++) {
		const from = starts[c];
		const to = c + 1 < starts.length ? starts[c + 1] : n;
		const first = k.a0[from];
		const last = k.a1[to - 1];
		const rising = last >= first;
		const order = new Int32Array(to - from);
		let crossLo = Infinity;
		let crossHi = -Infinity;
		for (let q = 0; q < order.length; q++) {
			const i = rising ? from + q : to - 1 - q;
			order[q] = i;
			crossLo = Math.min(crossLo, k.c0[i], k.c1[i]);
			crossHi = Math.max(crossHi, k.c0[i], k.c1[i]);
		}
		out.push({ order, lo: Math.min(first, last), hi: Math.max(first, last), crossLo, crossHi });
	}
	return out;
}

function chainPairCrossings(segs: readonly Seg[], k: Coords, a: Chain, b: Chain, out: Vec[]): void {
	const n = segs.length;
	const { a0, a1, c0, c1 } = k;
	let j0 = 0;
	for (let qa = 0; qa < a.order.length; qa++) {
		const ia = a.order[qa];
		const aLo = Math.min(a0[ia], a1[ia]) - EPS;
		const aHi = Math.max(a0[ia], a1[ia]) + EPS;
		const cLo = Math.min(c0[ia], c1[ia]) - EPS;
		const cHi = Math.max(c0[ia], c1[ia]) + EPS;
		while (j0 < b.order.length && Math.max(a0[b.order[j0]], a1[b.order[j0]]) < aLo) j0++;
		for (let qb = j0; qb < b.order.length; qb++) {
			const ib = b.order[qb];
			if (Math.min(a0[ib], a1[ib]) > aHi) break;
			const i = Math.min(ia, ib);
			const j = Math.max(ia, ib);
			if (j - i === 1 || (i === 0 && j === n - 1)) continue;
			if (Math.max(c0[ib], c1[ib]) < cLo || Math.min(c0[ib], c1[ib]) > cHi) continue;
			const p = segmentsTouch(segs[ia].p0, segs[ia].p1, segs[ib].p0, segs[ib].p1);
			if (p) out.push(p);
		}
	}
}

/** Points where a closed all-straight outline crosses or touches itself (non-neighbouring segments), or null when it has too many chains for this search. */
export function chainSelfIntersection(outline: Outline): Vec[] | null {
	const segs = outline.segments as readonly Seg[];
	const n = segs.length;
	const ky = coordsOf(segs, 'y');
	const kx: Coords = { a0: ky.c0, a1: ky.c1, c0: ky.a0, c1: ky.a1 };
	const sy = chainStarts(ky);
	const sx = chainStarts(kx);
	const k = sy.length <= sx.length ? ky : kx;
	const starts = k === ky ? sy : sx;
	if (starts.length > MAX_CHAINS) return null;
	const chains = chainsOf(k, starts).sort((p, q) => p.lo - q.lo);
	// chain pairs whose boxes meet; give up on the chains when comparing them costs more than a grid would
	const pairs: [Chain, Chain][] = [];
	let work = 0;
	for (let a = 0; a < chains.length; a++) {
		for (let b = a + 1; b < chains.length && chains[b].lo <= chains[a].hi + EPS; b++) {
			const p = chains[a];
			const q = chains[b];
			if (p.crossHi < q.crossLo - EPS || q.crossHi < p.crossLo - EPS) continue;
			pairs.push([p, q]);
			work += p.order.length + q.order.length;
			if (work > 8 * n) return null;
		}
	}
	const out: Vec[] = [];
	for (const [p, q] of pairs) chainPairCrossings(segs, k, p, q, out);
	return out;
}
