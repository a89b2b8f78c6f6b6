import {
	outlineArea,
	outlineFromChains,
	outlineSplitAt,
	pathLength,
	pathPointAtLength,
	pathReverse,
	type Path
} from '../kernel';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import { apexById, wedgeGeometry } from '../piece';
import type { Notch, Piece } from '../piece-schema';
import { dist, pathFirst, pathLast } from './chain-tools';
import { markingsForPart } from './markings-split';
import { panelRefuse, panelReport, type PiecesResult, type SeamPair } from './panel-types';
import { ON_LINE_MM, SEAM_SNAP_MM, STYLE_LINE_SNAP_MM } from './panel-tolerances';
import { pieceProblems } from './piece-tools';
import { styleLineOnOutline } from './style-line';

/**
 * separate: cut a piece along a style line into two pieces (trade-primer §6, §8: every piece produced
 * by a split gets its own grainline). Piece A lies on the side travelled S→E along the outline, then back
 * along the cut; piece B the rest. Both keep the original's sense of travel. A dart whose apex is an end
 * of the cut is absorbed by the new seam (ledger: dart −θ, seam +θ); a cut through a dart wedge elsewhere
 * is refused.
 */

/** Parts smaller than this are slivers, not pieces. */
const MIN_PART_AREA_MM2 = 1;


export interface SeparateParams {
	/** Id of an internal line of the piece to cut along, or give `path`. */
	readonly styleLineId?: string;
	readonly path?: Path;
	readonly pieceIds?: readonly [string, string];
	readonly pieceNames?: readonly [string, string];
	readonly seamPairId?: string;
	/** Where match notches go along the cut, as fractions of its length (default one notch at 0.4). */
	readonly notchFractions?: readonly number[];
	readonly snapToleranceMm?: number;
	/** The caller has already checked the piece (carry checks every panel once). */
	readonly pieceChecked?: boolean;
	/** The caller has already made sure the line crosses the outline only at its ends (carry). */
	readonly crossingsChecked?: boolean;
	/**
	 * The caller has checked that a straight or simple cut crosses the outline exactly twice, so each part
	 * is a simple outline by construction (a chord across a simple closed curve): the parts skip the
	 * self-crossing search and the caller checks what it builds from them (carry checks the joined piece).
	 */
	readonly partsSimpleByConstruction?: boolean;
}

