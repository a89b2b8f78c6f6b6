import type { SegmentChain } from './types';
import { touchReach } from './curve-curve';
import type { ChainHit } from './intersect';
import { loopHits, outlineSelfIntersections, pairHits } from './self-intersect';
import { indicesByKey } from './self-intersect-chains';
import { ScratchArrays } from './scratch';
import { CLOSURE_TOLERANCE_MM, INTERSECTION_TOLERANCE_MM } from './tolerance';

/**
 * The self-crossing search of an outline made of parts that are each known to be free of crossings
 * among their own segments: an operation that turns stretches of a checked outline rigidly (a pivot
 * turns one side about the apex) knows that each stretch is still clean on its own, so only a segment
 * of one part against a segment of another part, and the new segments against everything, can cross.
 *
 * `partOf[i]` is the part of segment i (a number ≥ 0), or −1 for a segment not known to be clean (new
 * or changed; it is tested against every other segment, and for a loop). The answer is exactly that of
 * outlineSelfIntersections (every pair of segments tested, see self-intersect.ts) without the pairs of
 * two segments of one part and without the loops of segments in a part. When the parts really are clean
 * (each a rigid image of a stretch of a checked outline) that is the whole outline's answer.
 *
 * The search: every segment's control-point box (grown by the touching reach); a coarse grid over the
 * outline where each cell notes which parts' boxes cover it; a segment of a part is a candidate only if
 * one of its cells is also covered by another part or by a segment of no part (a side turned about a
 * corner keeps only the segments near its two seams). The candidates are swept in order of their left
 * edges. Where the parts are intertwined (the sweep
 * would cost more than a few times the segment count) the full search runs and its answer is restricted.
 */

/** Parts are told apart by one bit each of a cell's mask (the 31st bit marks segments of no part). */
const MAX_PARTS = 30;
const LOOSE_BIT = 1 << 30;
/** The grid of cells is at most this many cells a side. */
const MAX_GRID_SIDE = 64;
/** Consecutive segments of one part marked and tested together. */
const BLOCK = 16;
/** The sweep gives up (full search instead) past this many box comparisons per segment. */
const SWEEP_WORK_PER_SEGMENT = 16;

