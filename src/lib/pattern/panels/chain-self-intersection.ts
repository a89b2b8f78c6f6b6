import type { Vec } from '../kernel';
import { segmentsTouchXY } from './segment-touch';

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

/** Coordinates of every segment end along one axis (a) and across it (c). */
interface Coords {
	readonly a0: Float64Array;
	readonly a1: Float64Array;
	readonly c0: Float64Array;
	readonly c1: Float64Array;
}

/** Both readings of the segment ends (x0, y0, x1, y1 per segment): along y and along x. */
function coordsOf(xy: Float64Array): { y: Coords; x: Coords } {
	const n = xy.length / 4;
	const x0 = new Float64Array(n);
	const y0 = new Float64Array(n);
	const x1 = new Float64Array(n);
	const y1 = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		x0[i] = xy[4 * i];
		y0[i] = xy[4 * i + 1];
		x1[i] = xy[4 * i + 2];
		y1[i] = xy[4 * i + 3];
	}
	return { y: { a0: y0, a1: y1, c0: x0, c1: x1 }, x: { a0: x0, a1: x1, c0: y0, c1: y1 } };
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

function chainPairCrossings(xy: Float64Array, k: Coords, a: Chain, b: Chain, out: Vec[]): void {
	const n = xy.length / 4;
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
			const p = segmentsTouchXY(xy[4 * ia], xy[4 * ia + 1], xy[4 * ia + 2], xy[4 * ia + 3], xy[4 * ib], xy[4 * ib + 1], xy[4 * ib + 2], xy[4 * ib + 3]);
			if (p) out.push(p);
		}
	}
}

/**
 * Points where a closed all-straight outline crosses or touches itself (non-neighbouring segments), or
 * null when it has too many chains for this search. `xy` holds x0, y0, x1, y1 of every segment.
 */
export function chainSelfIntersection(xy: Float64Array): Vec[] | null {
	const n = xy.length / 4;
	const { y: ky, x: kx } = coordsOf(xy);
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
	for (const [p, q] of pairs) chainPairCrossings(xy, k, p, q, out);
	return out;
}
