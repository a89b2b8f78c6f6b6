import {
	outlineNearestLocation,
	pathBoundingBox,
	segmentEnd,
	segmentLength,
	segmentParameterAtLength,
	segmentPointAt,
	segmentTangentAt,
	vecAngleBetween,
	vecDistance,
	type Segment,
	type Vec
} from './kernel';
import { wedgeLegSegments } from './operations/open-wedges';
import { centreMark, pointOnFold } from './operations/still-side';
import type { Piece } from './piece-schema';

/**
 * The seams of a piece, named by where they run (neckline, shoulder, armhole, side seam, waist, centre
 * front…), so a point can be given as "on the shoulder, 40 mm from the neckline end" rather than as a
 * distance round the whole outline. A seam is a stretch of the stitching line between two corners; it runs
 * across the mouth of a dart or pleat (their legs are not part of it), as the sewn seam does.
 * Names follow the bodice pieces the drafts make (y down, centre line on one side); a stretch the rules do
 * not recognise is named by its place on the piece ("upper edge, outer side").
 */

/** A turn sharper than this between two stretches of stitching line is a corner (radians). */
export const SEAM_CORNER_RAD = (30 * Math.PI) / 180;
/** Across a dart or pleat mouth the line turns by the wedge too, so a corner there must be sharper. */
export const SEAM_CORNER_ACROSS_WEDGE_RAD = (45 * Math.PI) / 180;

export interface PieceSeam {
	readonly name: string;
	/** Outline segment indices of the seam, in outline order (wedge legs left out). */
	readonly segmentIndices: readonly number[];
	readonly start: Vec;
	readonly end: Vec;
	/** Sewn length: along the seam with its darts and pleats folded out. */
	readonly lengthMm: number;
	/** The seam lies on the fold line: nothing may open there. */
	readonly onFold: boolean;
	/** Names of the seams met at the start and at the end. */
	readonly startNeighbour: string;
	readonly endNeighbour: string;
}

function groupSeams(piece: Piece): number[][] {
	const segs = piece.outline.segments;
	const n = segs.length;
	const legs = wedgeLegSegments(piece);
	const body = segs.map((_, i) => i).filter((i) => !legs.has(i));
	if (body.length === 0) return [];
	const breakAfter = body.map((a, k) => {
		const b = body[(k + 1) % body.length];
		const turn = Math.abs(vecAngleBetween(segmentTangentAt(segs[a], 1), segmentTangentAt(segs[b], 0)));
		return turn > ((a + 1) % n === b ? SEAM_CORNER_RAD : SEAM_CORNER_ACROSS_WEDGE_RAD);
	});
	const first = breakAfter.findIndex((x) => x);
	if (first < 0) return [body];
	const groups: number[][] = [];
	let cur: number[] = [];
	for (let k = 1; k <= body.length; k++) {
		const j = (first + k) % body.length;
		cur.push(body[j]);
		if (breakAfter[j]) {
			groups.push(cur);
			cur = [];
		}
	}
	return groups;
}

/** Where on its seam a point lies, as a length from the seam's start. */
function lengthAlong(segs: readonly Segment[], indices: readonly number[], upTo: number, t: number): number {
	let total = 0;
	for (const i of indices) {
		if (i === upTo) return total + segmentLength(segs[i], 0, t);
		total += segmentLength(segs[i]);
	}
	return total;
}

function seamName(piece: Piece, segs: readonly Segment[], indices: readonly number[], lengthMm: number): { name: string; onFold: boolean } {
	const box = pathBoundingBox(piece.outline);
	const w = Math.max(box.maxX - box.minX, 1e-9);
	const h = Math.max(box.maxY - box.minY, 1e-9);
	const start = segs[indices[0]].p0;
	const end = segmentEnd(segs[indices[indices.length - 1]]);
	const mid = pointAlong(segs, indices, lengthMm / 2);
	const centre = centreMark(piece);
	const back = /\bback\b/i.test(piece.name) || centre?.name === 'the centre back';
	const centreName = back ? 'centre back' : 'centre front';
	if (pointOnFold(piece, mid)) return { name: `fold (${centreName})`, onFold: true };
	const centreX = piece.foldLine ? (piece.foldLine.from.x + piece.foldLine.to.x) / 2 : (centre?.point.x ?? box.minX);
	const centreLeft = centreX <= (box.minX + box.maxX) / 2;
	const c = centreLeft ? (mid.x - box.minX) / w : (box.maxX - mid.x) / w; // 0 at the centre side, 1 at the outer side
	const v = (mid.y - box.minY) / h; // 0 at the top, 1 at the bottom
	const dx = Math.abs(end.x - start.x);
	const dy = Math.abs(end.y - start.y);
	const vertical = dy >= dx;
	const curved = indices.some((i) => segs[i].kind === 'cubic');
	const panel = /\bpanel\b/i.test(piece.name);
	const hasCentre = Boolean(piece.foldLine || centre) || /\b(front|back|bodice)\b/i.test(piece.name);
	if (!curved && vertical && c < 0.05 && hasCentre && !panel) return { name: centreName, onFold: false };
	if (panel && vertical) return { name: c < 0.5 ? 'panel seam, centre side' : 'panel seam, outer side', onFold: false };
	if (!vertical && v > 0.75) return { name: 'waist', onFold: false };
	if (vertical && c > 0.75 && v > 0.4) return { name: 'side seam', onFold: false };
	if (curved && c > 0.5 && v < 0.7) return { name: 'armhole', onFold: false };
	if (curved && c <= 0.5 && v < 0.4) return { name: 'neckline', onFold: false };
	if (!curved && !vertical && v < 0.4) return { name: 'shoulder', onFold: false };
	const row = v < 0.34 ? 'upper' : v > 0.66 ? 'lower' : 'middle';
	const side = c < 0.34 ? 'centre side' : c > 0.66 ? 'outer side' : 'middle';
	return { name: `${row} edge, ${side}`, onFold: false };
}

