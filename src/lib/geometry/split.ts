import type { Outline, Path, Segment, SegmentChain, SegmentLocation, Vec } from './types';
import { segmentBetween, segmentPointAt, segmentSplitAt, segmentWithEnd, segmentWithStart } from './segment';
import { PARAMETER_TOLERANCE } from './tolerance';

/**
 * Splitting segments, paths and outlines at (segment, t) locations, and sub-paths between two locations.
 * Cut points are computed once, so the end of one chain is exactly (===) the start of the next.
 */

export { segmentSplitAt } from './segment';

/**
 * Normalise a location: t within PARAMETER_TOLERANCE of 0 → 0; of 1 → start of the next segment
 * (for a closed outline wrapping to segment 0; for an open path the last segment keeps t = 1).
 */
export function locationNormalize(chain: SegmentChain, at: SegmentLocation, closed: boolean, tolerance = PARAMETER_TOLERANCE): SegmentLocation {
	const n = chain.segments.length;
	let i = Math.min(Math.max(at.segmentIndex, 0), n - 1);
	let t = Math.min(Math.max(at.t, 0), 1);
	if (t <= tolerance) t = 0;
	else if (t >= 1 - tolerance) {
		if (i + 1 < n) { i += 1; t = 0; }
		else if (closed) { i = 0; t = 0; }
		else t = 1;
	}
	return { segmentIndex: i, t };
}

/** Normalised locations sorted along the chain, duplicates removed. The order outlineSplitAt uses. */
export function locationsSortAlong(chain: SegmentChain, locations: readonly SegmentLocation[], closed: boolean): SegmentLocation[] {
	const norm = locations.map((l) => locationNormalize(chain, l, closed));
	norm.sort((a, b) => a.segmentIndex - b.segmentIndex || a.t - b.t);
	const out: SegmentLocation[] = [];
	for (const l of norm) {
		const last = out[out.length - 1];
		if (last && last.segmentIndex === l.segmentIndex && Math.abs(last.t - l.t) <= PARAMETER_TOLERANCE) continue;
		out.push(l);
	}
	return out;
}

function pointAtLocation(segs: readonly Segment[], at: SegmentLocation): Vec {
	const s = segs[at.segmentIndex];
	if (at.t === 0) return s.p0;
	if (at.t === 1) return s.kind === 'line' ? s.p1 : s.p3;
	return segmentPointAt(s, at.t);
}

/** Segments from `from` forward to `to` on an open chain (from before to). */
function forward(segs: readonly Segment[], from: SegmentLocation, to: SegmentLocation, startPoint: Vec, endPoint: Vec): Segment[] {
	const out: Segment[] = [];
	if (from.segmentIndex === to.segmentIndex) {
		if (to.t > from.t) out.push(segmentBetween(segs[from.segmentIndex], from.t, to.t));
	} else {
		if (from.t < 1) out.push(segmentBetween(segs[from.segmentIndex], from.t, 1));
		for (let i = from.segmentIndex + 1; i < to.segmentIndex; i++) out.push(segs[i]);
		if (to.t > 0) out.push(segmentBetween(segs[to.segmentIndex], 0, to.t));
	}
	if (out.length > 0) {
		out[0] = segmentWithStart(out[0], startPoint);
		out[out.length - 1] = segmentWithEnd(out[out.length - 1], endPoint);
	}
	return out;
}

/**
 * Sub-path of an open path between two locations. If `to` comes before `from` the result runs
 * backwards (reversed), from `from` to `to`.
 */
export function pathBetween(path: Path, from: SegmentLocation, to: SegmentLocation): Path {
	const segs = path.segments;
	if (segs.length === 0) return { segments: [] };
	const a = locationNormalize(path, from, false);
	const b = locationNormalize(path, to, false);
	const pa = pointAtLocation(segs, a);
	const pb = pointAtLocation(segs, b);
	if (a.segmentIndex + a.t <= b.segmentIndex + b.t) return { segments: forward(segs, a, b, pa, pb) };
	const fwd = forward(segs, b, a, pb, pa);
	const out = new Array<Segment>(fwd.length);
	for (let i = 0; i < fwd.length; i++) {
		const s = fwd[fwd.length - 1 - i];
		out[i] = s.kind === 'line' ? { kind: 'line', p0: s.p1, p1: s.p0 } : { kind: 'cubic', p0: s.p3, p1: s.p2, p2: s.p1, p3: s.p0 };
	}
	return { segments: out };
}

