import { outlineReverse, segmentMapPoints, type Vec } from '../kernel';
import { resultProblems } from '../operation-result';
import type { Dart, LegSide, Piece, Pleat } from '../piece-schema';

/** Piece-level helpers of the panel operations: move every point, reverse, check. */

const other = (s: LegSide): LegSide => (s === 'leg1' ? 'leg2' : 'leg1');

/** Every point of a piece mapped by `f` (rigid motions, mirror). Leg order is not touched. */
export function pieceMapPoints(piece: Piece, f: (p: Vec) => Vec): Piece {
	const line = (m: { from: Vec; to: Vec }) => ({ from: f(m.from), to: f(m.to) });
	return {
		...piece,
		outline: { segments: piece.outline.segments.map((s) => segmentMapPoints(s, f)) },
		apexes: piece.apexes.map((a) => ({ ...a, point: f(a.point) })),
		darts: piece.darts.map((d) => ({
			...d,
			leg1End: f(d.leg1End),
			leg2End: f(d.leg2End),
			pullBack: d.pullBack ? { ...d.pullBack, sewnPoint: f(d.pullBack.sewnPoint) } : undefined,
			cap: d.cap
				? { ...d.cap, peak: f(d.cap.peak), edges: { segments: d.cap.edges.segments.map((s) => segmentMapPoints(s, f)) } }
				: undefined
		})),
		pleats: piece.pleats.map((p) => ({
			...p,
			leg1End: f(p.leg1End),
			leg2End: f(p.leg2End),
			pivot1: p.pivot1 ? f(p.pivot1) : undefined,
			pivot2: p.pivot2 ? f(p.pivot2) : undefined,
			foldLine: line(p.foldLine),
			placementLine: line(p.placementLine),
			foldArrow: line(p.foldArrow)
		})),
		notches: piece.notches.map((n) => ({ ...n, at: f(n.at) })),
		grainline: piece.grainline ? { ...piece.grainline, from: f(piece.grainline.from), to: f(piece.grainline.to) } : null,
		foldLine: piece.foldLine ? line(piece.foldLine) : null,
		internalLines: piece.internalLines.map((l) => ({
			...l,
			path: { segments: l.path.segments.map((s) => segmentMapPoints(s, f)) }
		})),
		drillHoles: piece.drillHoles.map((h) => ({ ...h, at: f(h.at) })),
		labels: piece.labels.map((l) => ({ ...l, at: f(l.at) }))
	};
}

function dartSwapLegs(d: Dart): Dart {
	return {
		...d,
		leg1End: d.leg2End,
		leg2End: d.leg1End,
		movingLeg: other(d.movingLeg),
		pressToward: d.pressToward ? other(d.pressToward) : undefined,
		cap: d.cap ? { ...d.cap, pressToward: other(d.cap.pressToward) } : undefined
	};
}

function pleatSwapLegs(p: Pleat): Pleat {
	return { ...p, leg1End: p.leg2End, leg2End: p.leg1End, pivot1: p.pivot2, pivot2: p.pivot1, foldToward: other(p.foldToward) };
}

/** The same piece with its outline travelled the other way (dart and pleat legs swapped to match). */
export function pieceReverse(piece: Piece): Piece {
	return {
		...piece,
		outline: outlineReverse(piece.outline),
		darts: piece.darts.map(dartSwapLegs),
		pleats: piece.pleats.map(pleatSwapLegs)
	};
}

/** Mirror image of a piece (outline reversed so it keeps its sense of travel; legs swapped). */
export function pieceMirror(piece: Piece, f: (p: Vec) => Vec): Piece {
	return pieceReverse(pieceMapPoints(piece, f));
}

/**
 * Problems that make a panel operation refuse: the kernel's outline checks and the piece's structure,
 * as for every operation (resultProblems; touching at an apex is allowed). `selfIntersection: false`
 * leaves out the crossing search, for parts that are simple by construction.
 */
export function pieceProblems(piece: Piece, options: { selfIntersection?: boolean } = {}): string[] {
	if (options.selfIntersection === false) return resultProblems(piece, options);
	const cached = fullCheckCache.get(piece);
	if (cached) return cached;
	const problems = resultProblems(piece);
	fullCheckCache.set(piece, problems);
	return problems;
}

/**
 * Pieces are immutable data: the full check of one piece object is kept (weakly) and reused, e.g. while
 * a style line is dragged across unchanged panels.
 */
const fullCheckCache = new WeakMap<Piece, string[]>();

export function rotateFn(center: Vec, angleRad: number): (p: Vec) => Vec {
	const c = Math.cos(angleRad);
	const s = Math.sin(angleRad);
	return (p) => {
		const dx = p.x - center.x;
		const dy = p.y - center.y;
		return { x: center.x + c * dx - s * dy, y: center.y + s * dx + c * dy };
	};
}
