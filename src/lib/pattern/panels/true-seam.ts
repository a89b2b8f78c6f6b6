import { pathReverse, segmentTangentAt, type Path, type Segment, type Vec } from '../kernel';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import type { OperationReport } from '../operation-result';
import type { Notch, Piece } from '../piece-schema';
import { chainDeviation, dist, pathLast } from './chain-tools';
import { panelRefuse, panelReport, type PanelFailure, type SeamPair } from './panel-types';
import { ON_LINE_MM, SEAM_SNAP_MM } from './panel-tolerances';
import { pieceProblems } from './piece-tools';
import { sewnLength, sewnPointAt } from './seam-measure';

/**
 * true_seam (trade-primer §7): measure both edges of a seam pair with darts and pleats folded out,
 * compare the difference a − b with the allowed ease, optionally move one end of one edge along its
 * own direction until the difference is the allowed ease, and walk the edges to place matching notches
 * at the same sewn arc length from a shared end (one notch front, two back: `count`).
 */

export interface TrueSeamParams {
	/** Which edge end to move so the seam matches (omit to measure only). */
	readonly adjust?: { readonly side: 'a' | 'b'; readonly end: 'start' | 'end' };
	/** Notches at these sewn lengths from the shared reference end. */
	readonly notches?: readonly { readonly atMm: number; readonly count?: 1 | 2 }[];
	/** The end both notch lengths are measured from (default: the end that is not adjusted, else 'start'). */
	readonly notchFrom?: 'start' | 'end';
}

export interface SeamLengths {
	readonly aMm: number;
	readonly bMm: number;
	/** a − b */
	readonly differenceMm: number;
	readonly allowedEaseMm: number;
	/** |difference − allowed ease| */
	readonly deviationMm: number;
	readonly withinTolerance: boolean;
}

export type TrueSeamResult =
	| {
			readonly ok: true;
			readonly pieces: readonly Piece[];
			readonly seamPairs: readonly SeamPair[];
			readonly before: SeamLengths;
			readonly after: SeamLengths;
			readonly ledgerEntries: readonly LedgerEntry[];
			readonly report: OperationReport;
	  }
	| PanelFailure;

function lengths(a: Piece, b: Piece, pair: SeamPair): SeamLengths {
	const aMm = sewnLength(a, pair.a.edge);
	const bMm = sewnLength(b, pair.b.edge);
	const deviation = Math.abs(aMm - bMm - pair.allowedEaseMm);
	return { aMm, bMm, differenceMm: aMm - bMm, allowedEaseMm: pair.allowedEaseMm, deviationMm: deviation, withinTolerance: deviation <= pair.toleranceMm };
}

const moveStart = (s: Segment, d: Vec): Segment =>
	s.kind === 'line'
		? { ...s, p0: { x: s.p0.x + d.x, y: s.p0.y + d.y } }
		: { ...s, p0: { x: s.p0.x + d.x, y: s.p0.y + d.y }, p1: { x: s.p1.x + d.x, y: s.p1.y + d.y } };
const moveEnd = (s: Segment, d: Vec): Segment =>
	s.kind === 'line'
		? { ...s, p1: { x: s.p1.x + d.x, y: s.p1.y + d.y } }
		: { ...s, p2: { x: s.p2.x + d.x, y: s.p2.y + d.y }, p3: { x: s.p3.x + d.x, y: s.p3.y + d.y } };

/** Move the edge's end vertex V along the edge's own direction by s mm (outline and edge together). */
function movedEnd(piece: Piece, edge: Path, end: 'start' | 'end', s: number): { piece: Piece; edge: Path } | string {
	const e = end === 'end' ? edge : pathReverse(edge);
	const V = pathLast(e);
	const last = e.segments[e.segments.length - 1];
	const out = segmentTangentAt(last, 1);
	const d = { x: out.x * s, y: out.y * s };
	const segs = [...piece.outline.segments];
	const n = segs.length;
	const i = segs.findIndex((g) => dist(g.p0, V) <= ON_LINE_MM);
	if (i < 0) return 'the seam end is not a corner of the outline';
	const iIn = (i - 1 + n) % n;
	segs[iIn] = moveEnd(segs[iIn], d);
	segs[i] = moveStart(segs[i], d);
	const es = [...e.segments];
	es[es.length - 1] = moveEnd(last, d);
	const newEdge: Path = { segments: es };
	return { piece: { ...piece, outline: { segments: segs } }, edge: end === 'end' ? newEdge : pathReverse(newEdge) };
}

