import { pieceMetrics } from '$lib/pattern/metrics';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { piecesCompare } from '$lib/pattern/verify/metrics-compare';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { pieceOr404, versionOr404 } from './access';

/**
 * Two versions (of one piece, or two pieces of the studio) side by side. Metrics are recomputed from
 * the stored geometry, so the comparison never depends on what a client once sent; sewn seams are
 * compared with darts folded out and named by where they run, and only what a pattern cutter would
 * check is flagged (COMPARE_THRESHOLDS).
 */
export async function versionsComparison(
	db: DbOrTx,
	studioId: string,
	role: Role,
	a: { pieceId: string; versionId: string },
	b: { pieceId: string; versionId: string }
) {
	const sides = [];
	for (const s of [a, b]) {
		const piece = await pieceOr404(db, studioId, s.pieceId);
		const v = await versionOr404(db, s.pieceId, s.versionId, role);
		const geometry = pieceSchema.parse(v.geometry);
		sides.push({
			piece: { id: piece.id, name: piece.name },
			version: { id: v.id, number: v.number, state: v.state, message: v.message, createdAt: v.createdAt, authorName: v.authorName },
			geometry,
			metrics: pieceMetrics(geometry),
			ledger: (v.metrics as { ledger?: unknown[] } | null)?.ledger ?? []
		});
	}
	return { a: sides[0], b: sides[1], rows: piecesCompare(sides[0].geometry, sides[1].geometry) };
}
