import {
	outlineArea,
	outlineContainsPoint,
	outlineFlatten,
	outlineNearestPoint,
	outlineSelfIntersections,
	pathBetween,
	pathFromPolyline,
	pathIntersections,
	pathLength,
	type Path,
	type Vec
} from '../kernel';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import type { Piece, Pleat } from '../piece-schema';
import { dist, pathFirst, pathLast, polygonCentroid } from './chain-tools';
import { dartAtPoint } from './join';
import { pathMapPoints } from './join-kernel';
import { panelRefuse, panelReport, type PanelFailure, type SeamPair } from './panel-types';
import { REACH_MM, SEAM_SNAP_MM } from './panel-tolerances';
import { pieceMapPoints, pieceProblems, rotateFn } from './piece-tools';
import { divergenceCandidates, seamWedge, type SeamWedge } from './seam-wedge';
import { nonFiniteAt } from './finite-check';
import { separate } from './separate';
import { mergeMarkings, spliceOutlines } from './splice';
import type { OperationReport } from '../operation-result';

/**
 * carry: turn vertical panel seams into one shaped horizontal seam (trade-primer §6, "Merging panels").
 * Every panel is cut along the style line; the parts on the chosen side are joined into one piece,
 * left to right (panel 0, e.g. centre front, stays put). At each panel seam the geometry decides:
 *  - closes:  the style line passes through D or crosses the wedge, and the wedge's mouth is on the
 *             chosen side → that side's parts are rotated about D until they meet; the angle goes
 *             into the style seam (which curves). The other side keeps the rest of the wedge as its
 *             own panel-seam shaping.
 *  - residual: D lies on the chosen side, off the line by h → the shaping cannot all reach the style
 *             seam. If the wedge opens away from the line, it is closed about D and the stretch between
 *             D and the line opens instead; if it opens toward the line, the part between D and the line
 *             stays open. Either way it is left as a small dart at D (default) or as a pair of pleats,
 *             and reported with h, the angle and its width at the line, 2·h·tan(θ/2) (reference-values
 *             row 18, D).
 *  - plain:   the wedge lies wholly on the other side → the parts coincide and are simply joined.
 * Ledger entries account for every wedge angle. The reach line is where the style line must pass to
 * reach every divergence point.
 */

export interface CarryParams {
	readonly styleLine: Path;
	/** Side of the style line whose parts are joined into one piece (y down: 'above' = smaller y). */
	readonly fuse: 'above' | 'below';
	readonly residualAs?: 'dart' | 'pleats';
	readonly pieceId?: string;
	readonly name?: string;
	readonly styleSeamId?: string;
}

export interface CarryPlacement {
	readonly panelId: string;
	readonly angleRad: number;
	readonly dxMm: number;
	readonly dyMm: number;
}

export type SeamOutcome = 'closed' | 'residual' | 'plain';

export interface CarrySeam {
	readonly seamId: string;
	readonly apexId: string;
	readonly outcome: SeamOutcome;
	readonly angleRad: number;
	/** Distance from D to the style line along the seam (0 when it reaches D). */
	readonly distanceMm: number;
	/** Width the wedge takes out of the style line (outcome 'closed'). */
	readonly closedAtLineMm: number;
}

export interface CarryResidual {
	readonly seamId: string;
	readonly apexId: string;
	/** How far the style line passes from D (mm). */
	readonly distanceMm: number;
	readonly angleRad: number;
	readonly angleDeg: number;
	/** Width of the residual at the style line: 2·h·tan(θ/2) for a line square to its centre line. */
	readonly widthAtLineMm: number;
	/** Straight distance across the opening as it lies on the joined piece. */
	readonly openingChordMm: number;
	readonly leftAs: 'dart' | 'pleats';
	readonly markingId: string;
	readonly message: string;
}

export type CarryResult =
	| {
			readonly ok: true;
			/** The joined piece first, then the parts on the other side of the style line (unchanged). */
			readonly pieces: readonly Piece[];
			readonly seamPairs: readonly SeamPair[];
			readonly seams: readonly CarrySeam[];
			readonly residuals: readonly CarryResidual[];
			readonly reachLine: Path;
			/**
			 * Where each panel's part on the chosen side was laid in the joined piece: a rigid turn by angleRad
			 * followed by a shift, p ↦ R(angleRad)·p + (dxMm, dyMm), in the order the panels were given (panel 0
			 * stays put). Its inverse lays a part back as drafted (un-carry).
			 */
			readonly placements: readonly CarryPlacement[];
			readonly styleSeamEdges: readonly Path[];
			readonly styleSeamLengthMm: number;
			/** The style line across the other side as drawn (its parts plus what stays open between them). */
			readonly otherSideSeamLengthMm: number;
			/** otherSideSeamLengthMm − styleSeamLengthMm: the width of shaping taken out of the style seam. */
			readonly shapingMovedMm: number;
			readonly ledgerEntries: readonly LedgerEntry[];
			readonly report: OperationReport;
	  }
	| PanelFailure;