export function outlineSelfIntersectionsBetweenParts(
	chain: SegmentChain,
	partOf: ArrayLike<number>,
	closed = true,
	tolerance = INTERSECTION_TOLERANCE_MM,
	vertexTolerance = CLOSURE_TOLERANCE_MM
): ChainHit[] {
	const segs = chain.segments;
	const n = segs.length;
	const full = (): ChainHit[] => restricted(outlineSelfIntersections(chain, closed, tolerance, vertexTolerance), partOf);
	if (partOf.length !== n) return full();
	const reach = touchReach(tolerance);
	// part numbers made compact: 0 … parts − 1, and `parts` for the segments of no part
	const group = scratch.int32(2, n);
	const seen = new Map<number, number>();
	let lastPart = -1, lastGroup = -1;
	for (let i = 0; i < n; i++) {
		const p = partOf[i];
		if (!(p >= 0)) {
			group[i] = -1;
			continue;
		}
		// parts come in runs: the map is asked only where the part changes
		let g = p === lastPart ? lastGroup : seen.get(p);
		lastPart = p;
		if (g === undefined) {
			g = seen.size;
			if (g >= MAX_PARTS) return full();
			seen.set(p, g);
		}
		lastGroup = g;
		group[i] = g;
	}
	const parts = seen.size;
	for (let i = 0; i < n; i++) if (group[i] < 0) group[i] = parts;
	const box = scratch.float64(0, 4 * n);
	// a straight segment's ends (x0, y0, x1, y1), NaN for a curve: each segment object is read once
	const line = scratch.float64(1, 4 * n);
	let allMinX = Infinity, allMinY = Infinity, allMaxX = -Infinity, allMaxY = -Infinity;
	for (let i = 0; i < n; i++) {
		const s = segs[i];
		let minX = s.p0.x, maxX = minX, minY = s.p0.y, maxY = minY;
		const q = s.p1;
		if (q.x < minX) minX = q.x; else if (q.x > maxX) maxX = q.x;
		if (q.y < minY) minY = q.y; else if (q.y > maxY) maxY = q.y;
		if (s.kind === 'cubic') {
			for (const r of [s.p2, s.p3]) {
				if (r.x < minX) minX = r.x; else if (r.x > maxX) maxX = r.x;
				if (r.y < minY) minY = r.y; else if (r.y > maxY) maxY = r.y;
			}
			line[4 * i] = NaN;
		} else {
			line[4 * i] = s.p0.x;
			line[4 * i + 1] = s.p0.y;
			line[4 * i + 2] = q.x;
			line[4 * i + 3] = q.y;
		}
		// written so that NaN and ±Infinity fail: such an outline goes to the full search
		if (!(maxX - minX + (maxY - minY) < Infinity)) return full();
		box[4 * i] = minX - reach;
		box[4 * i + 1] = minY - reach;
		box[4 * i + 2] = maxX + reach;
		box[4 * i + 3] = maxY + reach;
		if (minX < allMinX) allMinX = minX;
		if (minY < allMinY) allMinY = minY;
		if (maxX > allMaxX) allMaxX = maxX;
		if (maxY > allMaxY) allMaxY = maxY;
	}
	// candidates: a segment of a part that shares a grid cell with a segment of another part or of no part
	// (every segment marks the cells it covers with its group's bit)
	const side = Math.max(1, Math.min(MAX_GRID_SIDE, Math.ceil(Math.sqrt(n) / 2)));
	const grid: Grid = {
		side,
		minX: allMinX,
		minY: allMinY,
		cw: (allMaxX - allMinX) / side || 1,
		ch: (allMaxY - allMinY) / side || 1,
		mask: new Int32Array(side * side),
		reach,
		box,
		line
	};
	// runs of up to BLOCK consecutive segments of one group mark and test the grid with their joint box
	// (a straight segment across several cells, on its own, with its band)
	const blocks = scratch.int32(0, n + 1);
	let blockCount = 0;
	for (let i = 0; i < n; i++) {
		const from = blockCount > 0 ? blocks[blockCount - 1] : -1;
		const long = box[4 * i + 2] - box[4 * i] > 2 * grid.cw || box[4 * i + 3] - box[4 * i + 1] > 2 * grid.ch;
		if (blockCount === 0 || long || i - from >= BLOCK || group[i] !== group[from] || longAt(grid, from)) blocks[blockCount++] = i;
	}
	blocks[blockCount] = n;
	const blockBox = new Float64Array(4);
	for (let b = 0; b < blockCount; b++) {
		const g = group[blocks[b]];
		blockCovers(grid, blocks[b], blocks[b + 1], g === parts ? LOOSE_BIT : 1 << g, true, blockBox);
	}
	const cand = scratch.int32(1, n);
	let count = 0;
	for (let b = 0; b < blockCount; b++) {
		const from = blocks[b], to = blocks[b + 1];
		const g = group[from];
		if (g !== parts && !blockCovers(grid, from, to, ~(1 << g), false, blockBox)) continue;
		for (let i = from; i < to; i++) if (g === parts || to - from === 1 || cellsCovered(grid, i, ~(1 << g), false)) cand[count++] = i;
	}
	// the sweep: candidates in order of their left edges, each against those that start before it ends
	const left = new Float64Array(count);
	for (let k = 0; k < count; k++) left[k] = box[4 * cand[k]];
	const order = indicesByKey(left);
	const pairs: number[] = [];
	let work = 0;
	const budget = SWEEP_WORK_PER_SEGMENT * n + 1024;
	for (let a = 0; a < count; a++) {
		const i = cand[order[a]];
		const gi = group[i];
		const right = box[4 * i + 2], top = box[4 * i + 1], bottom = box[4 * i + 3];
		for (let b = a + 1; b < count; b++) {
			const j = cand[order[b]];
			if (box[4 * j] > right) break;
			if (++work > budget) return full();
			if ((gi === group[j] && gi !== parts) || box[4 * j + 1] > bottom || box[4 * j + 3] < top) continue;
			pairs.push(Math.min(i, j), Math.max(i, j));
		}
	}
	const out = loopHits(segs, (i) => group[i] === parts);
	for (let k = 0; k < pairs.length; k += 2) pairHits(segs, pairs[k], pairs[k + 1], closed, tolerance, vertexTolerance, out);
	out.sort((p, q) => p.segmentIndex - q.segmentIndex || p.t - q.t);
	return out;
}

interface Grid {
	readonly side: number;
	readonly minX: number;
	readonly minY: number;
	readonly cw: number;
	readonly ch: number;
	/** For each cell, the bits of the groups whose segments cover it. */
	readonly mask: Int32Array;
	readonly reach: number;
	readonly box: Float64Array;
	readonly line: Float64Array;
}

/** This search's working arrays (see scratch.ts). */
const scratch = new ScratchArrays();