/**
 * Sub-path of a closed outline going forward (in the outline's direction) from `from` to `to`,
 * wrapping past the last segment if needed. from == to gives the whole outline as a path
 * starting and ending there.
 */
export function outlineBetween(outline: Outline, from: SegmentLocation, to: SegmentLocation): Path {
	const segs = outline.segments;
	if (segs.length === 0) return { segments: [] };
	const a = locationNormalize(outline, from, true);
	const b = locationNormalize(outline, to, true);
	const pa = pointAtLocation(segs, a);
	const pb = pointAtLocation(segs, b);
	if (a.segmentIndex + a.t < b.segmentIndex + b.t) return { segments: forward(segs, a, b, pa, pb) };
	// wrap: from a to the end, then from the start to b
	const n = segs.length;
	const endLoc = { segmentIndex: n - 1, t: 1 };
	const startLoc = { segmentIndex: 0, t: 0 };
	const endPt = segs[n - 1].kind === 'line' ? (segs[n - 1] as { p1: Vec }).p1 : (segs[n - 1] as { p3: Vec }).p3;
	const first = forward(segs, a, endLoc, pa, endPt);
	const second = forward(segs, startLoc, b, segs[0].p0, pb);
	return { segments: [...first, ...second] };
}

/**
 * Cut a closed outline at the given locations into chains. With k distinct locations, sorted along
 * the outline as by `locationsSortAlong(outline, locations, true)`, chains[i] runs from sorted
 * location i to sorted location i+1 (the last one wraps to location 0). One location gives one chain
 * (the whole outline opened there). No locations: the whole outline as one path.
 */
export function outlineSplitAt(outline: Outline, locations: readonly SegmentLocation[]): Path[] {
	const locs = locationsSortAlong(outline, locations, true);
	if (locs.length === 0) return [{ segments: [...outline.segments] }];
	const out: Path[] = [];
	for (let i = 0; i < locs.length; i++) out.push(outlineBetween(outline, locs[i], locs[(i + 1) % locs.length]));
	return out;
}

/**
 * Cut an open path at the given locations: k distinct inner locations give k+1 chains in order
 * (a cut at the very start or end adds no empty chain).
 */
export function pathSplitAt(path: Path, locations: readonly SegmentLocation[]): Path[] {
	const n = path.segments.length;
	if (n === 0) return [];
	const locs = locationsSortAlong(path, locations, false).filter(
		(l) => !(l.segmentIndex === 0 && l.t === 0) && !(l.segmentIndex === n - 1 && l.t === 1)
	);
	const cuts = [{ segmentIndex: 0, t: 0 }, ...locs, { segmentIndex: n - 1, t: 1 }];
	const out: Path[] = [];
	for (let i = 0; i + 1 < cuts.length; i++) out.push(pathBetween(path, cuts[i], cuts[i + 1]));
	return out;
}

/** Split one segment at several parameters (sorted, de-duplicated) into consecutive pieces. */
export function segmentSplitAtMany(s: Segment, ts: readonly number[]): Segment[] {
	const sorted = [...ts].filter((t) => t > PARAMETER_TOLERANCE && t < 1 - PARAMETER_TOLERANCE).sort((a, b) => a - b);
	const out: Segment[] = [];
	let rest = s;
	let prev = 0;
	for (const t of sorted) {
		if (t - prev <= PARAMETER_TOLERANCE) continue;
		const [a, b] = segmentSplitAt(rest, (t - prev) / (1 - prev));
		out.push(a);
		rest = b;
		prev = t;
	}
	out.push(rest);
	return out;
}
