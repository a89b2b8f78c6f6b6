import {
	outlineFromPolyline,
	pathFlatten,
	polygonSignedArea,
	polylineSimplify,
	segmentTangentAt,
	type Outline,
	type Vec
} from '../kernel';
import type { ALLOWANCE_CORNER_KINDS, Piece } from '../piece-schema';
import { allowanceEdges, bridgedOutline, type AllowanceEdge } from './allowance-edges';
import { ClipperLib, CLIPPER_SCALE, fromClipper, toClipper, type IntPath } from './clipper-tools';
import { panelRefuse, panelReport, type PanelFailure } from './panel-types';
import { DEFAULT_ALLOWANCE_MM } from './panel-tolerances';
import type { OperationReport } from '../operation-result';

/**
 * allowance: seam allowance per edge (trade-primer §9; reference-values.md row 21). Each edge's flattened
 * stitching line (0.002 mm) is simplified by RDP to 0.01 mm, offset with clipper-lib at µm scale as an
 * open band with butt ends and round joins (so every point of the cut line along an edge lies at that
 * edge's width); corners are filled per corner: 'mitre' (the two cut lines run on until they meet; longer than
 * 6 widths → squared) or 'square' (cut straight across, perpendicular to the corner's bisector, at the
 * larger of the two widths from the corner; where the mitre is shorter than that, it is the mitre), or
 * 'folded_prev' / 'folded_next' (the allowance of the edge ending / starting at the corner is pressed flat,
 * folded along its stitching line, before the other seam is sewn across it: its end is cut as the other
 * edge's cut line reflected across its stitching line, so that folded it lies flush with that cut line — a
 * hem turned up at a flared side seam, a seam pressed open under a crossing seam). Fold edges get
 * none, and the allowance is trimmed at the fold line so neighbouring edges meet it square. The
 * stitching line is kept as it is; the cut line is returned as a polyline outline.
 */

export type AllowanceCorner = (typeof ALLOWANCE_CORNER_KINDS)[number];

export interface AllowanceParams {
	readonly defaultWidthMm?: number;
	/** Width per edge index (see allowanceEdges); fold edges always get 0. */
	readonly widthsMm?: Readonly<Record<number, number>>;
	/** Corner shape per corner index (corner i is where edge i starts). */
	readonly corners?: Readonly<Record<number, AllowanceCorner>>;
	readonly defaultCorner?: AllowanceCorner;
}

export type AllowanceResult =
	| {
			readonly ok: true;
			readonly piece: Piece;
			readonly stitchingLine: Outline;
			readonly cutLine: readonly Vec[];
			readonly cutOutline: Outline;
			readonly edges: readonly (AllowanceEdge & { readonly widthMm: number })[];
			readonly ledgerEntries: readonly never[];
			readonly report: OperationReport;
	  }
	| PanelFailure;

/** Flattening before simplification (mm) and RDP tolerance (mm, toolchain.md). */
export const ALLOWANCE_FLATTEN_MM = 0.002;
export const ALLOWANCE_SIMPLIFY_MM = 0.01;
/** clipper arc tolerance for the round joins, in mm. */
const ARC_TOLERANCE_MM = 0.002;
/** A mitre longer than this many widths is squared instead. */
const MITRE_LIMIT = 6;

function oriented(path: IntPath): IntPath {
	return ClipperLib.Clipper.Orientation(path) ? path : [...path].reverse();
}

function lineHit(p: Vec, u: Vec, q: Vec, v: Vec): Vec | null {
	const den = u.x * v.y - u.y * v.x;
	if (Math.abs(den) < 1e-12) return null;
	const s = ((q.x - p.x) * v.y - (q.y - p.y) * v.x) / den;
	return { x: p.x + s * u.x, y: p.y + s * u.y };
}

/** Part of a convex polygon with (p − origin)·dir ≤ limit (Sutherland–Hodgman, one plane). */
function clipHalfPlane(poly: readonly Vec[], origin: Vec, dir: Vec, limit: number): Vec[] {
	const f = (p: Vec) => (p.x - origin.x) * dir.x + (p.y - origin.y) * dir.y - limit;
	const out: Vec[] = [];
	for (let i = 0; i < poly.length; i++) {
		const p = poly[i];
		const q = poly[(i + 1) % poly.length];
		const fp = f(p);
		const fq = f(q);
		if (fp <= 0) out.push(p);
		if ((fp < 0 && fq > 0) || (fp > 0 && fq < 0)) {
			const t = fp / (fp - fq);
			out.push({ x: p.x + t * (q.x - p.x), y: p.y + t * (q.y - p.y) });
		}
	}
	return out;
}

