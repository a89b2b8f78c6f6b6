import {
	outlineContainsPoint,
	outlineFlatten,
	outlineNearestPoint,
	pathLength,
	pathPointAtLength,
	type Outline,
	type Vec
} from '../kernel';
import { pleatWedgeSegmentRange, wedgeSegmentIndex } from '../piece';
import type { Grainline, Piece } from '../piece-schema';
import { polygonCentroid } from './chain-tools';
import { ON_LINE_MM } from './panel-tolerances';

/** Which markings of a piece go with a part of it (point-in tests), for separate and carry. */

export function onOrInside(outline: Outline, p: Vec): boolean {
	return outlineContainsPoint(outline, p) || outlineNearestPoint(outline, p).distance <= ON_LINE_MM;
}

/** A grainline copied onto a part: kept where it is if its middle is inside, else moved to the part's middle. */
export function grainlineForPart(grain: Grainline | null, outline: Outline): Grainline | null {
	if (!grain) return null;
	const mid = { x: (grain.from.x + grain.to.x) / 2, y: (grain.from.y + grain.to.y) / 2 };
	if (outlineContainsPoint(outline, mid)) return grain;
	const c = polygonCentroid(outlineFlatten(outline, 0.5));
	if (!outlineContainsPoint(outline, c)) return grain;
	const d = { x: c.x - mid.x, y: c.y - mid.y };
	return { ...grain, from: { x: grain.from.x + d.x, y: grain.from.y + d.y }, to: { x: grain.to.x + d.x, y: grain.to.y + d.y } };
}

/**
 * The piece's markings that belong to a part with the given outline. Darts and pleats go where their
 * wedge is in the outline; apexes with them or by point-in; notches on the outline; the rest by point-in.
 * `dropInternalLineId` removes the line that became the cut.
 */
export function markingsForPart(piece: Piece, outline: Outline, dropInternalLineId?: string): Omit<Piece, 'schemaVersion' | 'id' | 'name' | 'outline' | 'cut' | 'fabric'> {
	const apexPoint = new Map(piece.apexes.map((a) => [a.id, a.point]));
	const darts = piece.darts.filter((d) => {
		const a = apexPoint.get(d.apexId);
		return a !== undefined && wedgeSegmentIndex(outline, a, d.leg1End, d.leg2End) >= 0;
	});
	const pleats = piece.pleats.filter((p) => {
		const a = apexPoint.get(p.apexId);
		return a !== undefined && pleatWedgeSegmentRange(outline, a, p) !== null;
	});
	const used = new Set([...darts.map((d) => d.apexId), ...pleats.map((p) => p.apexId)]);
	const apexes = piece.apexes.filter((a) => used.has(a.id) || onOrInside(outline, a.point));
	const notches = piece.notches.filter((n) => outlineNearestPoint(outline, n.at).distance <= 10 * ON_LINE_MM);
	const midOf = (path: { segments: readonly unknown[] }) =>
		pathPointAtLength(path as Outline, pathLength(path as Outline) / 2).point;
	const internalLines = piece.internalLines.filter((l) => l.id !== dropInternalLineId && outlineContainsPoint(outline, midOf(l.path)));
	return {
		apexes,
		darts,
		pleats,
		notches,
		grainline: grainlineForPart(piece.grainline, outline),
		foldLine:
			piece.foldLine && onOrInside(outline, piece.foldLine.from) && onOrInside(outline, piece.foldLine.to) ? piece.foldLine : null,
		// a changed stitching line: any seam allowance must be added again
		seamAllowance: null,
		internalLines,
		drillHoles: piece.drillHoles.filter((h) => outlineContainsPoint(outline, h.at)),
		labels: piece.labels.filter((l) => outlineContainsPoint(outline, l.at))
	};
}