export function trueSeam(pieces: readonly Piece[], pair: SeamPair, params: TrueSeamParams = {}): TrueSeamResult {
	let a = pieces.find((p) => p.id === pair.a.pieceId);
	let b = pieces.find((p) => p.id === pair.b.pieceId);
	if (!a || !b) return panelRefuse('invalid_params', `The seam pair "${pair.id}" names pieces that were not given.`);
	for (const [p, e] of [[a, pair.a.edge], [b, pair.b.edge]] as const) {
		const off = chainDeviation(e, p.outline);
		if (off > SEAM_SNAP_MM) return panelRefuse('seam_not_on_piece', `The seam edge is ${off.toFixed(2)} mm off the outline of ${p.name}.`);
	}
	const before = lengths(a, b, pair);
	let seamPair = pair;
	const notes: string[] = [];
	if (params.adjust) {
		const { side, end } = params.adjust;
		const piece = side === 'a' ? a : b;
		const edge = side === 'a' ? pair.a.edge : pair.b.edge;
		const target = side === 'a' ? before.bMm + pair.allowedEaseMm : before.aMm - pair.allowedEaseMm;
		const f = (s: number) => {
			const m = movedEnd(piece, edge, end, s);
			return typeof m === 'string' ? m : { ...m, len: sewnLength(m.piece, m.edge) };
		};
		let s0 = 0;
		let f0 = sewnLength(piece, edge) - target;
		let s1 = -f0;
		let best = f(s1);
		if (typeof best === 'string') return panelRefuse('seam_end_not_at_vertex', `Cannot move the ${end} of edge ${side}: ${best}.`);
		for (let k = 0; k < 30 && Math.abs(best.len - target) > 1e-7; k++) {
			const f1 = best.len - target;
			const s2 = f1 === f0 ? s1 : s1 - (f1 * (s1 - s0)) / (f1 - f0);
			[s0, f0, s1] = [s1, f1, s2];
			const next = f(s1);
			if (typeof next === 'string') return panelRefuse('seam_end_not_at_vertex', next);
			best = next;
		}
		const problems = pieceProblems(best.piece);
		if (problems.length) return panelRefuse('result_broken', `Moving the seam end would break ${piece.name}: ${problems[0]}`);
		if (side === 'a') {
			a = best.piece;
			seamPair = { ...seamPair, a: { ...seamPair.a, edge: best.edge } };
		} else {
			b = best.piece;
			seamPair = { ...seamPair, b: { ...seamPair.b, edge: best.edge } };
		}
		notes.push(`The ${end} of ${piece.name}'s edge moved by ${s1.toFixed(2)} mm along the seam.`);
	}
	const after = lengths(a, b, seamPair);
	if (params.notches?.length) {
		const from = params.notchFrom ?? (params.adjust?.end === 'start' ? 'end' : 'start');
		const ea = from === 'start' ? seamPair.a.edge : pathReverse(seamPair.a.edge);
		const eb = from === 'start' ? seamPair.b.edge : pathReverse(seamPair.b.edge);
		const la = sewnLength(a, ea);
		const lb = sewnLength(b, eb);
		for (const [k, nt] of params.notches.entries()) {
			if (!(nt.atMm > 0 && nt.atMm < Math.min(la, lb))) {
				return panelRefuse('invalid_params', `Notch ${k + 1} at ${nt.atMm} mm is not on the seam (0 to ${Math.min(la, lb).toFixed(1)} mm).`);
			}
		}
		const mk = (p: Piece, e: Path): Notch[] =>
			params.notches!.map((nt, k) => ({ id: `${pair.id}-notch-${k + 1}`, at: sewnPointAt(p, e, nt.atMm), count: nt.count ?? 1 }));
		const ids = new Set(params.notches.map((_, k) => `${pair.id}-notch-${k + 1}`));
		a = { ...a, notches: [...a.notches.filter((n) => !ids.has(n.id)), ...mk(a, ea)] };
		b = { ...b, notches: [...b.notches.filter((n) => !ids.has(n.id)), ...mk(b, eb)] };
	}
	const ledgerEntries: LedgerEntry[] = [];
	const moved = after.aMm + after.bMm - before.aMm - before.bMm;
	if (Math.abs(moved) > 1e-9) {
		ledgerEntries.push(ledgerEntry({ apexId: null, kind: 'removed_ease', refId: pair.id, label: `seam "${pair.id}" trued`, angleRad: 0, lengthMm: moved }));
	}
	return {
		ok: true,
		pieces: [a, b],
		seamPairs: [seamPair],
		before,
		after,
		ledgerEntries,
		report: panelReport(
			'true_seam',
			after.withinTolerance
				? `Seam "${pair.id}" is true: a − b = ${after.differenceMm.toFixed(2)} mm against ${pair.allowedEaseMm.toFixed(2)} mm allowed.`
				: `Seam "${pair.id}" is ${after.deviationMm.toFixed(2)} mm off: a − b = ${after.differenceMm.toFixed(2)} mm against ${pair.allowedEaseMm.toFixed(2)} mm allowed.`,
			{ aMm: after.aMm, bMm: after.bMm, differenceBeforeMm: before.differenceMm, differenceAfterMm: after.differenceMm },
			notes
		)
	};
}

