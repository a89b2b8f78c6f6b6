import { outlineArea, outlineSelfIntersections, pathFromPolyline, pathLength } from '../kernel';
import { piecePressByPractice } from '../press-practice';
import type { Piece } from '../piece-schema';
import { pathFirst, pathLast } from './chain-tools';
import { nonFiniteAt } from './finite-check';
import { panelRefuse, panelReport, type SeamPair } from './panel-types';
import { SEAM_SNAP_MM } from './panel-tolerances';
import { pieceProblems } from './piece-tools';
import { cutPanels, noMove, placementOf } from './carry-parts';
import { carryAcrossSeam, type CarryState } from './carry-seam';
import type { CarryParams, CarryResult } from './carry-types';
import { styleLineWalkedEqual } from './carry-walk';

export type { CarryParams, CarryPlacement, CarryResidual, CarryResult, CarrySeam, SeamOutcome } from './carry-types';

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

const deg = (r: number) => (r * 180) / Math.PI;

export function carry(panels: readonly Piece[], seams: readonly SeamPair[], params: CarryParams): CarryResult {
	if (panels.length < 2) return panelRefuse('invalid_params', 'Give at least two panels, in order across the body.');
	if (seams.length !== panels.length - 1) {
		return panelRefuse('invalid_params', `Give one seam pair between each two neighbouring panels (${panels.length - 1}), not ${seams.length}.`);
	}
	const residualAs = params.residualAs ?? 'dart';
	const styleSeamId = params.styleSeamId ?? 'style-seam';
	if (outlineSelfIntersections(params.styleLine, false).length > 0) {
		return panelRefuse('invalid_params', 'The style line crosses itself; draw it as one clean stroke across the panels.');
	}
	// 0. walk every crossed wedge's legs equal, unless asked to cut them as drawn
	const walked = params.walkLegs === false ? { line: params.styleLine, walks: [] } : styleLineWalkedEqual(panels, seams, params.styleLine);
	const line = walked.line;
	if (line !== params.styleLine && outlineSelfIntersections(line, false).length > 0) {
		return panelRefuse('invalid_params', 'Walking the wedge legs equal would make the style line cross itself; draw it further from the divergence points.');
	}
	// 1. cut every panel along the style line
	const parts = cutPanels(panels, line, params.fuse);
	if (!Array.isArray(parts)) return parts;
	// 2. join the chosen side's parts left to right
	const st: CarryState = {
		fused: parts[0].fused,
		T: noMove,
		shapingMovedMm: 0,
		ledgerEntries: [],
		residuals: [],
		carrySeams: [],
		reach: [pathFirst(line)],
		styleSeamEdges: [parts[0].cut],
		placements: [placementOf(panels[0].id, noMove)],
		notes: walked.walks
			.filter((w) => w.walkedMm !== w.drawnMm[0])
			.map((w) => `Seam "${w.seamId}": the style line crossed the wedge's legs ${w.drawnMm[0].toFixed(1)} mm and ${w.drawnMm[1].toFixed(1)} mm from the divergence point; both were walked to ${w.walkedMm.toFixed(1)} mm so the closed wedge leaves no step in the seam.`)
	};
	const ctx = { panels, seams, parts, line, residualAs, styleSeamId };
	for (let k = 0; k < seams.length; k++) {
		const refused = carryAcrossSeam(st, k, ctx);
		if (refused) return refused;
	}
	// 3. check the joined piece and report
	const { fused, shapingMovedMm, ledgerEntries, residuals, carrySeams, reach, styleSeamEdges, placements, notes } = st;
	reach.push(pathLast(line));
	const id = params.pieceId ?? `${panels[0].id}-joined`;
	const joined: Piece = piecePressByPractice({ ...fused, id, name: params.name ?? `${panels[0].name} and ${panels.length - 1} more, joined` });
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
		styleLine: line,
		legWalks: walked.walks,
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
