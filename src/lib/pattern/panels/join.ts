import { outlineArea, outlineSignedArea, pathMapPoints, type Outline, type Path, type Vec } from './join-kernel';
import { piecePressByPractice } from '../press-practice';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import type { Dart, Piece } from '../piece-schema';
import { chainDeviation, chainsDeviation, dist, pathFirst, pathLast } from './chain-tools';
import { panelRefuse, panelReport, type PiecesResult, type SeamPair } from './panel-types';
import { ON_LINE_MM, SEAM_SNAP_MM } from './panel-tolerances';
import { pieceMapPoints, pieceProblems, pieceReverse, rotateFn } from './piece-tools';
import { divergenceCandidates, orientLike, seamWedge } from './seam-wedge';
import { mergeMarkings, spliceOutlines } from './splice';
import { reopenedDarts } from './reopen-dart';
import { wedgeGeometry } from '../piece';

/**
 * join: merge two pieces along a seam pair (trade-primer §6).
 * - Edges that coincide (within 0.05 mm, snapped): plain union, spliced outline to outline.
 * - Edges that coincide up to a divergence point D and then open as a wedge: `wedge: 'close'` (default)
 *   rotates piece b about D until the open parts lie on each other; the parts that coincided now open by
 *   the same angle and become a dart at D (or, if the edges only met at D, the angle goes into the seams
 *   through D). `wedge: 'keep_as_dart'` joins the coinciding part only and keeps the wedge as a dart.
 *   Either way the angle is posted to the ledger with what carries it (`carriedBy`).
 */

export interface JoinParams {
	readonly pieceId?: string;
	readonly name?: string;
	readonly wedge?: 'close' | 'keep_as_dart';
	/** Name of the seam or dart that takes the closed angle (ledger label); default: the new dart. */
	readonly carriedBy?: string;
	readonly dartId?: string;
	readonly snapToleranceMm?: number;
}

export interface JoinOutcome {
	readonly piece: Piece;
	readonly ledgerEntries: LedgerEntry[];
	readonly closedAngleRad: number;
	readonly newDart: Dart | null;
	readonly notes: string[];
}

/** Dart at D in the outline: the straight segment ending at D followed by a straight one leaving it. */
export function dartAtPoint(outline: Outline, D: Vec, apexId: string, id: string): Dart | null {
	const segs = outline.segments;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		const t = segs[(i + 1) % segs.length];
		if (s.kind !== 'line' || t.kind !== 'line') continue;
		if (dist(s.p1, D) > ON_LINE_MM) continue;
		return { id, apexId, leg1End: s.p0, leg2End: t.p1, movingLeg: 'leg2' };
	}
	return null;
}

function withApexAt(piece: Piece, apex: Piece['apexes'][number]): Piece {
	return piece.apexes.some((a) => a.id === apex.id) ? piece : { ...piece, apexes: [...piece.apexes, apex] };
}

