import { outlineContainsPoint, type Outline, type Vec } from '../kernel';
import { wedgeGeometry } from '../piece';
import type { Apex, Dart, Piece } from '../piece-schema';
import { dist } from './chain-tools';

/** A wedge cut out of an outline at an apex that is taken for a dart: narrower than this. */
const MAX_DART_ANGLE_RAD = (150 * Math.PI) / 180;

/**
 * A dart wedge in the outline at D that no dart of the piece records yet: a straight segment ending at
 * D followed by a straight one leaving it, the cloth between them cut out (the point just inside the
 * wedge's mouth lies outside the outline). This is what a seam that separate made through a dart's apex
 * leaves when the parts are joined back along it: the outline is whole again, the wedge with it.
 */
export function unrecordedDartAt(outline: Outline, apex: Apex, known: readonly Dart[], id: string): Dart | null {
	const D = apex.point;
	const segs = outline.segments;
	const tol = 1e-3;
	for (let i = 0; i < segs.length; i++) {
		const s = segs[i];
		const t = segs[(i + 1) % segs.length];
		if (s.kind !== 'line' || t.kind !== 'line' || dist(s.p1, D) > tol) continue;
		const l1 = s.p0;
		const l2 = t.p1;
		if (known.some((d) => dist(d.leg1End, l1) <= tol && dist(d.leg2End, l2) <= tol)) continue;
		const g = wedgeGeometry(D, l1, l2);
		if (!(g.angleRad > 1e-6 && g.angleRad < MAX_DART_ANGLE_RAD)) continue;
		const reach = 0.01 * Math.min(dist(l1, D), dist(l2, D));
		const u1 = { x: (l1.x - D.x) / dist(l1, D), y: (l1.y - D.y) / dist(l1, D) };
		const u2 = { x: (l2.x - D.x) / dist(l2, D), y: (l2.y - D.y) / dist(l2, D) };
		const inWedge: Vec = { x: D.x + ((u1.x + u2.x) / 2) * reach, y: D.y + ((u1.y + u2.y) / 2) * reach };
		if (outlineContainsPoint(outline, inWedge)) continue;
		return { id, apexId: apex.id, leg1End: l1, leg2End: l2, movingLeg: 'leg2' };
	}
	return null;
}

/** Darts to give back to a piece joined along a seam whose ends lie at apexes (each end at most once). */
export function reopenedDarts(piece: Piece, seamEnds: readonly Vec[], tolMm: number, idFor: (apex: Apex) => string): Dart[] {
	const out: Dart[] = [];
	for (const apex of piece.apexes) {
		if (!seamEnds.some((e) => dist(e, apex.point) <= tolMm)) continue;
		const d = unrecordedDartAt(piece.outline, apex, [...piece.darts, ...out], idFor(apex));
		if (d && !piece.darts.some((x) => x.id === d.id)) out.push(d);
	}
	return out;
}
