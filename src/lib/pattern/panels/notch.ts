import { outlineNearestPoint, segmentTangentAt, vecAngleBetween, type Vec } from '../kernel';
import { SEAM_CORNER_ANGLE_RAD } from '../metrics';
import type { Piece } from '../piece-schema';
import { dist } from './chain-tools';
import { panelRefuse, panelReport, type PieceResult } from './panel-types';

/**
 * notch: a match mark on the stitching line (trade-primer §7: one notch front, two back). Points within
 * `snapToleranceMm` of the outline are snapped onto it; a notch on a corner is refused (it is lost in
 * cutting, and a corner must never be notched on both sides).
 */

export interface NotchParams {
	readonly id: string;
	readonly at: Vec;
	readonly count?: 1 | 2;
	readonly snapToleranceMm?: number;
}

/** Corner vertices of an outline (a turn of more than 25°). */
export function outlineCorners(piece: Piece): Vec[] {
	const segs = piece.outline.segments;
	return segs
		.filter((s, i) => Math.abs(vecAngleBetween(segmentTangentAt(segs[(i - 1 + segs.length) % segs.length], 1), segmentTangentAt(s, 0))) > SEAM_CORNER_ANGLE_RAD)
		.map((s) => s.p0);
}

export function notch(piece: Piece, params: NotchParams): PieceResult {
	if (piece.notches.some((n) => n.id === params.id)) return panelRefuse('invalid_params', `The piece already has a notch "${params.id}".`);
	const tol = params.snapToleranceMm ?? 1;
	const near = outlineNearestPoint(piece.outline, params.at);
	if (near.distance > tol) {
		return panelRefuse('point_off_outline', `A notch goes on the stitching line; this point is ${near.distance.toFixed(1)} mm from it (within ${tol} mm is snapped).`);
	}
	const corner = outlineCorners(piece).find((c) => dist(c, near.point) < 0.5);
	if (corner) return panelRefuse('point_off_outline', 'A notch on a corner is lost in cutting; place it along one of the edges.');
	const count = params.count ?? 1;
	return {
		ok: true,
		piece: { ...piece, notches: [...piece.notches, { id: params.id, at: near.point, count }] },
		ledgerEntries: [],
		report: panelReport('notch', `${count === 2 ? 'Double' : 'Single'} notch placed on ${piece.name}.`, { snapMm: near.distance })
	};
}
