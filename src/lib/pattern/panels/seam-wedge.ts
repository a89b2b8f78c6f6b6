import { pathLength, pathNearestPoint, pathReverse, pathSplitAt, vecAngleBetween, type Path, type Vec } from '../kernel';
import type { Apex, Piece } from '../piece-schema';
import { chainsDeviation, dist, pathFirst, pathLast } from './chain-tools';

/**
 * The shape of a seam pair laid out flat: edges that coincide all along, or coincide up to a divergence
 * point D and then open as a wedge with apex D (trade-primer §6, "Merging panels").
 */

export interface SeamWedge {
	readonly apex: Apex;
	/** Parts that coincide, each running from the shared far end to D (whichever way the edges were given); null when the edges meet only at D. */
	readonly sharedA: Path | null;
	readonly sharedB: Path | null;
	/** Parts that diverge, each running from D outward. */
	readonly openA: Path;
	readonly openB: Path;
	/** Signed rotation about D that turns openB's chord onto openA's. */
	readonly closingRotationRad: number;
	readonly angleRad: number;
}

/** Orient b to run the same way as a (by their nearest ends). */
export function orientLike(a: Path, b: Path): Path {
	const same = Math.min(dist(pathFirst(a), pathFirst(b)), dist(pathLast(a), pathLast(b)));
	const other = Math.min(dist(pathFirst(a), pathLast(b)), dist(pathLast(a), pathFirst(b)));
	return other < same ? pathReverse(b) : b;
}

function splitAtPoint(p: Path, D: Vec): [Path | null, Path | null] {
	const loc = pathNearestPoint(p, D);
	const parts = pathSplitAt(p, [loc]);
	const total = pathLength(p);
	if (dist(pathFirst(p), D) < 1e-6) return [null, p];
	if (dist(pathLast(p), D) < 1e-6) return [p, null];
	if (parts.length === 1) return pathLength(parts[0]) >= total / 2 ? [null, p] : [p, null];
	return [parts[0], parts[1]];
}

/** Divergence apexes (of either piece) lying on both edges. */
export function divergenceCandidates(a: Piece, b: Piece, ea: Path, eb: Path, tol: number): Apex[] {
	const out: Apex[] = [];
	for (const apex of [...a.apexes, ...b.apexes]) {
		if (apex.kind !== 'divergence') continue;
		if (out.some((o) => dist(o.point, apex.point) <= tol)) continue;
		if (pathNearestPoint(ea, apex.point).distance <= tol && pathNearestPoint(eb, apex.point).distance <= tol) out.push(apex);
	}
	return out;
}

/** The wedge at a divergence apex, or a message saying why the edges do not form one. */
export function seamWedge(ea: Path, ebIn: Path, apex: Apex, tol: number): SeamWedge | string {
	const eb = orientLike(ea, ebIn);
	const D = apex.point;
	const [a1, a2] = splitAtPoint(ea, D);
	const [b1, b2] = splitAtPoint(eb, D);
	const coincide = (x: Path | null, y: Path | null) => x !== null && y !== null && chainsDeviation(x, y) <= tol;
	let sharedA: Path | null = null;
	let sharedB: Path | null = null;
	let openA: Path | null;
	let openB: Path | null;
	if (coincide(a1, b1)) {
		[sharedA, sharedB, openA, openB] = [a1, b1, a2, b2];
	} else if (coincide(a2, b2)) {
		[sharedA, sharedB, openA, openB] = [pathReverse(a2!), pathReverse(b2!), a1 ? pathReverse(a1) : null, b1 ? pathReverse(b1) : null];
	} else if (!a1 && !b1) {
		[openA, openB] = [a2, b2];
	} else if (!a2 && !b2) {
		[openA, openB] = [a1 ? pathReverse(a1) : null, b1 ? pathReverse(b1) : null];
	} else {
		return `the edges neither coincide on one side of ${apex.label || apex.id} nor meet there`;
	}
	if (!openA || !openB) return `the edges do not open from ${apex.label || apex.id}`;
	const ua = { x: pathLast(openA).x - D.x, y: pathLast(openA).y - D.y };
	const ub = { x: pathLast(openB).x - D.x, y: pathLast(openB).y - D.y };
	const closing = vecAngleBetween(ub, ua);
	return { apex, sharedA, sharedB, openA, openB, closingRotationRad: closing, angleRad: Math.abs(closing) };
}