const deg = (r: number) => (r * 180) / Math.PI;

interface Part {
	readonly fused: Piece;
	readonly other: Piece;
	readonly cut: Path;
}

function nearSide(p: Vec, part: Part): 'fused' | 'other' {
	const d = (q: Piece) => (outlineContainsPoint(q.outline, p) ? 0 : outlineNearestPoint(q.outline, p).distance);
	return d(part.fused) <= d(part.other) ? 'fused' : 'other';
}

/** Where a path crosses the style line, or null. */
function crossing(path: Path, line: Path): Vec | null {
	const hits = pathIntersections(path, line);
	return hits.length ? hits[0].point : null;
}

function residualPleat(id: string, apexId: string, apex: Vec, l1: Vec, l2: Vec): Pleat {
	const mouth = { x: (l1.x + l2.x) / 2, y: (l1.y + l2.y) / 2 };
	const intake = dist(l1, l2);
	return {
		id,
		apexId,
		kind: 'pleat',
		leg1End: l1,
		leg2End: l2,
		foldLine: { from: l1, to: apex },
		placementLine: { from: mouth, to: apex },
		foldToward: 'leg2',
		foldArrow: { from: l1, to: mouth },
		intakeMm: intake,
		// a pair of pleats meeting at the centre line: each takes half the intake, depth = intake/2 each (row 20)
		depthMm: intake / 4
	};
}

