import {
	outlineArea,
	outlineFromChains,
	outlineNearestPoint,
	outlineSplitAt,
	pathLength,
	pathReverse,
	pointMirrorAcross,
	segmentControlPoints,
	segmentMapPoints,
	type Path,
	type Vec
} from '../kernel';
import type { Piece } from '../piece-schema';
import { dist } from './chain-tools';
import { panelRefuse, panelReport, type PieceResult } from './panel-types';
import { ON_LINE_MM } from './panel-tolerances';
import { pieceMirror, pieceProblems } from './piece-tools';

/**
 * fold: mark a straight edge as place-on-fold (trade-primer §8; a curved edge is refused). unfold: the
 * pattern plus its reflection across the fold, markings mirrored, cut 'single' of the full shape.
 */

/** A fold edge may bow from the straight line by at most this (mm). */
export const FOLD_STRAIGHTNESS_MM = 0.01;

function bow(path: Path, a: Vec, b: Vec): number {
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	const l = Math.hypot(dx, dy);
	let worst = 0;
	for (const s of path.segments) for (const p of segmentControlPoints(s)) worst = Math.max(worst, Math.abs((p.x - a.x) * dy - (p.y - a.y) * dx) / l);
	return worst;
}

/** The outline edge between two points on it (the shorter chain) and the rest, from b back to a. */
function edgeBetween(piece: Piece, a: Vec, b: Vec): { edge: Path; rest: Path } | null {
	const la = outlineNearestPoint(piece.outline, a);
	const lb = outlineNearestPoint(piece.outline, b);
	const chains = outlineSplitAt(piece.outline, [la, lb]);
	if (chains.length !== 2) return null;
	const [c0, c1] = chains;
	return pathLength(c0) <= pathLength(c1) ? { edge: c0, rest: c1 } : { edge: c1, rest: c0 };
}

export function fold(piece: Piece, params: { from: Vec; to: Vec; snapToleranceMm?: number }): PieceResult {
	const tol = params.snapToleranceMm ?? 1;
	const a = outlineNearestPoint(piece.outline, params.from);
	const b = outlineNearestPoint(piece.outline, params.to);
	if (a.distance > tol || b.distance > tol) return panelRefuse('fold_not_on_outline', `Both ends of the fold must be on the outline (within ${tol} mm).`);
	if (dist(a.point, b.point) < 1) return panelRefuse('fold_not_on_outline', 'The fold needs two different ends.');
	const found = edgeBetween(piece, a.point, b.point);
	if (!found) return panelRefuse('fold_not_on_outline', 'The fold ends do not cut the outline into an edge.');
	const bowMm = bow(found.edge, a.point, b.point);
	if (bowMm > FOLD_STRAIGHTNESS_MM) {
		return panelRefuse('fold_edge_curved', `The edge between the fold ends bows ${bowMm.toFixed(2)} mm from straight; a place-on-fold edge must be straight.`);
	}
	return {
		ok: true,
		piece: { ...piece, foldLine: { from: a.point, to: b.point }, cut: 'on_fold' },
		ledgerEntries: [],
		report: panelReport('fold', `${piece.name} is placed on the fold.`, { foldLengthMm: dist(a.point, b.point) })
	};
}

export function unfold(piece: Piece): PieceResult {
	const f = piece.foldLine;
	if (!f) return panelRefuse('no_fold', `${piece.name} has no fold line to unfold across.`);
	const found = edgeBetween(piece, f.from, f.to);
	if (!found || bow(found.edge, f.from, f.to) > FOLD_STRAIGHTNESS_MM) {
		return panelRefuse('fold_edge_curved', 'The fold line does not lie along a straight edge of the outline.');
	}
	const m = (p: Vec) => pointMirrorAcross(p, f.from, f.to);
	const onFold = (p: Vec) => {
		const dx = f.to.x - f.from.x;
		const dy = f.to.y - f.from.y;
		return Math.abs((p.x - f.from.x) * dy - (p.y - f.from.y) * dx) / Math.hypot(dx, dy) <= ON_LINE_MM;
	};
	const mirroredRest = pathReverse({ segments: found.rest.segments.map((s) => segmentMapPoints(s, m)) });
	const outline = outlineFromChains([found.rest, mirroredRest], { snapTolerance: ON_LINE_MM });
	const mir = pieceMirror(piece, m);
	const sfx = (id: string) => `${id}-mirror`;
	const apexOnFold = new Set(piece.apexes.filter((x) => onFold(x.point)).map((x) => x.id));
	const apexId = (id: string) => (apexOnFold.has(id) ? id : sfx(id));
	const next: Piece = {
		...piece,
		outline,
		apexes: [...piece.apexes, ...mir.apexes.filter((x) => !apexOnFold.has(x.id)).map((x) => ({ ...x, id: sfx(x.id) }))],
		darts: [...piece.darts, ...mir.darts.map((d) => ({ ...d, id: sfx(d.id), apexId: apexId(d.apexId) }))],
		pleats: [...piece.pleats, ...mir.pleats.map((p) => ({ ...p, id: sfx(p.id), apexId: apexId(p.apexId) }))],
		notches: [...piece.notches, ...mir.notches.filter((n) => !onFold(n.at)).map((n) => ({ ...n, id: sfx(n.id) }))],
		internalLines: [...piece.internalLines, ...mir.internalLines.map((l) => ({ ...l, id: sfx(l.id) }))],
		drillHoles: [...piece.drillHoles, ...mir.drillHoles.map((h) => ({ ...h, id: sfx(h.id) }))],
		foldLine: null,
		cut: 'single'
	};
	const problems = pieceProblems(next);
	if (problems.length) return panelRefuse('result_broken', `Unfolding would give a broken piece, so nothing was changed: ${problems[0]}`);
	return {
		ok: true,
		piece: next,
		ledgerEntries: [],
		report: panelReport('unfold', `${piece.name} unfolded across its fold: cut single.`, { areaBeforeMm2: outlineArea(piece.outline), areaAfterMm2: outlineArea(outline) })
	};
}

