import {
	outlineContainsPoint,
	outlineFlatten,
	outlineNearestPoint,
	pathBoundingBox,
	pathFlatten,
	pathNormalAt,
	pointsBoundingBox,
	vecAdd,
	vecLerp,
	vecNormalize,
	vecPerp,
	vecScale,
	vecSub,
	type BoundingBox,
	type Vec
} from '$lib/geometry';
import { outlinePleatsAcross, pleatMarks } from '$lib/pattern/export/pleat-marks';
import type { Piece } from '$lib/pattern/piece-schema';

/**
 * What the canvas draws for one piece, computed once per piece value (pieces are immutable), in the
 * piece's own millimetres. Polylines come from the kernel's flattening: drawing only, never measuring.
 */

/** How far a notch mark reaches outside the stitching line (mm). */
const NOTCH_OUTSIDE_MM = 6;
/** Flattening tolerance for the screen (mm). */
const DRAW_TOLERANCE_MM = 0.1;

export interface Arrow {
	readonly from: Vec;
	readonly to: Vec;
	readonly heads: 'both' | 'one';
}

export interface PieceDrawing {
	readonly bbox: BoundingBox;
	/** Bounding box including the cut line. */
	readonly outerBox: BoundingBox;
	readonly stitch: readonly Vec[];
	/**
	 * The cut line of the piece's own seam allowance; empty for a net piece (no allowance set): nothing
	 * that looks like an allowance is drawn where none is set.
	 */
	readonly cut: readonly (readonly Vec[])[];
	readonly internal: readonly (readonly Vec[])[];
	/** Thin ink marks: notches, dart centre lines, pleat lines, sewn legs, caps. */
	readonly marks: readonly (readonly Vec[])[];
	/** Dotted marks: dart centre lines. */
	readonly dotted: readonly (readonly Vec[])[];
	readonly arrows: readonly Arrow[];
	readonly foldLine: readonly Vec[] | null;
	readonly apexes: readonly Vec[];
	readonly drill: readonly Vec[];
	readonly labels: readonly { text: string; at: Vec; angleRad: number }[];
	readonly title: { text: string; at: Vec };
	readonly vertexCount: number;
}

const cache = new WeakMap<Piece, PieceDrawing>();

export function pieceDrawing(piece: Piece): PieceDrawing {
	let d = cache.get(piece);
	if (!d) {
		d = buildDrawing(piece);
		cache.set(piece, d);
	}
	return d;
}

function notchMarks(piece: Piece): Vec[][] {
	const out: Vec[][] = [];
	for (const n of piece.notches) {
		const near = outlineNearestPoint(piece.outline, n.at);
		let normal = pathNormalAt(piece.outline, near);
		if (outlineContainsPoint(piece.outline, vecAdd(near.point, vecScale(normal, 1)))) normal = vecScale(normal, 1);
		else normal = vecScale(normal, -1);
		const along = vecPerp(normal);
		const offsets = n.count === 2 ? [-1.5, 1.5] : [0];
		for (const o of offsets) {
			const a = vecAdd(near.point, vecScale(along, o));
			out.push([vecAdd(a, vecScale(normal, -NOTCH_OUTSIDE_MM)), vecAdd(a, vecScale(normal, 5))]);
		}
	}
	return out;
}

function buildDrawing(piece: Piece): PieceDrawing {
	// pleats drawn as sewn, as on the piece's page and in the export: the seam runs across their mouths
	const stitch = outlineFlatten(piece.pleats.length ? outlinePleatsAcross(piece) : piece.outline, DRAW_TOLERANCE_MM);
	const bbox = pathBoundingBox(piece.outline);
	const cut = piece.seamAllowance ? [outlineFlatten(piece.seamAllowance.cutLine, DRAW_TOLERANCE_MM)] : [];
	const outerBox = cut.length ? pointsBoundingBox(cut.flat()) : bbox;
	const apexOf = new Map(piece.apexes.map((a) => [a.id, a.point]));
	const marks: Vec[][] = notchMarks(piece);
	const dotted: Vec[][] = [];
	const arrows: Arrow[] = [];
	for (const d of piece.darts) {
		const apex = apexOf.get(d.apexId);
		if (!apex) continue;
		const mouth = vecLerp(d.leg1End, d.leg2End, 0.5);
		dotted.push([apex, mouth]);
		if (d.pullBack) {
			const t = d.pullBack.sewnPoint;
			marks.push([d.leg1End, t, d.leg2End]);
			// a short bar across the centre line marks the sewn point
			const across = vecScale(vecPerp(vecNormalize(vecSub(mouth, apex))), 3);
			marks.push([vecAdd(t, across), vecSub(t, across)]);
		}
		if (d.cap) marks.push(pathFlatten(d.cap.edges, DRAW_TOLERANCE_MM));
		if (d.pressToward) {
			const toward = d.pressToward === 'leg1' ? d.leg1End : d.leg2End;
			const from = vecLerp(apex, mouth, 0.8);
			const to = vecLerp(apex, toward, 0.8);
			arrows.push({ from, to: vecLerp(from, to, 0.8), heads: 'one' });
		}
	}
	for (const p of piece.pleats) {
		// the fold and placement lines from the seam over the stitched length, and the fold arrow
		const m = pleatMarks(p);
		marks.push([...m.fold], [...m.placement]);
		arrows.push({ from: m.arrow.from, to: m.arrow.to, heads: 'one' });
	}
	if (piece.grainline) arrows.push({ from: piece.grainline.from, to: piece.grainline.to, heads: piece.grainline.arrowheads });
	const internal = piece.internalLines.map((l) => pathFlatten(l.path, DRAW_TOLERANCE_MM));
	const labels = piece.labels.map((l) => ({ text: l.text, at: l.at, angleRad: l.angleRad }));
	return {
		bbox,
		outerBox,
		stitch,
		cut,
		internal,
		marks,
		dotted,
		arrows,
		foldLine: piece.foldLine ? [piece.foldLine.from, piece.foldLine.to] : null,
		apexes: piece.apexes.map((a) => a.point),
		drill: piece.drillHoles.map((h) => h.at),
		labels,
		title: { text: piece.name, at: { x: (bbox.minX + bbox.maxX) / 2, y: (bbox.minY + bbox.maxY) / 2 } },
		vertexCount: stitch.length
	};
}
