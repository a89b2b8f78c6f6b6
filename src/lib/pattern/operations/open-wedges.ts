import {
	angleNormalizePositive,
	lineSegment,
	outlineNearestLocation,
	outlineReverse,
	pathRotateAbout,
	pointRotateAbout,
	segmentEnd,
	segmentSplitAtMany,
	segmentWithStart,
	vecAngleBetween,
	vecCross,
	vecDistance,
	vecDot,
	vecSub,
	type Outline,
	type Segment,
	type Vec
} from '../kernel';
import type { OperationErrorCode } from '../operation-result';
import { apexById, pleatWedgeSegmentRange, wedgeSegmentIndex } from '../piece';
import type { Dart, LegSide, Piece } from '../piece-schema';

/**
 * The rotation engine shared by pivot, share and pleat (primer §1): close one dart and open wedges at
 * new points on the outline by rotating the chains between them rigidly about the apex.
 */

/** How far a requested point may be from the outline and still be taken as on it. */
export const TARGET_SNAP_TOLERANCE_MM = 0.5;
/** Smallest distance between two opening points. */
export const TARGET_MIN_SEPARATION_MM = 0.01;

export interface WedgeRequest {
	/** Where on the outline the new wedge opens. */
	readonly at: Vec;
	/** Unsigned angle of the new wedge (radians). */
	readonly angleRad: number;
	/** Substitute pivot (parallel pleats): the opening runs S → pivot → apex. */
	readonly pivot?: Vec;
}

export interface OpenedWedge {
	readonly requestIndex: number;
	readonly leg1End: Vec;
	readonly leg2End: Vec;
	readonly pivot1?: Vec;
	readonly pivot2?: Vec;
	readonly angleRad: number;
	/** The leg on the side that rotated (more). */
	readonly movedLeg: LegSide;
	/** The point on the original outline where it opened. */
	readonly at: Vec;
}

export interface OpenWedgesOutput {
	readonly outline: Outline;
	readonly openings: readonly OpenedWedge[];
	/** The old dart, if part of it stays (keep angle > 0): its new leg ends. */
	readonly remainingDart: { leg1End: Vec; leg2End: Vec } | null;
	/** Rotation (about the apex) that carries a marking at this point of the original piece. */
	readonly rotationForPoint: (p: Vec) => number;
	/**
	 * For each segment of `outline`: the chain (≥ 0) of the original outline it is a rigidly turned piece of,
	 * or −1 for a new or changed segment (wedge legs, the segment where the closed dart's legs meet). Each
	 * chain is as free of crossings as the original outline was, so the result's check needs only pairs
	 * across chains (outlineProblems' `cleanParts`).
	 */
	readonly rigidParts: Int32Array;
	readonly notes: readonly string[];
}

export type OpenWedgesResult = { ok: true; value: OpenWedgesOutput } | { ok: false; code: OperationErrorCode; message: string };

const fail = (code: OperationErrorCode, message: string): OpenWedgesResult => ({ ok: false, code, message });

/** Segment indices that are legs of any dart or pleat opening of the piece, with the wedge's name. */
export function wedgeLegSegments(piece: Piece): Map<number, string> {
	const legs = new Map<number, string>();
	const n = piece.outline.segments.length;
	for (const d of piece.darts) {
		const apex = apexById(piece, d.apexId);
		if (!apex) continue;
		const i = wedgeSegmentIndex(piece.outline, apex.point, d.leg1End, d.leg2End);
		if (i >= 0) {
			legs.set(i, `dart "${d.id}"`);
			legs.set((i + 1) % n, `dart "${d.id}"`);
		}
	}
	for (const p of piece.pleats) {
		const apex = apexById(piece, p.apexId);
		if (!apex) continue;
		const r = pleatWedgeSegmentRange(piece.outline, apex.point, p);
		if (r) for (let j = 0; j < r.count; j++) legs.set((r.first + j) % n, `${p.kind} "${p.id}"`);
	}
	return legs;
}

