import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import type { Vec } from '$lib/pattern/kernel';

const loop = (pts: Vec[]) => ({ segments: pts.map((p, i) => ({ kind: 'line' as const, p0: p, p1: pts[(i + 1) % pts.length] })) });
const rect = (x: number, y: number, w: number, h: number) => [
	{ x, y },
	{ x: x + w, y },
	{ x: x + w, y: y + h },
	{ x, y: y + h }
];

/** A plain rectangle piece, w × h mm, optionally with an even seam allowance and a grainline at an angle. */
export function rectPiece(o: { name: string; w: number; h: number; cut: Piece['cut']; allowanceMm?: number; grainDeg?: number }): Piece {
	const a = o.allowanceMm ?? 0;
	const rad = ((o.grainDeg ?? 0) * Math.PI) / 180;
	const c = { x: o.w / 2, y: o.h / 2 };
	const half = Math.min(o.w, o.h) / 3;
	return pieceSchema.parse({
		schemaVersion: 1,
		id: `rect-${o.name}`,
		name: o.name,
		outline: loop(rect(0, 0, o.w, o.h)),
		grainline: {
			from: { x: c.x - half * Math.sin(rad), y: c.y - half * Math.cos(rad) },
			to: { x: c.x + half * Math.sin(rad), y: c.y + half * Math.cos(rad) },
			arrowheads: 'both'
		},
		seamAllowance: a ? { defaultWidthMm: a, cutLine: loop(rect(-a, -a, o.w + 2 * a, o.h + 2 * a)) } : null,
		cut: o.cut
	});
}
