import type { Outline, Path, Segment, SegmentChain, SegmentLocation, Vec } from './types';
import { lineSegment, segmentEnd, segmentReverse, segmentWithStart } from './segment';
import { POINT_TOLERANCE_MM } from './tolerance';

/** Building, reversing and joining paths and outlines. */

export function pathStart(chain: SegmentChain): Vec | undefined {
	return chain.segments.length ? chain.segments[0].p0 : undefined;
}

export function pathEnd(chain: SegmentChain): Vec | undefined {
	const n = chain.segments.length;
	return n ? segmentEnd(chain.segments[n - 1]) : undefined;
}

/** The same path travelled the other way (segments reversed and in reverse order). */
export function pathReverse(p: Path): Path {
	const n = p.segments.length;
	const out = new Array<Segment>(n);
	for (let i = 0; i < n; i++) out[i] = segmentReverse(p.segments[n - 1 - i]);
	return { segments: out };
}

/** The same outline travelled the other way (signed area changes sign). */
export function outlineReverse(o: Outline): Outline {
	return pathReverse(o);
}

/** Open path of straight lines through the points. */
export function pathFromPolyline(points: readonly Vec[]): Path {
	const segs: Segment[] = [];
	for (let i = 0; i + 1 < points.length; i++) segs.push(lineSegment(points[i], points[i + 1]));
	return { segments: segs };
}

/**
 * Closed outline of straight lines through the points. A last point equal to the first (within
 * tolerance) is dropped, so both [a,b,c] and [a,b,c,a] give three segments.
 */
export function outlineFromPolyline(points: readonly Vec[], tolerance = POINT_TOLERANCE_MM): Outline {
	let n = points.length;
	if (n > 1) {
		const a = points[0];
		const b = points[n - 1];
		if (Math.abs(a.x - b.x) <= tolerance && Math.abs(a.y - b.y) <= tolerance) n--;
	}
	const segs: Segment[] = [];
	for (let i = 0; i < n && n > 1; i++) segs.push(lineSegment(points[i], points[(i + 1) % n]));
	return { segments: segs };
}

/** Vertices of a chain: every segment start, plus the last end for an open path. */
export function pathVertices(chain: SegmentChain, closed = false): Vec[] {
	const out = chain.segments.map((s) => s.p0);
	const end = pathEnd(chain);
	if (!closed && end) out.push(end);
	return out;
}

export interface ChainJoinOptions {
	/** End-to-start gaps up to this are snapped (the next chain's start is set to the previous end). */
	readonly snapTolerance?: number;
	/** Larger gaps: 'bridge' inserts a straight line (default); 'keep' leaves the gap (the checks will report it). */
	readonly gaps?: 'bridge' | 'keep';
}

function join(chains: readonly SegmentChain[], closed: boolean, options: ChainJoinOptions): Segment[] {
	const tol = options.snapTolerance ?? POINT_TOLERANCE_MM;
	const bridge = (options.gaps ?? 'bridge') === 'bridge';
	const out: Segment[] = [];
	for (const c of chains) {
		for (const s of c.segments) {
			if (out.length === 0) {
				out.push(s);
				continue;
			}
			const end = segmentEnd(out[out.length - 1]);
			if (end.x === s.p0.x && end.y === s.p0.y) {
				out.push(s);
				continue;
			}
			const d = Math.hypot(end.x - s.p0.x, end.y - s.p0.y);
			if (d === 0) out.push(s);
			else if (d <= tol) out.push(segmentWithStart(s, end));
			else {
				if (bridge) out.push(lineSegment(end, s.p0));
				out.push(s);
			}
		}
	}
	if (closed && out.length > 0) {
		const end = segmentEnd(out[out.length - 1]);
		const start = out[0].p0;
		const d = Math.hypot(end.x - start.x, end.y - start.y);
		if (d > 0 && d <= tol) out[0] = segmentWithStart(out[0], end);
		else if (d > tol && bridge) out.push(lineSegment(end, start));
	}
	return out;
}

/** Concatenate open chains into one path (ends snapped or bridged, see options). */
export function pathConcat(chains: readonly SegmentChain[], options: ChainJoinOptions = {}): Path {
	return { segments: join(chains, false, options) };
}

/** Concatenate chains in order into a closed outline (ends snapped or bridged, last joined to first). */
export function outlineFromChains(chains: readonly SegmentChain[], options: ChainJoinOptions = {}): Outline {
	return { segments: join(chains, true, options) };
}

/** Start the outline at another segment (same shape, same orientation). */
export function outlineRotateStart(o: Outline, segmentIndex: number): Outline {
	const n = o.segments.length;
	if (n === 0) return o;
	const k = ((segmentIndex % n) + n) % n;
	return { segments: [...o.segments.slice(k), ...o.segments.slice(0, k)] };
}

/** A location expressed as a single number (segmentIndex + t) for ordering. */
export function locationKey(at: SegmentLocation): number {
	return at.segmentIndex + at.t;
}