const fmt = (p: Vec) => `(${p.x.toFixed(1)}, ${p.y.toFixed(1)})`;

/**
 * Close `dart` (leaving `keepAngleRad` of it open) and open the requested wedges. The chain on the
 * dart's moving-leg side rotates; the chain past the last opening stays put.
 */
export function openWedges(
	piece: Piece,
	dart: Dart,
	requests: readonly WedgeRequest[],
	keepAngleRad: number,
	movingLeg: LegSide = dart.movingLeg
): OpenWedgesResult {
	const apex = apexById(piece, dart.apexId);
	if (!apex) return fail('unknown_apex', `Dart "${dart.id}" refers to apex "${dart.apexId}", which is not on the piece.`);
	const k = wedgeSegmentIndex(piece.outline, apex.point, dart.leg1End, dart.leg2End);
	if (k < 0) return fail('invalid_piece', `Dart "${dart.id}" is not a wedge in the outline (leg end → apex → leg end).`);
	const legs = wedgeLegSegments(piece);
	const n = piece.outline.segments.length;
	if (movingLeg === 'leg2') return openForward(piece.outline, apex.point, k, legs, dart.id, requests, keepAngleRad);
	// the leg1 side moves: run the engine on the reversed outline, then reverse back
	const reversedLegs = new Map<number, string>();
	for (const [i, name] of legs) reversedLegs.set(n - 1 - i, name);
	const r = openForward(outlineReverse(piece.outline), apex.point, (n - 2 - k + n) % n, reversedLegs, dart.id, requests, keepAngleRad);
	if (!r.ok) return r;
	const v = r.value;
	return {
		ok: true,
		value: {
			outline: outlineReverse(v.outline),
			openings: v.openings.map((o) => ({
				...o,
				leg1End: o.leg2End,
				leg2End: o.leg1End,
				pivot1: o.pivot2,
				pivot2: o.pivot1,
				movedLeg: o.movedLeg === 'leg1' ? 'leg2' : 'leg1'
			})),
			remainingDart: v.remainingDart ? { leg1End: v.remainingDart.leg2End, leg2End: v.remainingDart.leg1End } : null,
			rotationForPoint: v.rotationForPoint,
			rigidParts: v.rigidParts.slice().reverse(),
			notes: v.notes
		}
	};
}

interface Target {
	readonly requestIndex: number;
	/** Index in the reordered outline (0 = segment starting at the moving leg end). */
	readonly ri: number;
	readonly t: number;
	readonly pos: number;
	readonly request: WedgeRequest;
}