/** The join itself on pieces already checked; used by join and carry. */
export function joinPieces(a: Piece, bIn: Piece, ea: Path, ebIn: Path, params: JoinParams): JoinOutcome | { error: ReturnType<typeof panelRefuse> } {
	const tol = params.snapToleranceMm ?? SEAM_SNAP_MM;
	const flip = Math.sign(outlineSignedArea(a.outline)) !== Math.sign(outlineSignedArea(bIn.outline));
	let b = flip ? pieceReverse(bIn) : bIn;
	let eb = orientLike(ea, ebIn);
	for (const [p, e, name] of [[a, ea, 'a'], [b, eb, 'b']] as const) {
		const off = chainDeviation(e, p.outline);
		if (off > tol) return { error: panelRefuse('seam_not_on_piece', `Seam edge ${name} is ${off.toFixed(2)} mm off the outline of ${p.name}.`) };
	}
	const id = params.pieceId ?? a.id;
	const name = params.name ?? `${a.name} + ${b.name}`;
	const build = (outline: Outline, aa: Piece, bb: Piece): Piece => ({ ...aa, ...mergeMarkings(aa, bb, outline), id, name, outline });
	const deviation = chainsDeviation(ea, eb);
	if (deviation <= tol) {
		const outline = spliceOutlines(a.outline, b.outline, pathFirst(ea), pathLast(ea), tol);
		if (!outline) return { error: panelRefuse('seam_not_on_piece', 'The seam edges could not be found on the outlines.') };
		const notes = deviation > 1e-6 ? [`Seam edges ${deviation.toFixed(3)} mm apart were snapped together.`] : [];
		// a seam that separate cut through a dart's apex: joined back, the wedge is whole again and is a dart again
		const joined = build(outline, a, b);
		const darts = reopenedDarts(joined, [pathFirst(ea), pathLast(ea)], tol, (apex) => params.dartId ?? `${apex.id}-dart`);
		const ledgerEntries = darts.flatMap((d) => {
			const apex = joined.apexes.find((x) => x.id === d.apexId)!;
			const angleRad = wedgeGeometry(apex.point, d.leg1End, d.leg2End).angleRad;
			return [
				ledgerEntry({ apexId: apex.id, kind: 'seam', refId: 'panel-seam', label: `seam between ${a.name} and ${bIn.name} closed up to ${apex.label || apex.id}`, angleRad: -angleRad }),
				ledgerEntry({ apexId: apex.id, kind: 'dart', refId: d.id, label: `dart ${d.id} open again at ${apex.label || apex.id}`, angleRad })
			];
		});
		if (darts.length) notes.push(`${darts.length === 1 ? 'A dart' : `${darts.length} darts`} that the seam had absorbed ${darts.length === 1 ? 'is' : 'are'} a dart again.`);
		return { piece: darts.length ? piecePressByPractice({ ...joined, darts: [...joined.darts, ...darts] }) : joined, ledgerEntries, closedAngleRad: 0, newDart: darts[0] ?? null, notes };
	}
	const candidates = divergenceCandidates(a, b, ea, eb, tol);
	if (candidates.length === 0) {
		if (deviation < 3) {
			return {
				error: panelRefuse(
					'seam_gap_too_wide',
					`The seam edges are up to ${deviation.toFixed(2)} mm apart, more than the ${tol} mm that is snapped; true the seam first.`
				)
			};
		}
		return { error: panelRefuse('no_divergence_point', `The seam edges differ by up to ${deviation.toFixed(1)} mm and no divergence point is marked on both.`) };
	}
	const wedge = seamWedge(ea, eb, candidates[0], tol);
	if (typeof wedge === 'string') return { error: panelRefuse('seam_edges_differ', `The seam edges do not form a wedge: ${wedge}.`) };
	const D = wedge.apex.point;
	const dartId = params.dartId ?? `${wedge.apex.id}-dart`;
	const mode = params.wedge ?? 'close';
	let outline: Outline | null;
	if (mode === 'keep_as_dart') {
		if (!wedge.sharedA) return { error: panelRefuse('invalid_params', 'The edges meet only at the divergence point; close the wedge instead.') };
		outline = spliceOutlines(a.outline, b.outline, pathFirst(wedge.sharedA), pathLast(wedge.sharedA), tol);
	} else {
		const turn = rotateFn(D, wedge.closingRotationRad);
		b = pieceMapPoints(b, turn);
		const openB = pathMapPoints(wedge.openB, turn);
		const gap = chainsDeviation(wedge.openA, openB);
		if (gap > tol) {
			return {
				error: panelRefuse(
					'wedge_not_closing',
					`After closing the wedge at ${wedge.apex.label || wedge.apex.id} the edges are still ${gap.toFixed(2)} mm apart; true the seam first.`
				)
			};
		}
		eb = openB;
		outline = spliceOutlines(a.outline, b.outline, D, pathLast(wedge.openA), tol);
	}
	if (!outline) return { error: panelRefuse('seam_not_on_piece', 'The seam edges could not be found on the outlines.') };
	let piece = withApexAt(build(outline, a, b), wedge.apex);
	const opened = mode === 'keep_as_dart' || wedge.sharedA !== null;
	const newDart = opened ? dartAtPoint(outline, D, wedge.apex.id, dartId) : null;
	if (newDart) piece = piecePressByPractice({ ...piece, darts: [...piece.darts.filter((d) => d.id !== dartId), newDart] });
	const notes: string[] = [];
	if (opened && !newDart) notes.push(`The opening at ${wedge.apex.label || wedge.apex.id} has curved legs; it is left in the outline, not recorded as a dart.`);
	const carriedBy = params.carriedBy ?? (newDart ? `dart ${dartId}` : 'the seams through the divergence point');
	const ledgerEntries = [
		ledgerEntry({ apexId: wedge.apex.id, kind: 'seam', refId: 'panel-seam', label: `wedge between ${a.name} and ${bIn.name} ${mode === 'close' ? 'closed' : 'joined'}`, angleRad: -wedge.angleRad }),
		ledgerEntry({ apexId: wedge.apex.id, kind: newDart ? 'dart' : 'seam', refId: newDart ? dartId : carriedBy, label: `carried by ${carriedBy}`, angleRad: wedge.angleRad })
	];
	return { piece, ledgerEntries, closedAngleRad: mode === 'close' ? wedge.angleRad : 0, newDart, notes };
}

export function join(pieces: readonly Piece[], pair: SeamPair, params: JoinParams = {}): PiecesResult {
	const a = pieces.find((p) => p.id === pair.a.pieceId);
	const b = pieces.find((p) => p.id === pair.b.pieceId);
	if (!a || !b) return panelRefuse('invalid_params', `The seam pair "${pair.id}" names pieces that were not given.`);
	if (a === b) return panelRefuse('invalid_params', 'A piece cannot be joined to itself.');
	for (const p of [a, b]) {
		const problems = pieceProblems(p);
		if (problems.length) return panelRefuse('invalid_piece', `${p.name} has problems to fix first: ${problems[0]}`);
	}
	const out = joinPieces(a, b, pair.a.edge, pair.b.edge, params);
	if ('error' in out) return out.error;
	const problems = pieceProblems(out.piece);
	if (problems.length) return panelRefuse('result_broken', `This join would give a broken piece, so nothing was changed: ${problems[0]}`);
	const areaBefore = outlineArea(a.outline) + outlineArea(b.outline);
	return {
		ok: true,
		pieces: [out.piece],
		seamPairs: [],
		ledgerEntries: out.ledgerEntries,
		report: panelReport(
			'join',
			out.closedAngleRad > 0
				? `${a.name} and ${b.name} joined; the wedge of ${((out.closedAngleRad * 180) / Math.PI).toFixed(2)}° was closed.`
				: `${a.name} and ${b.name} joined along their seam.`,
			{ areaBeforeMm2: areaBefore, areaAfterMm2: outlineArea(out.piece.outline), closedAngleRad: out.closedAngleRad },
			out.notes
		)
	};
}