/** p reflected across the line through o with unit direction t. */
function reflectAcross(p: Vec, o: Vec, t: Vec): Vec {
	const dx = p.x - o.x;
	const dy = p.y - o.y;
	const along = dx * t.x + dy * t.y;
	return { x: o.x + 2 * along * t.x - dx, y: o.y + 2 * along * t.y - dy };
}

/**
 * Corner fill at V when one edge's allowance is folded (pressed) along its stitching line before the other
 * seam crosses it. Edge 1 ends at V (tangent t1, cut line through A), edge 2 starts there (t2, cut line
 * through B). The other edge's cut line runs on to the pressed edge's stitching line (P0); from there the
 * pressed band is closed by that cut line reflected across the pressed stitching line, out to the pressed
 * band's own cut line (P1). Null when the lines do not meet (edges in line: no corner).
 */
function foldedCornerFill(V: Vec, A: Vec, t1: Vec, B: Vec, t2: Vec, kind: 'folded_prev' | 'folded_next'): Vec[] | null {
	if (kind === 'folded_next') {
		// edge 2 pressed: edge 1's cut line meets edge 2's stitching line at P0, its mirror runs on to edge 2's cut line
		const P0 = lineHit(A, t1, V, t2);
		if (!P0) return null;
		const far = reflectAcross({ x: P0.x + t1.x, y: P0.y + t1.y }, V, t2);
		const P1 = lineHit(P0, { x: far.x - P0.x, y: far.y - P0.y }, B, t2);
		return P1 ? [V, A, P0, P1, B] : null;
	}
	// edge 1 pressed: edge 2's cut line, run back, meets edge 1's stitching line at P0; its mirror runs to edge 1's cut line
	const P0 = lineHit(B, t2, V, t1);
	if (!P0) return null;
	const far = reflectAcross({ x: P0.x - t2.x, y: P0.y - t2.y }, V, t1);
	const P1 = lineHit(P0, { x: far.x - P0.x, y: far.y - P0.y }, A, t1);
	return P1 ? [V, A, P1, P0, B] : null;
}

