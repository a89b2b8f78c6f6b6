import { outlineNearestPoint, pointRotateAbout, segmentRotateAbout, vecDistance, vecDot, vecSub, type Vec } from '../kernel';
import { apexById } from '../piece';
import type { OperationErrorCode } from '../operation-result';
import type { Dart, LineMark, Piece } from '../piece-schema';
import { openWedges, TARGET_SNAP_TOLERANCE_MM, type OpenWedgesOutput, type OpenWedgesResult, type WedgeRequest } from './open-wedges';

/**
 * Which side of a piece stays still when a dart is turned about its apex, and where a wedge may not open.
 *
 * Trade rule (trade-primer §8 and §1): a place-on-fold edge is straight and on grain, and the cut piece is
 * the pattern plus its reflection across it. So no dart, pleat or slash may open on the fold, and when a
 * dart is pivoted the side that holds the fold line stays still; failing a fold, the side of the centre
 * front (or back, marked by its label "CF" or "CB"); failing that, the side that holds the grainline (drawn
 * parallel to the centre line, reference-values row 27, C). The other side turns. Pivoting about the apex
 * therefore never moves, nor slants, the fold line.
 */

export interface StillAnchor {
	readonly kind: 'fold' | 'centre' | 'grainline';
	/** A point of the marking; the part of the piece that holds it must not turn. */
	readonly point: Vec;
	/** How a message names it. */
	readonly name: string;
}

const mid = (l: LineMark): Vec => ({ x: (l.from.x + l.to.x) / 2, y: (l.from.y + l.to.y) / 2 });

/** A label that marks the centre line ("CF", "CB", "centre front"…), as the drafts place beside it. */
export const CENTRE_LABEL = /^\s*(cf|cb|cent(?:re|er) (?:front|back))\s*$/i;

/** The piece's centre front or back, where a label marks it: the nearest point of the outline to the label. */
export function centreMark(piece: Piece): { point: Vec; name: string } | null {
	const label = piece.labels.find((l) => CENTRE_LABEL.test(l.text));
	if (!label) return null;
	const back = /^\s*(cb|cent(?:re|er) back)\s*$/i.test(label.text);
	return { point: outlineNearestPoint(piece.outline, label.at).point, name: back ? 'the centre back' : 'the centre front' };
}

/**
 * The marking whose side stays still: the fold line, else the centre front (or back), else the grainline;
 * null when the piece has none of them.
 */
export function stillAnchor(piece: Piece): StillAnchor | null {
	if (piece.foldLine) return { kind: 'fold', point: mid(piece.foldLine), name: 'the fold line' };
	const centre = centreMark(piece);
	if (centre) return { kind: 'centre', ...centre };
	if (piece.grainline) return { kind: 'grainline', point: mid(piece.grainline), name: 'the grainline' };
	return null;
}

/** Distance from p to the segment a–b. */
function distanceToSegment(p: Vec, a: Vec, b: Vec): number {
	const ab = vecSub(b, a);
	const l2 = vecDot(ab, ab);
	const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, vecDot(vecSub(p, a), ab) / l2));
	return vecDistance(p, { x: a.x + ab.x * t, y: a.y + ab.y * t });
}

/**
 * True when p lies on the piece's fold line (within the snap tolerance), away from its two ends: an
 * opening there would cut into the fold. The fold's end corners are not on it (the edges meeting there
 * are seams).
 */
export function pointOnFold(piece: Piece, p: Vec, toleranceMm = TARGET_SNAP_TOLERANCE_MM): boolean {
	const f = piece.foldLine;
	if (!f) return false;
	if (vecDistance(p, f.from) <= toleranceMm || vecDistance(p, f.to) <= toleranceMm) return false;
	return distanceToSegment(p, f.from, f.to) <= toleranceMm;
}

const fmt = (p: Vec) => `(${p.x.toFixed(1)}, ${p.y.toFixed(1)})`;

/** The refusal for an opening asked for on the fold line (`what`: "A dart", "Pleat 2", "Slash 1"…). */
export function foldRefusal(what: string, p: Vec): { code: OperationErrorCode; message: string } {
	return {
		code: 'target_on_fold',
		message: `${what} cannot open at ${fmt(p)}: that point is on the fold line, where the piece is cut in one with its mirror image. Choose a point on a seam.`
	};
}

export type StillWedgesResult =
	| (Extract<OpenWedgesResult, { ok: true }> & { readonly still: StillAnchor | null })
	| Extract<OpenWedgesResult, { ok: false }>;

/**
 * openWedges with the trade rules above: refuses openings on the fold line, then keeps the part that holds
 * the fold line (else the grainline) still. The engine turns the chains on the dart's moving-leg side; when
 * that would turn the anchor's part by α, the whole result is turned back by −α about the apex. A rigid
 * turn of the whole piece changes no angle, length or area, so the shaping is the same; only which part
 * keeps its place changes. With the anchor on a middle part (pleats on both sides of the dart) the parts on
 * either side turn toward each other and close the dart between them.
 */
export function openWedgesKeepingStill(
	piece: Piece,
	dart: Dart,
	requests: readonly WedgeRequest[],
	keepAngleRad: number,
	what: (index: number) => string
): StillWedgesResult {
	for (let i = 0; i < requests.length; i++) {
		if (pointOnFold(piece, requests[i].at)) return { ok: false, ...foldRefusal(what(i), requests[i].at) };
	}
	const anchor = stillAnchor(piece);
	const r = openWedges(piece, dart, requests, keepAngleRad);
	if (!r.ok) return r;
	const alpha = anchor ? r.value.rotationForPoint(anchor.point) : 0;
	if (alpha === 0) return { ...r, still: anchor };
	const apex = apexById(piece, dart.apexId)!.point;
	const turn = (p: Vec) => pointRotateAbout(p, apex, -alpha);
	const turnOpt = (p: Vec | undefined) => (p ? turn(p) : undefined);
	const v = r.value;
	const value: OpenWedgesOutput = {
		outline: { segments: v.outline.segments.map((s) => segmentRotateAbout(s, apex, -alpha)) },
		openings: v.openings.map((o) => ({ ...o, leg1End: turn(o.leg1End), leg2End: turn(o.leg2End), pivot1: turnOpt(o.pivot1), pivot2: turnOpt(o.pivot2) })),
		remainingDart: v.remainingDart ? { leg1End: turn(v.remainingDart.leg1End), leg2End: turn(v.remainingDart.leg2End) } : null,
		rotationForPoint: (p) => {
			const a = v.rotationForPoint(p);
			return vecDistance(p, apex) < 1e-9 ? 0 : a - alpha;
		},
		// the whole outline turns: every chain stays one rigid piece
		rigidParts: v.rigidParts,
		notes: v.notes
	};
	return { ok: true, value, still: anchor };
}
