import type { Outline, Vec } from '$lib/pattern/kernel';
import { outlineContainsPoint, pathNearestPoint, pathTangentAt, vecAdd, vecLerp, vecNormalize, vecPerp, vecScale, vecSub } from '$lib/pattern/kernel';
import type { Piece } from '$lib/pattern/piece-schema';
import { polyline, type DrawItem } from './drawing';

/** Depth of a notch slit (mm): shallower than the usual seam allowances (common practice). */
export const NOTCH_DEPTH_MM = 5;
/** Spacing of the slits of a double or triple notch along the seam (mm). */
export const NOTCH_SPACING_MM = 4;

/** Unit normal of the outline at its point nearest p, turned away from the piece. */
function outwardNormalAt(outline: Outline, p: Vec): { at: Vec; tangent: Vec; outward: Vec } {
	const near = pathNearestPoint(outline, p);
	const tangent = pathTangentAt(outline, near);
	const n = vecPerp(tangent);
	const outside = !outlineContainsPoint(outline, vecAdd(near.point, vecScale(n, 0.5)));
	return { at: near.point, tangent, outward: outside ? n : vecScale(n, -1) };
}

/**
 * Notches as a cutter snips them: short slits square to the seam. With the allowance shown they cut in
 * from the cut line toward the stitching line; on a net pattern they run in from the edge. A double
 * notch is two slits NOTCH_SPACING_MM apart along the seam.
 */
export function notchSlits(piece: Piece, stitching: Outline): DrawItem[] {
	const widthMm = piece.seamAllowance?.defaultWidthMm ?? 0;
	const depthMm = widthMm > 0 ? Math.min(NOTCH_DEPTH_MM, widthMm * 0.6) : NOTCH_DEPTH_MM;
	const items: DrawItem[] = [];
	for (const k of piece.notches) {
		const { at, tangent, outward } = outwardNormalAt(stitching, k.at);
		for (let i = 0; i < k.count; i++) {
			const base = vecAdd(at, vecScale(tangent, (i - (k.count - 1) / 2) * NOTCH_SPACING_MM));
			const edge = vecAdd(base, vecScale(outward, widthMm));
			items.push(polyline([edge, vecSub(edge, vecScale(outward, depthMm))], 'mark'));
		}
	}
	return items;
}

/**
 * A dart's pressing direction, where the piece says it: an arrow across the dart near its wide end,
 * from the centre line toward the leg it is pressed to.
 */
export function dartPressArrows(piece: Piece): DrawItem[] {
	const items: DrawItem[] = [];
	for (const d of piece.darts) {
		if (!d.pressToward) continue;
		const apex = piece.apexes.find((a) => a.id === d.apexId);
		if (!apex) continue;
		const tip = d.pullBack?.sewnPoint ?? apex.point;
		const legEnd = d.pressToward === 'leg1' ? d.leg1End : d.leg2End;
		const from = vecLerp(tip, vecLerp(d.leg1End, d.leg2End, 0.5), 0.75);
		const to = vecLerp(from, vecLerp(tip, legEnd, 0.75), 0.8);
		const dir = vecNormalize(vecSub(to, from));
		const back = vecSub(to, vecScale(dir, 2));
		const side = vecScale(vecPerp(dir), 0.8);
		items.push(polyline([from, to], 'fine'), { ...polyline([vecAdd(back, side), to, vecSub(back, side)], 'mark', true), fill: true });
	}
	return items;
}
