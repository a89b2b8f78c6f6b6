import { z } from 'zod';
import {
	lineSegment,
	outlineContainsPoint,
	outlineNearestLocation,
	outlineSegmentIntersections,
	outlineSignedArea,
	polygonSignedArea,
	segmentEnd,
	segmentMapPoints,
	segmentPointAt,
	segmentSplitAtMany,
	vecDistance,
	vecLength,
	vecNormalize,
	vecSub,
	type Segment,
	type Vec
} from '../kernel';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import { pieceMetrics } from '../metrics';
import { fmtDeg, fmtMm, refuse, succeed, type OperationResult } from '../operation-result';
import { vecSchema, type Piece } from '../piece-schema';
import { carryMarkings, IDENTITY_MOTION, motionApply, type RigidMotion } from './carry-markings';
import { TARGET_SNAP_TOLERANCE_MM, wedgeLegSegments } from './open-wedges';
import { foldRefusal, pointOnFold } from './still-side';

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });

export const spreadParamsSchema = z.object({
	/** hinged: each slash keeps a hinge at its `to` end; parallel: slashes cut right through. */
	mode: z.enum(['hinged', 'parallel']),
	slashes: z
		.array(
			z.object({
				/** End of the slash on the edge that spreads. */
				from: vecSchema,
				/** Other end: the hinge (hinged) or the second edge (parallel). */
				to: vecSchema,
				/** Hinged: opening angle. */
				angleRad: finite().optional(),
				/** Hinged: opening width at the `from` edge; parallel: spread width. */
				widthMm: finite().optional(),
				id: z.string().min(1).optional()
			})
		)
		.min(1)
		.max(24)
});
export type SpreadParams = z.infer<typeof spreadParamsSchema>;

interface Located {
	readonly i: number;
	readonly t: number;
	readonly pos: number;
	readonly point: Vec;
}

/** Compose motions: first `inner`, then `outer`. */
function motionCompose(outer: RigidMotion, inner: RigidMotion): RigidMotion {
	// result(p) = outer(inner(p)) = R_o(R_i(p − c_i) + c_i + t_i − c_o) + c_o + t_o; express about origin
	const origin = { x: 0, y: 0 };
	const img0 = motionApply(outer, motionApply(inner, origin));
	return { center: origin, angleRad: outer.angleRad + inner.angleRad, offset: img0 };
}

/**
 * spread (primer §2): slash and spread to add fullness. Hinged slashes turn the part beyond each slash
 * about its hinge (one edge lengthens); parallel slashes move it straight across (both edges lengthen).
 * Gaps are bridged with straight lines; the area added is reported against the area asked for.
 */