function openForward(
	outline: Outline,
	P: Vec,
	k: number,
	legs: Map<number, string>,
	dartId: string,
	requests: readonly WedgeRequest[],
	keepAngleRad: number
): OpenWedgesResult {
	const segs = outline.segments;
	const n = segs.length;
	const orig = (ri: number) => (k + 2 + ri) % n;
	const L1 = segs[k].p0;
	const L2 = segmentEnd(segs[(k + 1) % n]);
	const closing = vecAngleBetween(vecSub(L2, P), vecSub(L1, P));
	const sign = closing >= 0 ? 1 : -1;
	const theta = Math.abs(closing);
	const notes: string[] = [];

	const targets: Target[] = [];
	for (let q = 0; q < requests.length; q++) {
		const req = requests[q];
		const loc = outlineNearestLocation(outline, req.at);
		if (loc.distance > TARGET_SNAP_TOLERANCE_MM) {
			return fail('target_off_outline', `The point ${fmt(req.at)} is ${loc.distance.toFixed(1)} mm from the outline; pick a point on the stitching line.`);
		}
		let i = loc.segmentIndex;
		let t = loc.t;
		if (t > 1 - 1e-9) {
			i = (i + 1) % n;
			t = 0;
		} else if (t < 1e-9) t = 0;
		const touching = t === 0 ? [i, (i - 1 + n) % n] : [i];
		for (const j of touching) {
			const name = legs.get(j);
			if (!name) continue;
			if (j === k || j === (k + 1) % n) {
				return fail('target_inside_dart', `The point ${fmt(req.at)} is on dart "${dartId}" itself; choose a point on a seam away from the dart.`);
			}
			return fail('target_on_wedge', `The point ${fmt(req.at)} is on ${name}; choose a point on a seam.`);
		}
		const ri = (i - (k + 2) + n) % n;
		targets.push({ requestIndex: q, ri, t, pos: ri + t, request: req });
	}
	targets.sort((a, b) => a.pos - b.pos);
	for (let q = 1; q < targets.length; q++) {
		const a = segsPoint(segs, orig(targets[q - 1].ri), targets[q - 1].t);
		const b = segsPoint(segs, orig(targets[q].ri), targets[q].t);
		if (vecDistance(a, b) < TARGET_MIN_SEPARATION_MM) {
			return fail('targets_coincide', `Two new openings fall on the same point ${fmt(a)}.`);
		}
	}

	// cut the chain L2 → … → L1 at the targets; the stretches between them are taken whole
	const stretch = (from: number, to: number): Segment[] => {
		if (to <= from) return [];
		const a = orig(from);
		return a + (to - from) <= n ? segs.slice(a, a + (to - from)) : segs.slice(a).concat(segs.slice(0, a + (to - from) - n));
	};
	const chains: Segment[][] = [];
	let cur: Segment[] = [];
	let q = 0;
	let placed = 0;
	while (q < targets.length && targets[q].ri <= n - 3) {
		const ri = targets[q].ri;
		const s = segs[orig(ri)];
		cur = cur.concat(stretch(placed, ri));
		placed = ri + 1;
		while (q < targets.length && targets[q].ri === ri && targets[q].t === 0) {
			chains.push(cur);
			cur = [];
			q++;
		}
		const ts: number[] = [];
		while (q < targets.length && targets[q].ri === ri) ts.push(targets[q++].t);
		if (ts.length) {
			const pieces = segmentSplitAtMany(s, ts);
			if (pieces.length !== ts.length + 1) return fail('targets_coincide', 'Two new openings are too close together on one segment.');
			for (let p = 0; p < pieces.length - 1; p++) {
				cur.push(pieces[p]);
				chains.push(cur);
				cur = [];
			}
			cur.push(pieces[pieces.length - 1]);
		} else cur.push(s);
	}
	chains.push(cur.concat(stretch(placed, n - 2)));
	const m = targets.length;
	// rotation of chain c: sign · (sum of the openings between it and the fixed end)
	const phis = targets.map((tg) => tg.request.angleRad);
	const rot: number[] = [];
	for (let c = 0; c <= m; c++) rot.push(sign * phis.slice(c).reduce((s, v) => s + v, 0));
	// each chain turns as one path (a point shared by two segments is turned once; the numbers are the same)
	const rotated = chains.map((ch, c) => (rot[c] === 0 ? ch : pathRotateAbout({ segments: ch }, P, rot[c]).segments));

	let out: Segment[] = [];
	// the chain each segment of out is a turned piece of, or −1 (new)
	const partOf: number[] = [];
	const openings: OpenedWedge[] = [];
	for (let c = 0; c <= m; c++) {
		out = out.concat(rotated[c]);
		for (let j = rotated[c].length; j > 0; j--) partOf.push(c);
		if (c === m) break;
		const tg = targets[c];
		const S = chains[c + 1][0].p0;
		const a = segmentEnd(rotated[c][rotated[c].length - 1]);
		const b = rotated[c + 1][0].p0;
		if (tg.request.pivot) {
			const qa = pointRotateAbout(tg.request.pivot, P, rot[c]);
			const qb = pointRotateAbout(tg.request.pivot, P, rot[c + 1]);
			out.push(lineSegment(a, qa), lineSegment(qa, P), lineSegment(P, qb), lineSegment(qb, b));
			partOf.push(-1, -1, -1, -1);
			openings.push({ requestIndex: tg.requestIndex, leg1End: a, leg2End: b, pivot1: qa, pivot2: qb, angleRad: tg.request.angleRad, movedLeg: 'leg1', at: S });
		} else {
			out.push(lineSegment(a, P), lineSegment(P, b));
			partOf.push(-1, -1);
			openings.push({ requestIndex: tg.requestIndex, leg1End: a, leg2End: b, angleRad: tg.request.angleRad, movedLeg: 'leg1', at: S });
		}
	}
	const L2moved = rotated[0][0].p0;
	let remainingDart: { leg1End: Vec; leg2End: Vec } | null = null;
	if (keepAngleRad > 1e-12) {
		out.push(lineSegment(L1, P), lineSegment(P, L2moved));
		partOf.push(-1, -1);
		remainingDart = { leg1End: L1, leg2End: L2moved };
	} else {
		const gap = vecDistance(L1, L2moved);
		if (gap <= 1e-6) {
			out[0] = segmentWithStart(out[0], L1);
			partOf[0] = -1;
			if (mergeCollinearAtStart(out)) partOf.pop();
		} else {
			out.push(lineSegment(L1, L2moved));
			partOf.push(-1);
			notes.push(`The legs of dart "${dartId}" differ by ${gap.toFixed(2)} mm; the closed dart leaves a step along the leg line.`);
		}
	}

	// which rotation carries a marking at point p
	const onOutlineRot = (p: Vec): number | null => {
		const loc = outlineNearestLocation(outline, p);
		if (loc.distance > 1e-6) return null;
		const ri = (loc.segmentIndex - (k + 2) + n) % n;
		if (ri === n - 2) return 0; // leg L1 → apex: fixed side
		if (ri === n - 1) return rot[0]; // apex → L2: moving side
		const pos = ri + loc.t;
		let c = 0;
		while (c < m && targets[c].pos <= pos) c++;
		return rot[c];
	};
	const sector = (p: Vec) => angleNormalizePositive(-sign * vecAngleBetween(vecSub(L2, P), vecSub(p, P)));
	const targetSectors = targets.map((tg) => sector(segsPoint(segs, orig(tg.ri), tg.t)));
	const bodyEnd = 2 * Math.PI - theta;
	const rotationForPoint = (p: Vec): number => {
		if (vecDistance(p, P) < 1e-9) return 0;
		const r = onOutlineRot(p);
		if (r !== null) return r;
		const a = sector(p);
		if (a > bodyEnd) return a > bodyEnd + theta / 2 ? rot[0] : 0;
		let c = 0;
		while (c < m && targetSectors[c] <= a) c++;
		return rot[c];
	};
	return { ok: true, value: { outline: { segments: out }, openings, remainingDart, rotationForPoint, rigidParts: Int32Array.from(partOf), notes } };
}

function segsPoint(segs: readonly Segment[], i: number, t: number): Vec {
	const s = segs[i];
	if (t === 0) return s.p0;
	const [a] = segmentSplitAtMany(s, [t]);
	return segmentEnd(a);
}

/** Where a fully closed dart leaves two straight, collinear segments meeting at the outline start, join them (true if it did). */
function mergeCollinearAtStart(out: Segment[]): boolean {
	const first = out[0];
	const last = out[out.length - 1];
	if (first.kind !== 'line' || last.kind !== 'line' || out.length < 4) return false;
	const u = vecSub(last.p1, last.p0);
	const v = vecSub(first.p1, first.p0);
	const lu = Math.hypot(u.x, u.y);
	const lv = Math.hypot(v.x, v.y);
	if (lu === 0 || lv === 0) return false;
	if (Math.abs(vecCross(u, v)) / (lu * lv) > 1e-12 || vecDot(u, v) <= 0) return false;
	out[0] = lineSegment(last.p0, first.p1);
	out.pop();
	return true;
}
