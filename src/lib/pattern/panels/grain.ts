import { outlineContainsPoint, type Vec } from '../kernel';
import type { LineMark, Piece } from '../piece-schema';
import { panelRefuse, panelReport, type PieceResult } from './panel-types';

/**
 * grain: place the grainline (trade-primer §8; reference-values row 27, C): lengthwise = parallel to the
 * centre line, crosswise = perpendicular to it, bias = at 45°. Two arrowheads: either direction; one:
 * one way only (nap, print), pointing from `from` to `to`. The centre line defaults to the fold line, else
 * the vertical of the pattern (y down).
 */

export type GrainDirection = 'lengthwise' | 'crosswise' | 'bias';

export interface GrainParams {
	/** Middle of the grainline. */
	readonly through: Vec;
	readonly lengthMm: number;
	readonly direction?: GrainDirection;
	readonly centreLine?: LineMark;
	readonly arrowheads?: 'both' | 'one';
}

export function grain(piece: Piece, params: GrainParams): PieceResult {
	if (!(params.lengthMm > 0)) return panelRefuse('invalid_params', 'The grainline needs a length above 0 mm.');
	const ref = params.centreLine ?? piece.foldLine ?? { from: { x: 0, y: 0 }, to: { x: 0, y: 1 } };
	const dx = ref.to.x - ref.from.x;
	const dy = ref.to.y - ref.from.y;
	const l = Math.hypot(dx, dy);
	if (l === 0) return panelRefuse('invalid_params', 'The centre line has no length.');
	const turn = { lengthwise: 0, crosswise: Math.PI / 2, bias: Math.PI / 4 }[params.direction ?? 'lengthwise'];
	const c = Math.cos(turn);
	const s = Math.sin(turn);
	const u = { x: (c * dx - s * dy) / l, y: (s * dx + c * dy) / l };
	const h = params.lengthMm / 2;
	const from = { x: params.through.x - u.x * h, y: params.through.y - u.y * h };
	const to = { x: params.through.x + u.x * h, y: params.through.y + u.y * h };
	for (const p of [from, params.through, to]) {
		if (!outlineContainsPoint(piece.outline, p)) {
			return panelRefuse('point_outside_piece', `The grainline runs off the piece at (${p.x.toFixed(1)}, ${p.y.toFixed(1)}) mm; shorten it or move it.`);
		}
	}
	return {
		ok: true,
		piece: { ...piece, grainline: { from, to, arrowheads: params.arrowheads ?? 'both' } },
		ledgerEntries: [],
		report: panelReport('grain', `Grainline (${params.direction ?? 'lengthwise'}) placed on ${piece.name}.`, { lengthMm: params.lengthMm, angleToCentreLineRad: turn })
	};
}