/** A straight segment across several cells (covered by its band of cells, see cellsCovered). */
function longAt(grid: Grid, i: number): boolean {
	const { box, line, cw, ch } = grid;
	return line[4 * i] === line[4 * i] && (box[4 * i + 2] - box[4 * i] > 2 * cw || box[4 * i + 3] - box[4 * i + 1] > 2 * ch);
}

/** cellsCovered for the segments from … to − 1 together: by their joint box (one segment: its own cells). */
function blockCovers(grid: Grid, from: number, to: number, bits: number, mark: boolean, scratch: Float64Array): boolean {
	if (to - from === 1) return cellsCovered(grid, from, bits, mark);
	const { side, minX, minY, cw, ch, mask, box } = grid;
	scratch[0] = scratch[1] = Infinity;
	scratch[2] = scratch[3] = -Infinity;
	for (let i = from; i < to; i++) {
		if (box[4 * i] < scratch[0]) scratch[0] = box[4 * i];
		if (box[4 * i + 1] < scratch[1]) scratch[1] = box[4 * i + 1];
		if (box[4 * i + 2] > scratch[2]) scratch[2] = box[4 * i + 2];
		if (box[4 * i + 3] > scratch[3]) scratch[3] = box[4 * i + 3];
	}
	const c0 = cell(scratch[0], minX, cw, side), c1 = cell(scratch[2], minX, cw, side);
	const r0 = cell(scratch[1], minY, ch, side), r1 = cell(scratch[3], minY, ch, side);
	for (let r = r0; r <= r1; r++) {
		for (let c = c0; c <= c1; c++) {
			if (mark) mask[r * side + c] |= bits;
			else if (mask[r * side + c] & bits) return true;
		}
	}
	return false;
}

/** The cell (0 … side − 1) of a coordinate. */
function cell(v: number, min: number, size: number, side: number): number {
	const c = Math.floor((v - min) / size);
	return c < 0 ? 0 : c >= side ? side - 1 : c;
}

/**
 * The cells segment i covers: its box's, or for a straight segment across many cells those of the boxes
 * of its pieces one cell long (grown by the reach), so a long diagonal covers a band, not a rectangle.
 * `mark`: sets `bits` in them (returns false); else tells whether any of them has one of `bits`.
 */
function cellsCovered(grid: Grid, i: number, bits: number, mark: boolean): boolean {
	const { side, minX, minY, cw, ch, mask, reach, box, line } = grid;
	const lx0 = line[4 * i], ly0 = line[4 * i + 1], dx = line[4 * i + 2] - lx0, dy = line[4 * i + 3] - ly0;
	let pieces = 1;
	// NaN (a curve) fails the comparison
	const span = Math.max(Math.abs(dx) / cw, Math.abs(dy) / ch);
	if (span > 2) pieces = Math.min(4 * side, Math.ceil(span));
	for (let k = 0; k < pieces; k++) {
		let x0 = box[4 * i], y0 = box[4 * i + 1], x1 = box[4 * i + 2], y1 = box[4 * i + 3];
		if (pieces > 1) {
			const ta = k / pieces, tb = (k + 1) / pieces;
			const ax = lx0 + dx * ta, ay = ly0 + dy * ta;
			const bx = lx0 + dx * tb, by = ly0 + dy * tb;
			// a little more than the reach, for the rounding of the piece ends
			const m = 2 * reach;
			x0 = Math.min(ax, bx) - m;
			x1 = Math.max(ax, bx) + m;
			y0 = Math.min(ay, by) - m;
			y1 = Math.max(ay, by) + m;
		}
		const c0 = cell(x0, minX, cw, side), c1 = cell(x1, minX, cw, side);
		const r0 = cell(y0, minY, ch, side), r1 = cell(y1, minY, ch, side);
		for (let r = r0; r <= r1; r++) {
			for (let c = c0; c <= c1; c++) {
				if (mark) mask[r * side + c] |= bits;
				else if (mask[r * side + c] & bits) return true;
			}
		}
	}
	return false;
}

/** Hits without those within one part (a pair of its segments, or a loop of one of them). */
function restricted(hits: readonly ChainHit[], partOf: ArrayLike<number>): ChainHit[] {
	const part = (i: number): number => (i < partOf.length && partOf[i] >= 0 ? partOf[i] : -1);
	return hits.filter((h) => {
		const a = part(h.segmentIndex);
		return a < 0 || a !== part(h.otherSegmentIndex);
	});
}