export function separate(piece: Piece, params: SeparateParams): PiecesResult {
	const before = params.pieceChecked ? [] : pieceProblems(piece);
	if (before.length) return panelRefuse('invalid_piece', `The piece has problems to fix first: ${before[0]}`);
	let raw: Path | undefined = params.path;
	let lineId: string | undefined;
	if (params.styleLineId !== undefined) {
		const line = piece.internalLines.find((l) => l.id === params.styleLineId);
		if (!line) return panelRefuse('unknown_internal_line', `The piece has no style line "${params.styleLineId}".`);
		raw = line.path;
		lineId = line.id;
	}
	if (!raw) return panelRefuse('invalid_params', 'Give the style line to cut along (its id or a path).');
	const checked = styleLineOnOutline(piece.outline, raw, params.snapToleranceMm ?? STYLE_LINE_SNAP_MM, params.crossingsChecked ?? false);
	if (!checked.ok) return checked;
	const cut = checked.path;
	const S = pathFirst(cut);
	const locS = { ...checked.startAt, point: S };
	const endPoint = pathLast(cut);
	const locE = { ...checked.endAt, point: endPoint };

	// darts: an end on a leg (not at a leg end or at the apex) cuts the wedge open
	for (const d of piece.darts) {
		const apex = apexById(piece, d.apexId);
		if (!apex) continue;
		for (const loc of [locS, locE]) {
			const p = loc.point;
			const atVertex = [apex.point, d.leg1End, d.leg2End].some((v) => dist(v, p) <= ON_LINE_MM);
			if (atVertex) continue;
			const onLeg = [
				[d.leg1End, apex.point],
				[apex.point, d.leg2End]
			].some(([u, v]) => Math.abs(dist(u, p) + dist(p, v) - dist(u, v)) <= ON_LINE_MM);
			if (onLeg) {
				return panelRefuse('cut_crosses_dart', `The style line ends on a leg of dart "${d.id}"; end it at the apex or clear of the dart.`);
			}
		}
	}

	const chains = outlineSplitAt(piece.outline, [locS, locE]);
	if (chains.length !== 2) return panelRefuse('style_line_off_outline', 'The style line does not cut the outline in two.');
	const [c0, c1] = chains;
	const chainSE = dist(pathFirst(c0), S) <= dist(pathFirst(c1), S) ? c0 : c1;
	const chainES = chainSE === c0 ? c1 : c0;
	const outlineA = outlineFromChains([chainSE, pathReverse(cut)], { snapTolerance: SEAM_SNAP_MM });
	const outlineB = outlineFromChains([chainES, cut], { snapTolerance: SEAM_SNAP_MM });

	const [idA, idB] = params.pieceIds ?? [`${piece.id}-a`, `${piece.id}-b`];
	const [nameA, nameB] = params.pieceNames ?? [`${piece.name} (a)`, `${piece.name} (b)`];
	if (idA === idB) return panelRefuse('invalid_params', 'The two new pieces need different ids.');
	const pairId = params.seamPairId ?? `${piece.id}-seam-${lineId ?? 'cut'}`;
	const cutLength = pathLength(cut);
	const fractions = params.notchFractions ?? [0.4];
	const cutNotches: Notch[] = fractions.map((f, k) => ({
		id: `${pairId}-n${k + 1}`,
		at: pathPointAtLength(cut, Math.min(1, Math.max(0, f)) * cutLength).point,
		count: 1
	}));

	const partA = markingsForPart(piece, outlineA, lineId);
	const partB = markingsForPart(piece, outlineB, lineId);
	const kept = new Set([...partA.darts.map((d) => d.id), ...partB.darts.map((d) => d.id)]);
	const ledgerEntries: LedgerEntry[] = [];
	for (const d of piece.darts) {
		if (kept.has(d.id)) continue;
		const apex = apexById(piece, d.apexId);
		const atEnd = apex && [locS.point, locE.point].some((p) => dist(p, apex.point) <= ON_LINE_MM);
		if (!apex || !atEnd) {
			return panelRefuse('cut_crosses_dart', `The style line runs through dart "${d.id}"; move it clear of the dart or through its apex.`);
		}
		const g = wedgeGeometry(apex.point, d.leg1End, d.leg2End);
		ledgerEntries.push(
			ledgerEntry({ apexId: apex.id, kind: 'dart', refId: d.id, label: `dart ${d.id} absorbed by the style seam`, angleRad: -g.angleRad }),
			ledgerEntry({ apexId: apex.id, kind: 'seam', refId: pairId, label: 'shaping now in the style seam', angleRad: g.angleRad })
		);
	}
	const a: Piece = { ...piece, ...partA, id: idA, name: nameA, outline: outlineA, notches: [...partA.notches, ...cutNotches] };
	const b: Piece = { ...piece, ...partB, id: idB, name: nameB, outline: outlineB, notches: [...partB.notches, ...cutNotches] };
	// Both parts are checked in full: a cut grazing the outline near its end can touch it again.
	for (const p of [a, b]) {
		const problems = pieceProblems(p, params.partsSimpleByConstruction ? { selfIntersection: false } : {});
		if (problems.length) return panelRefuse('result_broken', `This cut would give a broken piece, so nothing was changed: ${problems[0]}`);
	}
	const areaA = outlineArea(outlineA);
	const areaB = outlineArea(outlineB);
	if (Math.min(areaA, areaB) < MIN_PART_AREA_MM2) {
		return panelRefuse('style_line_leaves_piece', `This cut would leave a sliver of ${Math.min(areaA, areaB).toFixed(2)} mm²; draw the style line across the piece.`);
	}
	const seamPair: SeamPair = {
		id: pairId,
		a: { pieceId: idA, edge: cut },
		b: { pieceId: idB, edge: cut },
		allowedEaseMm: 0,
		toleranceMm: SEAM_SNAP_MM
	};
	const areaBefore = outlineArea(piece.outline);
	return {
		ok: true,
		pieces: [a, b],
		seamPairs: [seamPair],
		ledgerEntries,
		report: panelReport(
			'separate',
			`${piece.name} cut along the style line into ${nameA} and ${nameB}.`,
			{ areaBeforeMm2: areaBefore, areaAMm2: areaA, areaBMm2: areaB, cutLengthMm: cutLength },
			ledgerEntries.length ? [`${ledgerEntries.length / 2} dart(s) absorbed by the new seam.`] : []
		)
	};
}
