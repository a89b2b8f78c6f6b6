import { pathLength, pathReverse, vecDistance, type Path, type Vec } from '$lib/geometry';
import { edgeEnds, edgeInOrder } from '$lib/pattern/panels/seam-edge-ends';
import type { SeamPair } from '$lib/pattern/panels';
import type { Piece } from '$lib/pattern/piece-schema';
import { piecesForStep } from '$lib/pattern/recipe/registry';
import type { SeamPairInfo } from '../api';
import type { MoveContext } from './context';
import type { PointerInfo } from './types';

/** Seam pairs for join, carry and true seam: stored pairs of the style, or two edges picked by clicking. */

const first = (p: Path): Vec => p.segments[0].p0;
const last = (p: Path): Vec => {
	const s = p.segments[p.segments.length - 1];
	return s.kind === 'line' ? s.p1 : s.p3;
};

export { edgeEnds, edgeInOrder };

/** The shorter stretch of the outline between two clicked points, in click order. */
export function edgeBetween(piece: Piece, from: Vec, to: Vec): Path {
	const fwd = edgeInOrder(piece, from, to);
	const back = edgeInOrder(piece, to, from);
	return pathLength(fwd) <= pathLength(back) ? fwd : pathReverse(back);
}

/** Edge b turned to run the same way as edge a (both start at the shared start of the seam). */
export function orientAs(a: Path, b: Path): Path {
	const same = vecDistance(first(a), first(b)) + vecDistance(last(a), last(b));
	const flipped = vecDistance(first(a), last(b)) + vecDistance(last(a), first(b));
	return flipped < same ? pathReverse(b) : b;
}

/**
 * The pieces for a panel operation (which finds pieces by their geometry id): each keeps its own id
 * unless two share one; `pairFor` turns a pair of editor keys into a pair of those ids.
 */
export function opPieces(ctx: MoveContext, keys: readonly string[]) {
	const given: Piece[] = [];
	for (const k of keys) {
		const g = ctx.piece(k)?.geometry;
		if (!g) return null;
		given.push(g);
	}
	// the server gives the sources their step ids by the same rule (recipe registry)
	const pieces = piecesForStep(given);
	const idOf = new Map(keys.map((k, i) => [k, pieces[i].id]));
	const pairFor = (p: SeamPair): SeamPair => ({ ...p, a: { ...p.a, pieceId: idOf.get(p.a.pieceId) ?? p.a.pieceId }, b: { ...p.b, pieceId: idOf.get(p.b.pieceId) ?? p.b.pieceId } });
	return { pieces, pairFor };
}

export function storedPairUsable(ctx: MoveContext, sp: SeamPairInfo, editable = true): boolean {
	const a = ctx.piece(sp.aPieceId);
	const b = ctx.piece(sp.bPieceId);
	return !!a && !!b && !a.retired && !b.retired && (!editable || (!a.readOnly && !b.readOnly));
}

export function storedPair(ctx: MoveContext, sp: SeamPairInfo): SeamPair | null {
	const a = ctx.piece(sp.aPieceId);
	const b = ctx.piece(sp.bPieceId);
	if (!a || !b) return null;
	const ea = edgeInOrder(a.geometry, sp.aEdge.from, sp.aEdge.to);
	const eb = orientAs(ea, edgeInOrder(b.geometry, sp.bEdge.from, sp.bEdge.to));
	return { id: sp.id, a: { pieceId: a.key, edge: ea }, b: { pieceId: b.key, edge: eb }, allowedEaseMm: sp.allowedEaseMm, toleranceMm: sp.toleranceMm };
}

/** What join and true seam pick: a stored seam pair, or four edge ends clicked on the canvas. */
export interface SeamPick {
	seamPairId: string | null;
	edgePicks: { pieceKey: string; at: Vec }[];
}

