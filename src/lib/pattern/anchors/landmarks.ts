import { segmentEnd, vecDistance, type Vec } from '../kernel';
import { pieceSeams, type PieceSeam } from '../piece-seams';
import type { Piece } from '../piece-schema';

/**
 * The named landmarks of a piece, read from its shape the way a pattern cutter names them: every apex
 * (bust point, dart pivot, divergence point) by its id, and every corner of the stitching line by the two
 * seams that meet there, with the trade's name where the pair has one (the side neck point is where the
 * neckline meets the shoulder). A drafted block of another size has the same landmarks under the same
 * names, which is what lets a step be found again on it.
 */

export interface Landmark {
	readonly name: string;
	readonly point: Vec;
	readonly kind: 'apex' | 'corner' | 'point';
	/** Where on the outline it is: the start (or end) of that segment (corners and points). */
	readonly at?: { readonly segment: number; readonly end: boolean };
}

/** Trade names of the corners the drafts make, keyed by the two seams in either order. */
const CORNER_NAMES: Readonly<Record<string, string>> = {
	'neckline|shoulder': 'side neck point',
	'shoulder|armhole': 'shoulder point',
	'armhole|side seam': 'underarm',
	'side seam|waist': 'side waist',
	'waist|centre front': 'centre front waist',
	'waist|fold (centre front)': 'centre front waist',
	'waist|centre back': 'centre back waist',
	'waist|fold (centre back)': 'centre back waist',
	'centre front|neckline': 'centre front neck',
	'fold (centre front)|neckline': 'centre front neck',
	'centre back|neckline': 'nape',
	'fold (centre back)|neckline': 'nape'
};

/** A corner's name: the trade's where it has one, else "<seam> / <seam>" in outline order. */
export function cornerName(before: string, after: string): string {
	const bare = (s: string) => s.replace(/ \d+$/, '');
	const k1 = `${bare(before)}|${bare(after)}`;
	const k2 = `${bare(after)}|${bare(before)}`;
	const known = CORNER_NAMES[k1] ?? CORNER_NAMES[k2];
	// a trade name is only used when neither seam name was numbered (a repeated seam makes it ambiguous)
	if (known && bare(before) === before && bare(after) === after) return known;
	return `${before} / ${after}`;
}

/** The piece's landmarks: apexes first, then corners in outline order; a name used twice gets a number. */
export function pieceLandmarks(piece: Piece, seams: readonly PieceSeam[] = pieceSeams(piece)): Landmark[] {
	const out: Landmark[] = piece.apexes.map((a) => ({ name: a.id, point: a.point, kind: 'apex' as const }));
	const corners: Landmark[] = [];
	const segs = piece.outline.segments;
	for (let k = 0; k < seams.length; k++) {
		const prev = seams[(k - 1 + seams.length) % seams.length];
		const here = seams[k];
		const first = here.segmentIndices[0];
		if (seams.length >= 2) corners.push({ name: cornerName(prev.name, here.name), point: here.start, kind: 'corner', at: { segment: first, end: false } });
		// the points between a seam's segments, and either side of a dart or pleat mouth it runs across
		let n = 0;
		for (let j = 0; j < here.segmentIndices.length - 1; j++) {
			const i = here.segmentIndices[j];
			const next = here.segmentIndices[j + 1];
			const end = segmentEnd(segs[i]);
			corners.push({ name: `${here.name}, point ${++n}`, point: end, kind: 'point', at: { segment: i, end: true } });
			if (vecDistance(end, segs[next].p0) > 1e-9) corners.push({ name: `${here.name}, point ${++n}`, point: segs[next].p0, kind: 'point', at: { segment: next, end: false } });
		}
	}
	const count = new Map<string, number>();
	for (const c of corners) count.set(c.name, (count.get(c.name) ?? 0) + 1);
	const seen = new Map<string, number>();
	for (const c of corners) {
		if ((count.get(c.name) ?? 0) < 2) out.push(c);
		else {
			const n = (seen.get(c.name) ?? 0) + 1;
			seen.set(c.name, n);
			out.push({ ...c, name: `${c.name} ${n}` });
		}
	}
	return out;
}

/** The landmark at a point (within toleranceMm), apexes before corners; null when none is there. */
export function landmarkAt(landmarks: readonly Landmark[], p: Vec, toleranceMm: number): Landmark | null {
	let best: Landmark | null = null;
	let bestD = toleranceMm;
	for (const l of landmarks) {
		const d = vecDistance(l.point, p);
		if (d <= bestD && (best === null || d < bestD)) {
			best = l;
			bestD = d;
		}
	}
	return best;
}