export function carry(panels: readonly Piece[], seams: readonly SeamPair[], params: CarryParams): CarryResult {
	if (panels.length < 2) return panelRefuse('invalid_params', 'Give at least two panels, in order across the body.');
	if (seams.length !== panels.length - 1) {
		return panelRefuse('invalid_params', `Give one seam pair between each two neighbouring panels (${panels.length - 1}), not ${seams.length}.`);
	}
	const residualAs = params.residualAs ?? 'dart';
	const styleSeamId = params.styleSeamId ?? 'style-seam';
	const line = params.styleLine;
	if (outlineSelfIntersections(line, false).length > 0) {
		return panelRefuse('invalid_params', 'The style line crosses itself; draw it as one clean stroke across the panels.');
	}
	// 1. cut every panel along the style line
	const parts: Part[] = [];
	for (const panel of panels) {
		const problems = pieceProblems(panel);
		if (problems.length) return panelRefuse('invalid_piece', `${panel.name} has problems to fix first: ${problems[0]}`);
	}
	for (const panel of panels) {
		const hits = pathIntersections(line, panel.outline).sort((p, q) => p.segmentIndex + p.t - (q.segmentIndex + q.t));
		if (hits.length < 2) {
			return panelRefuse('style_line_misses_panel', `The style line does not cross ${panel.name} from edge to edge; extend it across every panel.`);
		}
		if (hits.length > 2) {
			return panelRefuse('style_line_misses_panel', `The style line crosses the edge of ${panel.name} ${hits.length} times; it must cross each panel once, edge to edge.`);
		}
		const first = hits[0];
		const last = hits[hits.length - 1];
		const cut = pathBetween(line, first, last);
		const s = separate(panel, { path: cut, pieceIds: [`${panel.id}-1`, `${panel.id}-2`], notchFractions: [], pieceChecked: true, crossingsChecked: true, partsSimpleByConstruction: true });
		if (!s.ok) return panelRefuse(s.error.code, `${panel.name}: ${s.error.message}`);
		const [p1, p2] = s.pieces;
		const cy = (q: Piece) => polygonCentroid(outlineFlatten(q.outline, 0.5)).y;
		const p1Above = cy(p1) < cy(p2);
		const fused = (params.fuse === 'above') === p1Above ? p1 : p2;
		parts.push({ fused, other: fused === p1 ? p2 : p1, cut });
	}
	// 2. join the chosen side's parts left to right
	let fused = parts[0].fused;
	let T: (p: Vec) => Vec = (p) => p;
	const ledgerEntries: LedgerEntry[] = [];
	const residuals: CarryResidual[] = [];
	const carrySeams: CarrySeam[] = [];
	const reach: Vec[] = [pathFirst(line)];
	const styleSeamEdges: Path[] = [parts[0].cut];
	const placements: CarryPlacement[] = [placementOf(panels[0].id, T)];
	const notes: string[] = [];
	let shapingMovedMm = 0;
	for (let k = 0; k < seams.length; k++) {
		const pair = seams[k];
		const left = panels[k];
		const right = panels[k + 1];
		if (pair.a.pieceId !== left.id || pair.b.pieceId !== right.id) {
			return panelRefuse('invalid_params', `Seam pair ${k + 1} ("${pair.id}") must run from ${left.name} (a) to ${right.name} (b).`);
		}
		const D0 = divergenceCandidates(left, right, pair.a.edge, pair.b.edge, SEAM_SNAP_MM)[0];
		const partA = parts[k];
		const partB = parts[k + 1];
		let wedge: SeamWedge | null = null;
		if (D0) {
			const w = seamWedge(pair.a.edge, pair.b.edge, D0, SEAM_SNAP_MM);
			if (typeof w === 'string') return panelRefuse('seam_edges_differ', `Seam "${pair.id}": ${w}.`);
			wedge = w;
		}
		let B = pieceMapPoints(partB.fused, T);
		if (!wedge) {
			// edges coincide all along (no divergence point): a plain join where the line crosses
			const c = crossing(pair.a.edge, line);
			const far = nearSide(pathFirst(pair.a.edge), partA) === 'fused' ? pathFirst(pair.a.edge) : pathLast(pair.a.edge);
			if (!c) return panelRefuse('style_line_misses_panel', `The style line does not cross seam "${pair.id}".`);
			const o = spliceOutlines(fused.outline, B.outline, T(c), T(far), SEAM_SNAP_MM);
			if (!o) return panelRefuse('no_divergence_point', `Seam "${pair.id}": the edges differ and no divergence point is marked on both panels.`);
			fused = { ...fused, ...mergeMarkings(fused, B, o), outline: o };
			reach.push(c);
			styleSeamEdges.push(pathMapPoints(partB.cut, T));
			placements.push(placementOf(right.id, T));
			continue;
		}
		const D = wedge.apex.point;
		const theta = wedge.angleRad;
		const ca = crossing(wedge.openA, line);
		const cb = crossing(wedge.openB, line);
		const cs = wedge.sharedA ? crossing(wedge.sharedA, line) : null;
		const mouthA = pathLast(wedge.openA);
		const mouthOnFused = nearSide(mouthA, partA) === 'fused';
		const reachesD = (ca && dist(ca, D) <= REACH_MM) || (cs && dist(cs, D) <= REACH_MM);
		const apexId = wedge.apex.id;
		const residualId = `${apexId}-residual`;
		const leave = (h: number, chord: number, o: typeof fused.outline, Bn: Piece) => {
			let piece: Piece = { ...fused, ...mergeMarkings(fused, Bn, o), outline: o };
			if (!piece.apexes.some((a) => a.id === apexId)) piece = { ...piece, apexes: [...piece.apexes, { ...wedge!.apex, point: T(D) }] };
			const dart = dartAtPoint(o, T(D), apexId, residualId);
			if (dart) {
				if (residualAs === 'dart') piece = { ...piece, darts: [...piece.darts, dart] };
				else piece = { ...piece, pleats: [...piece.pleats, residualPleat(residualId, apexId, T(D), dart.leg1End, dart.leg2End)] };
			} else notes.push(`Seam "${pair.id}": the residual opening has curved legs; it is left in the outline.`);
			const width = 2 * h * Math.tan(theta / 2);
			residuals.push({
				seamId: pair.id,
				apexId,
				distanceMm: h,
				angleRad: theta,
				angleDeg: deg(theta),
				widthAtLineMm: width,
				openingChordMm: chord,
				leftAs: residualAs,
				markingId: residualId,
				message: `The style line passes ${h.toFixed(1)} mm from the divergence point of seam "${pair.id}": ${deg(theta).toFixed(2)}° of shaping (${width.toFixed(1)} mm at the line) cannot go into the style seam and is left as ${residualAs === 'dart' ? 'a small dart' : 'a pair of pleats'}. Move the line to the reach line to carry it all.`
			});
			ledgerEntries.push(
				ledgerEntry({ apexId, kind: 'seam', refId: pair.id, label: `panel-seam wedge of "${pair.id}" taken into the joined piece`, angleRad: -theta }),
				ledgerEntry({ apexId, kind: residualAs === 'dart' ? 'dart' : 'pleat', refId: residualId, label: `residual left as ${residualAs === 'dart' ? 'a small dart' : 'a pair of pleats'} (${width.toFixed(1)} mm at the style line)`, angleRad: theta })
			);
			carrySeams.push({ seamId: pair.id, apexId, outcome: 'residual', angleRad: theta, distanceMm: h, closedAtLineMm: 0 });
			reach.push(D);
			return piece;
		};
		/** The chosen parts coincide along the seam: joined as they lie, the wedge stays in the other side's panel seam. */
		const plain = (o: typeof fused.outline, h: number, at: Vec, note: string) => {
			fused = { ...fused, ...mergeMarkings(fused, B, o), outline: o };
			ledgerEntries.push(
				ledgerEntry({ apexId, kind: 'seam', refId: pair.id, label: `wedge of "${pair.id}" lies wholly on the other side of the style line`, angleRad: -theta }),
				ledgerEntry({ apexId, kind: 'seam', refId: pair.id, label: 'stays in that panel seam', angleRad: theta })
			);
			notes.push(note);
			carrySeams.push({ seamId: pair.id, apexId, outcome: 'plain', angleRad: theta, distanceMm: h, closedAtLineMm: 0 });
			reach.push(at);
		};
		let o: typeof fused.outline | null = null;
		if (mouthOnFused && (reachesD || (ca && cb))) {
			// closes fully: rotate the rest about D
			const T0 = T;
			const R = rotateFn(T0(D), wedge.closingRotationRad);
			const RT = (p: Vec) => R(T0(p));
			const Bn = pieceMapPoints(partB.fused, RT);
			// the line crosses both open legs (however close to D): the parts meet from the farther crossing to the
			// mouth; a line through the shared part within reach of D closes from D itself
			const legs = ca && cb ? { ca, cb } : null;
			const pa = legs ? legs.ca : D;
			const pb = legs ? legs.cb : D;
			const start = dist(pa, D) >= dist(pb, D) ? T(pa) : RT(pb);
			o = spliceOutlines(fused.outline, Bn.outline, start, T(mouthA), SEAM_SNAP_MM);
			if (!o) return panelRefuse('wedge_not_closing', `Seam "${pair.id}": after closing the wedge the panel edges do not meet; true the seam first.`);
			fused = { ...fused, ...mergeMarkings(fused, Bn, o), outline: o };
			const gap = legs ? dist(legs.ca, legs.cb) : 0;
			shapingMovedMm += gap;
			ledgerEntries.push(
				ledgerEntry({ apexId, kind: 'seam', refId: pair.id, label: `panel-seam wedge of "${pair.id}" closed`, angleRad: -theta }),
				ledgerEntry({ apexId, kind: 'seam', refId: styleSeamId, label: 'carried into the style seam', angleRad: theta })
			);
			carrySeams.push({ seamId: pair.id, apexId, outcome: 'closed', angleRad: theta, distanceMm: legs ? dist(legs.ca, D) : cs ? dist(cs, D) : 0, closedAtLineMm: gap });
			reach.push(legs ? legs.ca : D);
			T = RT;
			styleSeamEdges.push(pathMapPoints(partB.cut, T));
		} else if (!mouthOnFused && ca && cb && wedge.sharedA) {
			// D on the chosen side, wedge opening toward the line: the stub between D and the line stays open
			o = spliceOutlines(fused.outline, B.outline, T(pathFirst(wedge.sharedA)), T(D), SEAM_SNAP_MM);
			if (!o) return panelRefuse('seam_not_on_piece', `Seam "${pair.id}": the panel edges could not be joined beside the divergence point.`);
			const h = stubHeight(D, ca, cb);
			if (h <= REACH_MM) {
				// the line runs through D (within reach): nothing stays open on this side, the wedge stays whole on the other
				plain(o, h, ca, `Seam "${pair.id}": the style line runs through its divergence point; the whole wedge stays in the panel seam on the other side.`);
			} else fused = leave(h, dist(ca, cb), o, B);
			styleSeamEdges.push(pathMapPoints(partB.cut, T));
		} else if (mouthOnFused && cs && wedge.sharedA) {
			// D on the chosen side, wedge opening away from the line: close it about D, the stretch D–line opens
			const T0 = T;
			const R = rotateFn(T0(D), wedge.closingRotationRad);
			const RT = (p: Vec) => R(T0(p));
			const Bn = pieceMapPoints(partB.fused, RT);
			o = spliceOutlines(fused.outline, Bn.outline, T(D), T(mouthA), SEAM_SNAP_MM);
			if (!o) return panelRefuse('wedge_not_closing', `Seam "${pair.id}": after closing the wedge the panel edges do not meet; true the seam first.`);
			const h = dist(cs, D);
			fused = leave(h, dist(T(cs), RT(cs)), o, Bn);
			T = RT;
			styleSeamEdges.push(pathMapPoints(partB.cut, T));
		} else if (!mouthOnFused && cs) {
			// the whole wedge is on the other side: the chosen parts coincide along the seam
			const farShared = pathFirst(wedge.sharedA!);
			o = spliceOutlines(fused.outline, B.outline, T(cs), T(farShared), SEAM_SNAP_MM);
			if (!o) return panelRefuse('seam_not_on_piece', `Seam "${pair.id}": the panel edges could not be joined.`);
			plain(o, dist(cs, D), cs, `Seam "${pair.id}": its wedge lies wholly on the other side of the style line; nothing to carry.`);
			styleSeamEdges.push(pathMapPoints(partB.cut, T));
		} else {
			return panelRefuse('style_line_misses_panel', `The style line does not cross seam "${pair.id}" where it can be followed.`);
		}
		placements.push(placementOf(right.id, T));
	}
	reach.push(pathLast(line));
	const id = params.pieceId ?? `${panels[0].id}-joined`;
	const joined: Piece = { ...fused, id, name: params.name ?? `${panels[0].name} and ${panels.length - 1} more, joined` };
	const problems = pieceProblems(joined);
	if (problems.length) return panelRefuse('result_broken', `Carrying would give a broken piece, so nothing was changed: ${problems[0]}`);
	const others = parts.map((p) => p.other);
	const styleSeamLengthMm = parts.reduce((s, p) => s + pathLength(p.cut), 0);
	const otherSideSeamLengthMm = styleSeamLengthMm + shapingMovedMm;
	const areaBefore = panels.reduce((s, p) => s + outlineArea(p.outline), 0);
	const areaAfter = outlineArea(joined.outline) + others.reduce((s, p) => s + outlineArea(p.outline), 0);
	const seamPairs: SeamPair[] = parts.map((p, k) => ({
		id: `${styleSeamId}-${k + 1}`,
		a: { pieceId: id, edge: styleSeamEdges[k] },
		b: { pieceId: p.other.id, edge: p.cut },
		allowedEaseMm: 0,
		toleranceMm: SEAM_SNAP_MM
	}));
	const carried = carrySeams.filter((s) => s.outcome === 'closed').reduce((s, c) => s + c.angleRad, 0);
	const result: CarryResult = {
		ok: true,
		pieces: [joined, ...others],
		seamPairs,
		seams: carrySeams,
		residuals,
		reachLine: pathFromPolyline(reach),
		placements,
		styleSeamEdges,
		styleSeamLengthMm,
		otherSideSeamLengthMm,
		shapingMovedMm,
		ledgerEntries,
		report: panelReport(
			'carry',
			residuals.length
				? `${panels.length} panels joined ${params.fuse} the style line; ${deg(carried).toFixed(2)}° carried into the style seam, ${residuals.length} residual(s) left.`
				: `${panels.length} panels joined ${params.fuse} the style line; all ${deg(carried).toFixed(2)}° of shaping carried into the style seam.`,
			{ areaBeforeMm2: areaBefore, areaAfterMm2: areaAfter, carriedAngleRad: carried, shapingMovedMm, styleSeamLengthMm },
			[...notes, ...residuals.map((r) => r.message)]
		)
	};
	// every figure worked out here (outlines only move rigidly, by the placements checked here)
	const { seams: sv, residuals: rv, ledgerEntries: lv, report: pv } = result;
	const bad = nonFiniteAt({ sv, rv, lv, pv, placements, markings: [joined.apexes, joined.darts, joined.pleats], lengths: [styleSeamLengthMm, otherSideSeamLengthMm, shapingMovedMm] });
	if (bad) return panelRefuse('result_broken', 'This style line gives no usable result here (a length or angle cannot be measured); move it a little and try again.');
	return result;
}

/** The rigid placement a point map applies (read off from where it sends two points). */
function placementOf(panelId: string, T: (p: Vec) => Vec): CarryPlacement {
	const o = T({ x: 0, y: 0 });
	const u = T({ x: 1, y: 0 });
	return { panelId, angleRad: Math.atan2(u.y - o.y, u.x - o.x), dxMm: o.x, dyMm: o.y };
}

/** Distance from D to the line through the two crossing points (the height of the stub); where they meet, D to that point. */
function stubHeight(D: Vec, a: Vec, b: Vec): number {
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	const len = Math.hypot(dx, dy);
	if (len < 1e-9) return dist(a, D);
	return Math.abs((D.x - a.x) * dy - (D.y - a.y) * dx) / len;
}
