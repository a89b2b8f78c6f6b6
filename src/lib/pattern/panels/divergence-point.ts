import { outlineNearestPoint, type Vec } from '../kernel';
import type { Apex, Piece } from '../piece-schema';
import { dist } from './chain-tools';
import { panelRefuse, panelReport, type PieceResult } from './panel-types';
import { VERTEX_SNAP_MM } from './panel-tolerances';

/**
 * divergence_point: mark the point where two panel seams part (trade-primer §6, "Merging panels"), so
 * that join and carry can close the wedge there. Either an apex the piece already has becomes a
 * divergence point (after separating through a bust point, that point is where the new seams part): it
 * keeps its id, so every ledger entry posted at it goes on counting there; or a new divergence point is
 * put on the stitching line (snapped onto it within `snapToleranceMm`, onto a corner within 0.1 mm).
 * No shaping moves: the ledger has no entry for it.
 */
export interface DivergencePointParams {
	/** An apex of the piece to mark as a divergence point. */
	readonly apexId?: string;
	/** Or a point on the stitching line, with the new apex's id (and label). */
	readonly at?: Vec;
	readonly id?: string;
	readonly label?: string;
	readonly snapToleranceMm?: number;
}

export function divergencePoint(piece: Piece, params: DivergencePointParams): PieceResult {
	if (params.apexId !== undefined) {
		const apex = piece.apexes.find((a) => a.id === params.apexId);
		if (!apex) return panelRefuse('invalid_params', `The piece has no apex "${params.apexId}".`);
		if (apex.kind === 'divergence') return panelRefuse('invalid_params', `${apex.label || apex.id} is a divergence point already.`);
		if (outlineNearestPoint(piece.outline, apex.point).distance > VERTEX_SNAP_MM) {
			return panelRefuse('point_off_outline', `${apex.label || apex.id} is inside the piece: seams part on the stitching line, so separate through it first.`);
		}
		const marked: Apex = { ...apex, kind: 'divergence', label: params.label ?? apex.label };
		return {
			ok: true,
			piece: { ...piece, apexes: piece.apexes.map((a) => (a.id === apex.id ? marked : a)) },
			ledgerEntries: [],
			report: panelReport('divergence_point', `${apex.label || apex.id} on ${piece.name} marked as a divergence point.`)
		};
	}
	if (!params.at || !params.id) return panelRefuse('invalid_params', 'Give the apex to mark, or a point on the stitching line and an id for it.');
	if (piece.apexes.some((a) => a.id === params.id)) return panelRefuse('invalid_params', `The piece already has an apex "${params.id}".`);
	const tol = params.snapToleranceMm ?? 1;
	const near = outlineNearestPoint(piece.outline, params.at);
	if (near.distance > tol) {
		return panelRefuse('point_off_outline', `A divergence point lies on the stitching line; this point is ${near.distance.toFixed(1)} mm from it (within ${tol} mm is snapped).`);
	}
	const corner = piece.outline.segments.map((s) => s.p0).find((v) => dist(v, near.point) <= VERTEX_SNAP_MM);
	const at = corner ?? near.point;
	const apex: Apex = { id: params.id, kind: 'divergence', label: params.label ?? 'D', point: at };
	return {
		ok: true,
		piece: { ...piece, apexes: [...piece.apexes, apex] },
		ledgerEntries: [],
		report: panelReport('divergence_point', `Divergence point ${apex.label} placed on ${piece.name}.`, { snapMm: dist(params.at, at) })
	};
}