export function allowance(piece: Piece, params: AllowanceParams = {}): AllowanceResult {
	const def = params.defaultWidthMm ?? DEFAULT_ALLOWANCE_MM;
	const edges = allowanceEdges(piece).map((e) => {
		const w = e.isFold ? 0 : (params.widthsMm?.[e.index] ?? def);
		return { ...e, widthMm: w };
	});
	for (const e of edges) {
		if (!(Number.isFinite(e.widthMm) && e.widthMm >= 0 && e.widthMm <= 100)) {
			return panelRefuse('invalid_params', `Allowance width for edge ${e.index} must be between 0 and 100 mm (got ${e.widthMm}).`);
		}
	}
	const polys = edges.map((e) => polylineSimplify(pathFlatten(e.path, ALLOWANCE_FLATTEN_MM), ALLOWANCE_SIMPLIFY_MM));
	const ring: Vec[] = polys.flatMap((p) => p.slice(0, -1));
	const sign = Math.sign(polygonSignedArea(ring)) || 1;
	const outward = (t: Vec): Vec => (sign > 0 ? { x: t.y, y: -t.x } : { x: -t.y, y: t.x });
	const arcTolerance = ARC_TOLERANCE_MM * CLIPPER_SCALE;
	const single = edges.length === 1;
	if (single && edges[0].widthMm > 0) {
		// one smooth closed edge: a closed offset with round joins is the whole cut line
		const co = new ClipperLib.ClipperOffset(2, arcTolerance);
		co.AddPath(oriented(toClipper(ring)), ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
		const out: ClipperLib.Paths = [];
		co.Execute(out, edges[0].widthMm * CLIPPER_SCALE);
		return finish(piece, edges, out, sign, ring);
	}
	const subjects: IntPath[] = [oriented(toClipper(ring))];
	for (let i = 0; i < edges.length; i++) {
		const e = edges[i];
		if (e.widthMm === 0) continue;
		const co = new ClipperLib.ClipperOffset(2, arcTolerance);
		co.AddPath(toClipper(single ? polys[i].slice(0, -1) : polys[i]), ClipperLib.JoinType.jtRound, single ? ClipperLib.EndType.etClosedLine : ClipperLib.EndType.etOpenButt);
		const out = ([] as ClipperLib.Paths);
		co.Execute(out, e.widthMm * CLIPPER_SCALE);
		for (const p of out) subjects.push(oriented(p));
	}
	if (!single) {
		for (let i = 0; i < edges.length; i++) {
			const e1 = edges[(i - 1 + edges.length) % edges.length];
			const e2 = edges[i];
			const V = e2.path.segments[0].p0;
			const t1 = segmentTangentAt(e1.path.segments[e1.path.segments.length - 1], 1);
			const t2 = segmentTangentAt(e2.path.segments[0], 0);
			const cross = t1.x * t2.y - t1.y * t2.x;
			if (cross * sign <= 0) continue; // concave: the bands cover it
			const n1 = outward(t1);
			const n2 = outward(t2);
			const A = { x: V.x + e1.widthMm * n1.x, y: V.y + e1.widthMm * n1.y };
			const B = { x: V.x + e2.widthMm * n2.x, y: V.y + e2.widthMm * n2.y };
			const kind = params.corners?.[i] ?? params.defaultCorner ?? 'mitre';
			const M = lineHit(A, t1, B, t2);
			const wMax = Math.max(e1.widthMm, e2.widthMm);
			const bx = n1.x + n2.x;
			const by = n1.y + n2.y;
			const bl = Math.hypot(bx, by) || 1;
			const bis = { x: bx / bl, y: by / bl };
			// mitre: the cut lines run on until they meet; squared: cut across the bisector at the larger width;
			// folded: the pressed edge's band runs on to the other cut line reflected across its stitching line
			const folded = kind === 'folded_prev' || kind === 'folded_next' ? foldedCornerFill(V, A, t1, B, t2, kind) : null;
			const quad = folded ?? (M ? [V, A, M, B] : [V, A, B]);
			const fill = clipHalfPlane(quad, V, bis, kind === 'square' ? wMax : MITRE_LIMIT * wMax);
			if (Math.abs(polygonSignedArea(fill)) > 1e-9) subjects.push(oriented(toClipper(fill)));
		}
	}
	const c = new ClipperLib.Clipper();
	c.AddPaths(subjects, ClipperLib.PolyType.ptSubject, true);
	let solution: ClipperLib.Paths = [];
	c.Execute(ClipperLib.ClipType.ctUnion, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
	// trim at fold lines: nothing beyond the fold
	for (const e of edges.filter((x) => x.isFold)) {
		const a = e.path.segments[0].p0;
		const s = e.path.segments[e.path.segments.length - 1];
		const b = s.kind === 'line' ? s.p1 : s.p3;
		const len = Math.hypot(b.x - a.x, b.y - a.y);
		const t = { x: (b.x - a.x) / len, y: (b.y - a.y) / len };
		const n = outward(t);
		const L = 1e4;
		const cutAway = [
			{ x: a.x - L * t.x, y: a.y - L * t.y },
			{ x: b.x + L * t.x, y: b.y + L * t.y },
			{ x: b.x + L * t.x + L * n.x, y: b.y + L * t.y + L * n.y },
			{ x: a.x - L * t.x + L * n.x, y: a.y - L * t.y + L * n.y }
		];
		const d = new ClipperLib.Clipper();
		d.AddPaths(solution, ClipperLib.PolyType.ptSubject, true);
		d.AddPath(oriented(toClipper(cutAway)), ClipperLib.PolyType.ptClip, true);
		const next = ([] as ClipperLib.Paths);
		d.Execute(ClipperLib.ClipType.ctDifference, next, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
		solution = next;
	}
	return finish(piece, edges, solution, sign, ring);
}

function finish(
	piece: Piece,
	edges: (AllowanceEdge & { widthMm: number })[],
	solution: ClipperLib.Paths,
	sign: number,
	ring: readonly Vec[]
): AllowanceResult {
	// The union holds the whole stitching line, so the cut line is the boundary of the one region that
	// contains it: any hole lies in the allowance band (a gap where bands meet at a concave corner) and is
	// filled; a region apart from the piece can only be a stray lobe of a corner fill and is left out.
	const inside = (p: ClipperLib.Path) => ClipperLib.Clipper.PointInPolygon(toClipper([ring[0]])[0], p) !== 0;
	const area = (p: ClipperLib.Path) => Math.abs(ClipperLib.Clipper.Area(p)) / (CLIPPER_SCALE * CLIPPER_SCALE);
	const outer = solution.filter((p) => ClipperLib.Clipper.Orientation(p)).sort((a, b) => area(b) - area(a));
	const main = outer.find(inside) ?? outer[0];
	if (!main) return panelRefuse('allowance_failed', 'The allowance could not be built for this piece; check the widths against its narrow parts.');
	outer.splice(0, outer.length, main);
	let cutLine = fromClipper(outer[0]);
	if (Math.sign(polygonSignedArea(cutLine)) !== sign) cutLine = cutLine.reverse();
	return {
		ok: true,
		piece,
		stitchingLine: bridgedOutline(piece),
		cutLine,
		cutOutline: outlineFromPolyline(cutLine),
		edges,
		ledgerEntries: [],
		report: panelReport(
			'allowance',
			`Seam allowance added to ${piece.name} (${edges.length} edge(s)).`,
			{ cutLineVertices: cutLine.length, cutAreaMm2: Math.abs(polygonSignedArea(cutLine)) },
			edges.filter((e) => e.isFold).length ? ['No allowance on the fold.'] : []
		)
	};
}
