import {
	outlineFromChains,
	outlineNearestPoint,
	outlineSplitAt,
	pathLength,
	pathPointAtLength,
	pathReverse,
	type Outline,
	type Path,
	type Vec
} from '../kernel';
import type { Piece } from '../piece-schema';
import { dist, pathFirst, pathLast } from './chain-tools';
import { ON_LINE_MM } from './panel-tolerances';

/**
 * Splice two outlines along a stretch they share, from P to Q (points on both outlines, within `tol`).
 * Each outline is cut at P and Q; the part lying on the other outline is dropped; the two remaining
 * chains are joined end to end (ends snapped within `tol`). Both outlines must run the same way round
 * (same sign of area). No polygon union is used, so curves stay curves and no T-junction slivers can
 * appear. Returns null if the stretch is not on both outlines.
 */
export function spliceOutlines(oa: Outline, ob: Outline, P: Vec, Q: Vec, tol: number): Outline | null {
	const rest = (o: Outline, other: Outline): Path | null => {
		const lp = outlineNearestPoint(o, P);
		const lq = outlineNearestPoint(o, Q);
		if (lp.distance > tol || lq.distance > tol) return null;
		const chains = outlineSplitAt(o, [lp, lq]);
		if (chains.length !== 2) return null;
		const onOther = (c: Path) => outlineNearestPoint(other, pathPointAtLength(c, pathLength(c) / 2).point).distance;
		const [d0, d1] = [onOther(chains[0]), onOther(chains[1])];
		if (Math.min(d0, d1) > tol) return null;
		return d0 <= d1 ? chains[1] : chains[0];
	};
	const ra = rest(oa, ob);
	const rb0 = rest(ob, oa);
	if (!ra || !rb0) return null;
	// rb must start where ra ends
	const rb = dist(pathFirst(rb0), pathLast(ra)) <= dist(pathLast(rb0), pathLast(ra)) ? rb0 : pathReverse(rb0);
	if (dist(pathFirst(rb), pathLast(ra)) > tol || dist(pathLast(rb), pathFirst(ra)) > tol) return null;
	return outlineFromChains([ra, rb], { snapTolerance: tol });
}

/** Markings of two pieces put together on a new outline (ids of b made unique where they clash). */
export function mergeMarkings(a: Piece, b: Piece, outline: Outline): Omit<Piece, 'schemaVersion' | 'id' | 'name' | 'outline' | 'cut' | 'fabric'> {
	const uniq = <T extends { id: string }>(xs: readonly T[], ys: readonly T[]): T[] => {
		const ids = new Set(xs.map((x) => x.id));
		return [...xs, ...ys.map((y) => (ids.has(y.id) ? { ...y, id: `${y.id}-${b.id}` } : y))];
	};
	const apexIds = new Set(a.apexes.map((x) => x.id));
	const apexes = [...a.apexes, ...b.apexes.filter((x) => !apexIds.has(x.id))];
	const onOutline = (p: Vec) => outlineNearestPoint(outline, p).distance <= 10 * ON_LINE_MM;
	const foldOf = (p: Piece) => (p.foldLine && onOutline(p.foldLine.from) && onOutline(p.foldLine.to) ? p.foldLine : null);
	const notchesA = a.notches.filter((n) => onOutline(n.at));
	const notchesB = b.notches.filter((n) => onOutline(n.at) && !notchesA.some((m) => dist(m.at, n.at) <= ON_LINE_MM));
	return {
		apexes,
		darts: uniq(a.darts, b.darts),
		pleats: uniq(a.pleats, b.pleats),
		notches: uniq(notchesA, notchesB),
		grainline: a.grainline ?? b.grainline,
		foldLine: foldOf(a) ?? foldOf(b),
		// a changed stitching line: any seam allowance must be added again
		seamAllowance: null,
		internalLines: uniq(a.internalLines, b.internalLines),
		drillHoles: uniq(a.drillHoles, b.drillHoles),
		labels: uniq(a.labels, b.labels)
	};
}