/** The seam the move works on: the chosen stored pair, else the four clicked edge ends. */
export function chosenPair(ctx: MoveContext, st: SeamPick): { pair: SeamPair; label: string } | null {
	const sp = ctx.seamPairs.find((x) => x.id === st.seamPairId);
	if (sp) {
		const pair = storedPair(ctx, sp);
		return pair ? { pair, label: sp.label || 'seam' } : null;
	}
	const e = st.edgePicks;
	if (e.length < 4 || e[0].pieceKey !== e[1].pieceKey || e[2].pieceKey !== e[3].pieceKey || e[0].pieceKey === e[2].pieceKey) return null;
	const a = ctx.piece(e[0].pieceKey);
	const b = ctx.piece(e[2].pieceKey);
	if (!a || !b) return null;
	const ea = edgeBetween(a.geometry, e[0].at, e[1].at);
	const eb = orientAs(ea, edgeBetween(b.geometry, e[2].at, e[3].at));
	return { pair: { id: 'picked-seam', a: { pieceId: a.key, edge: ea }, b: { pieceId: b.key, edge: eb }, allowedEaseMm: 0, toleranceMm: 0.5 }, label: 'picked seam' };
}

/** Click on an outline: collect the two ends of edge a, then of edge b (a stored pair is dropped). */
export function pickEdgeEnd(ctx: MoveContext, st: SeamPick, p: PointerInfo): boolean {
	const h = p.hit;
	if (!h || !(h.kind === 'edge' || h.kind === 'point')) return false;
	const picks = st.edgePicks.length >= 4 ? [] : st.edgePicks;
	// the second end must be on the same piece as the first; the third on another piece
	if (picks.length % 2 === 1 && picks[picks.length - 1].pieceKey !== h.pieceKey) return false;
	if (picks.length === 2 && picks[0].pieceKey === h.pieceKey) return false;
	st.seamPairId = null;
	st.edgePicks = [...picks, { pieceKey: h.pieceKey, at: h.local }];
	ctx.select(h.pieceKey);
	return true;
}

/** Default: the first stored seam pair whose pieces are both here (and editable). */
export function firstUsablePair(ctx: MoveContext, editable = true): string | null {
	return ctx.seamPairs.find((sp) => storedPairUsable(ctx, sp, editable))?.id ?? null;
}

/** The seam pair selected on the table (if its pieces can be changed), else the one given. */
export function selectedPairOr(ctx: MoveContext, fallback: string | null): string | null {
	const sel = ctx.seamPairs.find((sp) => sp.id === ctx.selection.seamPairId);
	if (sel && storedPairUsable(ctx, sel, true)) return sel.id;
	// two panels picked together: the pair that joins them
	const [a, b] = ctx.selection.panels;
	const joining = ctx.selection.panels.length === 2 ? ctx.seamPairs.find((sp) => (sp.aPieceId === a && sp.bPieceId === b) || (sp.aPieceId === b && sp.bPieceId === a)) : undefined;
	return joining?.id ?? fallback;
}

/** Overlay points of the seam, in world mm. */
export function pairOverlay(ctx: MoveContext, pair: SeamPair): { a: Vec[]; b: Vec[] } {
	const w = (key: string, path: Path): Vec[] => {
		const o = ctx.piece(key)?.offset ?? { x: 0, y: 0 };
		const pts: Vec[] = [first(path)];
		for (const seg of path.segments) {
			if (seg.kind === 'line') pts.push(seg.p1);
			else for (let i = 1; i <= 12; i++) pts.push(cubicAt(seg.p0, seg.p1, seg.p2, seg.p3, i / 12));
		}
		return pts.map((q) => ({ x: q.x + o.x, y: q.y + o.y }));
	};
	return { a: w(pair.a.pieceId, pair.a.edge), b: w(pair.b.pieceId, pair.b.edge) };
}

function cubicAt(p0: Vec, p1: Vec, p2: Vec, p3: Vec, t: number): Vec {
	const u = 1 - t;
	const a = u * u * u, b = 3 * u * u * t, c = 3 * u * t * t, d = t * t * t;
	return { x: a * p0.x + b * p1.x + c * p2.x + d * p3.x, y: a * p0.y + b * p1.y + c * p2.y + d * p3.y };
}

export { first as pathStart, last as pathEnd };

/** Edges are picked on the canvas: a click adds an edge end. */
export function seamPickDown(ctx: MoveContext, st: SeamPick, p: PointerInfo): boolean {
	pickEdgeEnd(ctx, st, p);
	return false;
}