export function spread(piece: Piece, params: SpreadParams): OperationResult {
	const outline = piece.outline;
	const segs = outline.segments;
	const n = segs.length;
	const legs = wedgeLegSegments(piece);
	const locate = (p: Vec, what: string, k: number): Located | string => {
		const loc = outlineNearestLocation(outline, p);
		if (loc.distance > TARGET_SNAP_TOLERANCE_MM) {
			return `Slash ${k + 1}: its ${what} end (${p.x.toFixed(1)}, ${p.y.toFixed(1)}) is ${fmtMm(loc.distance)} from the outline; both ends must be on the stitching line.`;
		}
		let i = loc.segmentIndex;
		let t = loc.t;
		if (t > 1 - 1e-9) {
			i = (i + 1) % n;
			t = 0;
		} else if (t < 1e-9) t = 0;
		return { i, t, pos: i + t, point: t === 0 ? segs[i].p0 : loc.point };
	};
	const slashes: { from: Located; to: Located; k: number }[] = [];
	for (let k = 0; k < params.slashes.length; k++) {
		const s = params.slashes[k];
		const from = locate(s.from, 'spreading', k);
		if (typeof from === 'string') return refuse('slash_off_outline', from);
		const to = locate(s.to, params.mode === 'hinged' ? 'hinge' : 'far', k);
		if (typeof to === 'string') return refuse('slash_off_outline', to);
		// a slash end on the fold would open it (or, at a hinge, bend it): the fold must stay one straight edge
		for (const end of [from, to]) {
			if (pointOnFold(piece, end.point)) {
				const f = foldRefusal(`Slash ${k + 1}`, end.point);
				return refuse(f.code, f.message);
			}
		}
		if (legs.has(from.i) || (from.t === 0 && legs.has((from.i - 1 + n) % n))) {
			return refuse('target_on_wedge', `Slash ${k + 1} starts on ${legs.get(from.i) ?? legs.get((from.i - 1 + n) % n)}; start it on a seam.`);
		}
		if (vecDistance(from.point, to.point) < 1) return refuse('slash_leaves_piece', `Slash ${k + 1} is shorter than 1 mm.`);
		// the slash must run inside the piece
		const hits = outlineSegmentIntersections(outline, from.point, to.point).filter(
			(h) => vecDistance(h.point, from.point) > 1e-6 && vecDistance(h.point, to.point) > 1e-6
		);
		const mid = { x: (from.point.x + to.point.x) / 2, y: (from.point.y + to.point.y) / 2 };
		if (hits.length > 0 || !outlineContainsPoint(outline, mid)) {
			return refuse(
				'slash_leaves_piece',
				`Slash ${k + 1} from (${from.point.x.toFixed(1)}, ${from.point.y.toFixed(1)}) to (${to.point.x.toFixed(1)}, ${to.point.y.toFixed(1)}) leaves the piece${hits.length ? ` at (${hits[0].point.x.toFixed(1)}, ${hits[0].point.y.toFixed(1)})` : ''}; a slash must run inside the piece from edge to edge.`
			);
		}
		slashes.push({ from, to, k });
	}
	// order the slashes side by side: from₁ … fromₙ … toₙ … to₁ round the outline
	let order: number[] | null = null;
	for (let s0 = 0; s0 < slashes.length && !order; s0++) {
		const base = slashes[s0].from.pos;
		const rel = (p: number) => (((p - base) % n) + n) % n;
		const idx = slashes.map((_, j) => j).sort((a, b) => rel(slashes[a].from.pos) - rel(slashes[b].from.pos));
		const maxFrom = Math.max(...idx.map((j) => rel(slashes[j].from.pos)));
		const minTo = Math.min(...idx.map((j) => rel(slashes[j].to.pos)));
		if (!(maxFrom < minTo)) continue;
		let nested = true;
		for (let q = 1; q < idx.length; q++) if (rel(slashes[idx[q]].to.pos) > rel(slashes[idx[q - 1]].to.pos) + 1e-12) nested = false;
		if (nested) order = idx;
	}
	if (!order) {
		return refuse('slash_lines_cross', 'The slash lines cross or share an end on the spreading edge; draw them side by side, each from the spreading edge to the far edge.');
	}
	const ordered = order.map((j) => slashes[j]);
	const orientation = Math.sign(outlineSignedArea(outline)) || 1;

	// motion of each slash (in the original frame) and what it adds
	const local: RigidMotion[] = [];
	let expectedArea = 0;
	const entries: LedgerEntry[] = [];
	const values: Record<string, number> = {};
	for (let q = 0; q < ordered.length; q++) {
		const { from, to, k } = ordered[q];
		const sp = params.slashes[k];
		const id = sp.id ?? `slash-${k + 1}`;
		const r = vecDistance(from.point, to.point);
		if (params.mode === 'hinged') {
			if ((sp.angleRad === undefined) === (sp.widthMm === undefined)) {
				return refuse('invalid_params', `Slash ${k + 1}: give either the spread angle or the width at the edge (not both).`);
			}
			if (sp.widthMm !== undefined && sp.widthMm >= 2 * r) {
				return refuse('spread_too_wide', `Slash ${k + 1}: a ${fmtMm(sp.widthMm)} opening cannot be made on a ${fmtMm(r)} slash hinged at one end.`);
			}
			const phi = sp.angleRad ?? 2 * Math.asin((sp.widthMm as number) / (2 * r));
			if (!(phi > 0)) return refuse('spread_not_positive', `Slash ${k + 1}: the spread must be more than zero.`);
			if (phi >= Math.PI / 2) return refuse('spread_too_wide', `Slash ${k + 1}: ${fmtDeg(phi)} is too wide for one slash; use more slashes.`);
			let m: RigidMotion = { center: to.point, angleRad: phi, offset: { x: 0, y: 0 } };
			const tri = polygonSignedArea([from.point, motionApply(m, from.point), to.point]);
			if (Math.sign(tri) !== orientation) m = { ...m, angleRad: -phi };
			local.push(m);
			const area = 0.5 * r * r * Math.sin(phi);
			const width = 2 * r * Math.sin(phi / 2);
			expectedArea += area;
			values[`${id}AngleRad`] = phi;
			values[`${id}WidthMm`] = width;
			entries.push(ledgerEntry({ apexId: null, kind: 'fullness', refId: id, label: `fullness added at ${id}: ${fmtDeg(phi)}, ${fmtMm(width)} at the edge`, angleRad: 0, areaMm2: area, lengthMm: width }));
		} else {
			if (sp.widthMm === undefined || sp.angleRad !== undefined) return refuse('invalid_params', `Slash ${k + 1}: a parallel spread needs a width (and no angle).`);
			const w = sp.widthMm;
			if (!(w > 0)) return refuse('spread_not_positive', `Slash ${k + 1}: the spread must be more than zero.`);
			const d = vecNormalize(vecSub(to.point, from.point));
			let v = { x: -d.y * w, y: d.x * w };
			const quad = polygonSignedArea([from.point, { x: from.point.x + v.x, y: from.point.y + v.y }, { x: to.point.x + v.x, y: to.point.y + v.y }, to.point]);
			if (Math.sign(quad) !== orientation) v = { x: -v.x, y: -v.y };
			local.push({ center: { x: 0, y: 0 }, angleRad: 0, offset: v });
			const area = r * w;
			expectedArea += area;
			values[`${id}WidthMm`] = w;
			entries.push(ledgerEntry({ apexId: null, kind: 'fullness', refId: id, label: `fullness added at ${id}: ${fmtMm(w)} parallel`, angleRad: 0, areaMm2: area, lengthMm: 2 * w }));
		}
	}
	// cumulative motions: part 0 fixed, part j = part j−1's motion after slash j's own
	const parts: RigidMotion[] = [IDENTITY_MOTION];
	for (let q = 0; q < local.length; q++) parts.push(motionCompose(parts[q], local[q]));

	// cut the outline at every slash end (as vertices), then rebuild it part by part with bridges
	const m = ordered.length;
	for (let q = 1; q < m; q++) {
		if (vecDistance(ordered[q].from.point, ordered[q - 1].from.point) < 1e-6) {
			return refuse('slash_lines_cross', 'Two slashes start at the same point of the spreading edge; space them apart.');
		}
	}
	type Cut = { i: number; t: number; partAfter: number; rank: number };
	const cuts: Cut[] = [];
	ordered.forEach((sl, q) => {
		cuts.push({ i: sl.from.i, t: sl.from.t, partAfter: q + 1, rank: q });
		cuts.push({ i: sl.to.i, t: sl.to.t, partAfter: q, rank: 2 * m - 1 - q });
	});
	const split: Segment[] = [];
	const cutVertex = new Map<Cut, number>();
	for (let i = 0; i < n; i++) {
		const here = cuts.filter((c) => c.i === i).sort((x, y) => x.t - y.t);
		const ts = [...new Set(here.filter((c) => c.t > 0).map((c) => c.t))];
		const pieces = ts.length ? segmentSplitAtMany(segs[i], ts) : [segs[i]];
		if (pieces.length !== ts.length + 1) return refuse('slash_lines_cross', 'Two slash ends are too close together.');
		for (const c of here) cutVertex.set(c, split.length + (c.t > 0 ? ts.indexOf(c.t) + 1 : 0));
		split.push(...pieces);
	}
	const N = split.length;
	// part that follows each cut vertex: the last cut there in slash order
	const partAt = new Map<number, { part: number; rank: number }>();
	for (const c of cuts) {
		const v = cutVertex.get(c)!;
		const cur = partAt.get(v);
		if (!cur || c.rank > cur.rank) partAt.set(v, { part: c.partAfter, rank: c.rank });
	}
	const startV = cutVertex.get(cuts[0])!;
	const chains: { segs: Segment[]; part: number }[] = [];
	let current: Segment[] = [];
	let currentPart = partAt.get(startV)!.part;
	for (let step = 0; step < N; step++) {
		const v = (startV + step) % N;
		if (step > 0 && partAt.has(v)) {
			chains.push({ segs: current, part: currentPart });
			current = [];
			currentPart = partAt.get(v)!.part;
		}
		current.push(split[v]);
	}
	chains.push({ segs: current, part: currentPart });
	const nonEmpty = chains.filter((c) => c.segs.length > 0);
	const out: Segment[] = [];
	let bridgeLength = 0;
	for (let c = 0; c < nonEmpty.length; c++) {
		const motion = parts[nonEmpty[c].part];
		const mapped = nonEmpty[c].segs.map((s) => segmentMapPoints(s, (p) => motionApply(motion, p)));
		if (out.length) {
			const prevEnd = segmentEnd(out[out.length - 1]);
			const gap = vecDistance(prevEnd, mapped[0].p0);
			if (gap > 1e-6) {
				out.push(lineSegment(prevEnd, mapped[0].p0));
				bridgeLength += gap;
			} else mapped[0] = { ...mapped[0], p0: prevEnd };
		}
		out.push(...mapped);
	}
	const lastEnd = segmentEnd(out[out.length - 1]);
	const closeGap = vecDistance(lastEnd, out[0].p0);
	if (closeGap > 1e-6) {
		out.push(lineSegment(lastEnd, out[0].p0));
		bridgeLength += closeGap;
	} else out[out.length - 1] = { ...out[out.length - 1], ...(out[out.length - 1].kind === 'line' ? { p1: out[0].p0 } : { p3: out[0].p0 }) } as Segment;

	// markings: the part of a point = how many slashes it lies beyond (side of each slash line)
	const sideOf = (q: number, p: Vec) => {
		const { from, to } = ordered[q];
		return Math.sign((to.point.x - from.point.x) * (p.y - from.point.y) - (to.point.y - from.point.y) * (p.x - from.point.x));
	};
	const beyondSign = ordered.map((s, q) => {
		// a point just after the slash's `from` end, on the part beyond it
		const i = s.from.i;
		const t = Math.min(1, s.from.t + 1e-3);
		return sideOf(q, segmentPointAt(segs[i], t));
	});
	const motionForPoint = (p: Vec): RigidMotion => {
		let part = 0;
		while (part < m && sideOf(part, p) === beyondSign[part]) part++;
		return parts[part];
	};
	const carried = carryMarkings(piece, motionForPoint, new Set());
	const next: Piece = { ...piece, ...carried, outline: { segments: out } };
	const actualArea = pieceMetrics(next).areaMm2 - pieceMetrics(piece).areaMm2;
	values.expectedAreaChangeMm2 = expectedArea;
	values.actualAreaChangeMm2 = actualArea;
	values.addedEdgeLengthMm = bridgeLength;
	const notes: string[] = [];
	if (Math.abs(actualArea - expectedArea) > 0.5) {
		notes.push(`The area added (${actualArea.toFixed(1)} mm²) differs from the area asked for (${expectedArea.toFixed(1)} mm²): parts of the piece overlap after spreading.`);
	}
	if (bridgeLength > 0) notes.push('The spread edges are bridged with straight lines: true the edge curve before cutting.');
	return succeed(next, entries, {
		op: 'spread',
		summary: `${ordered.length} ${params.mode} slash${ordered.length > 1 ? 'es' : ''}: area added ${actualArea.toFixed(1)} mm² (asked for ${expectedArea.toFixed(1)} mm²), edge length added ${fmtMm(bridgeLength)}.`,
		values,
		notes
	});
}
