import { vecDistance, type Vec } from '$lib/geometry';
import { pieceSeams, seamLocate, seamPointAt, type PieceSeam, type SeamEnd } from '$lib/pattern/piece-seams';
import type { Piece } from '$lib/pattern/piece-schema';

/**
 * A new opening point given as a place on a named seam: the seam, the end the distance is measured from
 * and the distance (never negative). This replaces a signed distance round the whole outline, which did not
 * say which way round it ran.
 */
export interface SeamTarget {
	readonly seamName: string;
	readonly from: SeamEnd;
	readonly distanceMm: number;
}

export function seamsOf(piece: Piece): PieceSeam[] {
	return pieceSeams(piece);
}

/** How the form names an end of a seam: by the seam met there ("the neckline end"). */
export function seamEndLabel(seam: PieceSeam, from: SeamEnd): string {
	return `from the ${from === 'start' ? seam.startNeighbour : seam.endNeighbour} end`;
}

/** The place of an outline point on its seam, measured from the nearer end; null off every seam. */
export function seamTargetOf(piece: Piece, seams: readonly PieceSeam[], p: Vec): SeamTarget | null {
	const at = seamLocate(piece, seams, p);
	if (!at) return null;
	const seam = seams[at.seamIndex];
	const fromEnd = Math.max(0, seam.lengthMm - at.fromStartMm);
	const fromStart = Math.max(0, at.fromStartMm);
	return fromStart <= fromEnd
		? { seamName: seam.name, from: 'start', distanceMm: fromStart }
		: { seamName: seam.name, from: 'end', distanceMm: fromEnd };
}

/** The same place as distance from a given end (when the form keeps the end the person chose). */
export function seamTargetFrom(piece: Piece, seams: readonly PieceSeam[], p: Vec, from: SeamEnd): SeamTarget | null {
	const t = seamTargetOf(piece, seams, p);
	if (!t || t.from === from) return t;
	const seam = seams.find((s) => s.name === t.seamName)!;
	return { seamName: t.seamName, from, distanceMm: Math.max(0, seam.lengthMm - t.distanceMm) };
}

/** The outline point of a seam target, or what is wrong with it (unknown seam, the fold, negative, too long). */
export function seamTargetPoint(piece: Piece, seams: readonly PieceSeam[], t: SeamTarget): { ok: true; point: Vec } | { ok: false; message: string } {
	const seam = seams.find((s) => s.name === t.seamName);
	if (!seam) return { ok: false, message: 'Choose a seam.' };
	if (seam.onFold) return { ok: false, message: `The ${seam.name} is the fold line: no dart may open on it.` };
	return seamPointAt(piece, seam, t.from, t.distanceMm);
}

/** A readout of where a point is: "shoulder, 40.0 mm from the neckline end"; the length is never negative. */
export function seamTargetText(piece: Piece, seams: readonly PieceSeam[], p: Vec, fmtLength: (mm: number) => string): string {
	const t = seamTargetOf(piece, seams, p);
	if (!t) return 'not on a seam';
	const seam = seams.find((s) => s.name === t.seamName)!;
	return `${seam.name}, ${fmtLength(t.distanceMm)} ${seamEndLabel(seam, t.from)}`;
}

/**
 * How the pleat form names the two sides of a dart along its seam: leg 2 lies forward in outline order,
 * toward the seam's end; leg 1 backward, toward its start ("toward the armhole end").
 */
export function dartSideLabels(piece: Piece, dart: { leg1End: Vec; leg2End: Vec }): { leg1: string; leg2: string } {
	const seams = pieceSeams(piece);
	// the seam stretch that leaves the dart's leg 2 end
	const segs = piece.outline.segments;
	const seam = seams.find((x) => x.segmentIndices.some((i) => vecDistance(segs[i].p0, dart.leg2End) < 1e-6));
	if (!seam) return { leg1: 'on the leg 1 side', leg2: 'on the leg 2 side' };
	return { leg1: `toward the ${seam.startNeighbour} end`, leg2: `toward the ${seam.endNeighbour} end` };
}
