import { ledgerEntry, type LedgerEntry } from '../ledger';
import type { Path, Vec } from '../kernel';
import type { Piece } from '../piece-schema';
import { dist, pathFirst, pathLast } from './chain-tools';
import { dartAtPoint } from './join';
import { pathMapPoints } from './join-kernel';
import { panelRefuse, type PanelFailure, type SeamPair } from './panel-types';
import { REACH_MM, SEAM_SNAP_MM } from './panel-tolerances';
import { pieceMapPoints, rotateFn } from './piece-tools';
import { divergenceCandidates, seamWedge, type SeamWedge } from './seam-wedge';
import { mergeMarkings, spliceOutlines } from './splice';
import { crossing, nearSide, noMove, placementOf, residualPleat, stubHeight, type Part } from './carry-parts';
import type { CarryPlacement, CarryResidual, CarrySeam } from './carry-types';

/**
 * Carry's second step at one panel seam: the chosen side's part of the next panel is joined onto the
 * piece made so far, the seam's wedge closed into the style seam, left as a residual, or left whole on
 * the other side (see carry.ts for the three outcomes).
 */

/** The piece being joined left to right, and everything the join of each seam adds to. */
export interface CarryState {
	fused: Piece;
	/** Where the next panel's points go (panel 0 stays put; each closed wedge turns the rest about its D). */
	T: (p: Vec) => Vec;
	shapingMovedMm: number;
	readonly ledgerEntries: LedgerEntry[];
	readonly residuals: CarryResidual[];
	readonly carrySeams: CarrySeam[];
	readonly reach: Vec[];
	readonly styleSeamEdges: Path[];
	readonly placements: CarryPlacement[];
	readonly notes: string[];
}

export interface SeamContext {
	readonly panels: readonly Piece[];
	readonly seams: readonly SeamPair[];
	readonly parts: readonly Part[];
	readonly line: Path;
	readonly residualAs: 'dart' | 'pleats';
	readonly styleSeamId: string;
}

const deg = (r: number) => (r * 180) / Math.PI;

/** Joins panel k + 1's part across seam pair k; null when done, or the refusal. */
export function carryAcrossSeam(st: CarryState, k: number, ctx: SeamContext): PanelFailure | null {
	const { panels, parts, line, residualAs, styleSeamId } = ctx;
	const pair = ctx.seams[k];
	const { ledgerEntries, residuals, carrySeams, reach, styleSeamEdges, placements, notes } = st;
	let { fused, T, shapingMovedMm } = st;
	const done = (): null => {
		st.fused = fused;
		st.T = T;
		st.shapingMovedMm = shapingMovedMm;
		return null;
	};
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
	// the next panel's part where it lies now, made only where a join needs it (a closing wedge turns it instead)
	let laid: Piece | null = null;
	const B = (): Piece => (laid ??= T === noMove ? partB.fused : pieceMapPoints(partB.fused, T));
	if (!wedge) {
		// edges coincide all along (no divergence point): a plain join where the line crosses
		const c = crossing(pair.a.edge, line);
		const far = nearSide(pathFirst(pair.a.edge), partA) === 'fused' ? pathFirst(pair.a.edge) : pathLast(pair.a.edge);
		if (!c) return panelRefuse('style_line_misses_panel', `The style line does not cross seam "${pair.id}".`);
		const o = spliceOutlines(fused.outline, B().outline, T(c), T(far), SEAM_SNAP_MM);
		if (!o) return panelRefuse('no_divergence_point', `Seam "${pair.id}": the edges differ and no divergence point is marked on both panels.`);
		fused = { ...fused, ...mergeMarkings(fused, B(), o), outline: o };
		reach.push(c);
		styleSeamEdges.push(pathMapPoints(partB.cut, T));
		placements.push(placementOf(right.id, T));
		return done();
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
		fused = { ...fused, ...mergeMarkings(fused, B(), o), outline: o };
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
		o = spliceOutlines(fused.outline, B().outline, T(pathFirst(wedge.sharedA)), T(D), SEAM_SNAP_MM);
		if (!o) return panelRefuse('seam_not_on_piece', `Seam "${pair.id}": the panel edges could not be joined beside the divergence point.`);
		const h = stubHeight(D, ca, cb);
		if (h <= REACH_MM) {
			// the line runs through D (within reach): nothing stays open on this side, the wedge stays whole on the other
			plain(o, h, ca, `Seam "${pair.id}": the style line runs through its divergence point; the whole wedge stays in the panel seam on the other side.`);
		} else fused = leave(h, dist(ca, cb), o, B());
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
		o = spliceOutlines(fused.outline, B().outline, T(cs), T(farShared), SEAM_SNAP_MM);
		if (!o) return panelRefuse('seam_not_on_piece', `Seam "${pair.id}": the panel edges could not be joined.`);
		plain(o, dist(cs, D), cs, `Seam "${pair.id}": its wedge lies wholly on the other side of the style line; nothing to carry.`);
		styleSeamEdges.push(pathMapPoints(partB.cut, T));
	} else {
		return panelRefuse('style_line_misses_panel', `The style line does not cross seam "${pair.id}" where it can be followed.`);
	}
	placements.push(placementOf(right.id, T));
	return done();
}