/** The point at a length along a seam from its start (clamped to the seam). */
function pointAlong(segs: readonly Segment[], indices: readonly number[], lengthMm: number): Vec {
	let left = Math.max(0, lengthMm);
	for (const i of indices) {
		const l = segmentLength(segs[i]);
		if (left <= l) return segmentPointAt(segs[i], segmentParameterAtLength(segs[i], left, l));
		left -= l;
	}
	return segmentEnd(segs[indices[indices.length - 1]]);
}

/** The piece's seams in outline order, each named; a name used twice gets a number ("armhole 1", "armhole 2"). */
export function pieceSeams(piece: Piece): PieceSeam[] {
	const segs = piece.outline.segments;
	const groups = groupSeams(piece);
	const raw = groups.map((indices) => {
		const lengthMm = indices.reduce((s, i) => s + segmentLength(segs[i]), 0);
		return { indices, lengthMm, ...seamName(piece, segs, indices, lengthMm) };
	});
	const counts = new Map<string, number>();
	for (const r of raw) counts.set(r.name, (counts.get(r.name) ?? 0) + 1);
	const seen = new Map<string, number>();
	const names = raw.map((r) => {
		if ((counts.get(r.name) ?? 0) < 2) return r.name;
		const k = (seen.get(r.name) ?? 0) + 1;
		seen.set(r.name, k);
		return `${r.name} ${k}`;
	});
	return raw.map((r, k) => ({
		name: names[k],
		segmentIndices: r.indices,
		start: segs[r.indices[0]].p0,
		end: segmentEnd(segs[r.indices[r.indices.length - 1]]),
		lengthMm: r.lengthMm,
		onFold: r.onFold,
		startNeighbour: names[(k - 1 + raw.length) % raw.length],
		endNeighbour: names[(k + 1) % raw.length]
	}));
}

/** Which end a distance is measured from. */
export type SeamEnd = 'start' | 'end';

/**
 * The point on a seam at a distance from one of its ends, or why there is none: a distance is never
 * negative and never longer than the seam.
 */
export function seamPointAt(piece: Piece, seam: PieceSeam, from: SeamEnd, distanceMm: number): { ok: true; point: Vec } | { ok: false; message: string } {
	if (!Number.isFinite(distanceMm)) return { ok: false, message: 'Type a length.' };
	if (distanceMm < 0) return { ok: false, message: 'A distance along a seam is never negative: measure from the other end instead.' };
	if (distanceMm > seam.lengthMm + 1e-9) return { ok: false, message: `The ${seam.name} is only ${seam.lengthMm.toFixed(1)} mm long.` };
	const along = from === 'start' ? distanceMm : seam.lengthMm - distanceMm;
	return { ok: true, point: pointAlong(piece.outline.segments, seam.segmentIndices, along) };
}

/** The seam that holds a point of the outline and the point's distance from that seam's start; null off the seams. */
export function seamLocate(piece: Piece, seams: readonly PieceSeam[], p: Vec, toleranceMm = 0.5): { seamIndex: number; fromStartMm: number } | null {
	const loc = outlineNearestLocation(piece.outline, p);
	if (loc.distance > toleranceMm) return null;
	const segs = piece.outline.segments;
	for (let k = 0; k < seams.length; k++) {
		const s = seams[k];
		if (!s.segmentIndices.includes(loc.segmentIndex)) continue;
		return { seamIndex: k, fromStartMm: lengthAlong(segs, s.segmentIndices, loc.segmentIndex, loc.t) };
	}
	// a point at the very end of a leg-adjacent segment may be found on the leg: try the seam ends
	for (let k = 0; k < seams.length; k++) {
		if (vecDistance(seams[k].start, loc.point) <= toleranceMm) return { seamIndex: k, fromStartMm: 0 };
		if (vecDistance(seams[k].end, loc.point) <= toleranceMm) return { seamIndex: k, fromStartMm: seams[k].lengthMm };
	}
	return null;
}
