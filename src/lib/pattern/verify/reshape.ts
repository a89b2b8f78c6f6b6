import { z } from 'zod';
import { segmentMapPoints, vecDistance, type Vec } from '../kernel';
import { refuse, succeed, type OperationResult } from '../operation-result';
import type { Piece } from '../piece-schema';

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });
const vecSchema = z.object({ x: finite(), y: finite() });

/** Points closer than this to a move's `from` are moved with it (mm). */
export const RESHAPE_MATCH_MM = 1e-4;

export const reshapeParamsSchema = z.object({
	moves: z.array(z.object({ from: vecSchema, to: vecSchema })).min(1).max(500)
});
export type ReshapeParams = z.infer<typeof reshapeParamsSchema>;

/**
 * Direct manipulation: move outline points (ends and Bézier handles) and the markings that sit on
 * them. It posts nothing to the ledger on purpose: whatever it changes in a dart angle, the area or a
 * seam length must be declared as a labelled change on save (ease or fullness, added or removed, or
 * other with a note; `reshape-declaration.ts` finds the changes and builds the entries) or the server
 * refuses the version.
 */
export function reshape(piece: Piece, raw: unknown): OperationResult {
	const parsed = reshapeParamsSchema.safeParse(raw);
	if (!parsed.success) return refuse('invalid_params', `Reshape needs a list of point moves: ${parsed.error.issues[0]?.message}`);
	const moves = parsed.data.moves;
	let matched = 0;
	const move = (p: Vec): Vec => {
		for (const m of moves) {
			if (vecDistance(p, m.from) <= RESHAPE_MATCH_MM) {
				matched++;
				return m.to;
			}
		}
		return p;
	};
	const outline = { segments: piece.outline.segments.map((s) => segmentMapPoints(s, move)) };
	if (matched === 0) return refuse('target_off_outline', 'None of the points to move lies on the outline.');
	const next: Piece = {
		...piece,
		outline,
		apexes: piece.apexes.map((a) => ({ ...a, point: move(a.point) })),
		darts: piece.darts.map((d) => ({ ...d, leg1End: move(d.leg1End), leg2End: move(d.leg2End) })),
		notches: piece.notches.map((k) => ({ ...k, at: move(k.at) }))
	};
	return succeed(next, [], {
		op: 'reshape',
		summary: `Moved ${moves.length} point${moves.length === 1 ? '' : 's'} by hand.`,
		values: { moves: moves.length },
		notes: ['Changes to shaping, area or seam lengths must be declared on save.']
	});
}
