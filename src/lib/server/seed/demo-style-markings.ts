import { demoPath } from '$lib/pattern/fixtures/demo-path';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';
import { pieceGeometryDifference } from '$lib/pattern/verify/piece-compare';
import type { DbOrTx } from '../db';
import { versionsGeometryOfStyle, versionsMarkingsSet } from '../repositories/versions';

/** The stored piece with the demo path's markings where it lacks them: pressing directions, centre marks. */
function withMarkings(stored: Piece, fresh: Piece): Piece {
	const darts = stored.darts.map((d) => {
		const f = fresh.darts.find((x) => x.id === d.id);
		return !d.pressToward && f?.pressToward ? { ...d, pressToward: f.pressToward } : d;
	});
	const labels = [...stored.labels, ...fresh.labels.filter((l) => !stored.labels.some((s) => s.id === l.id))];
	return { ...stored, darts, labels };
}

/**
 * Brings a demo style seeded by an earlier version of the product up to the demo path's markings: the
 * pressing direction of each dart (common practice) and the centre front mark, copied version by version
 * where the stored geometry is the path's own (outline, apexes, dart and pleat legs within the replay
 * tolerance). Shapes, recipes, metrics and checks are untouched: replay and verification read none of
 * these markings. Returns how many versions were brought up to date.
 */
export async function demoStyleMarkingsRefresh(db: DbOrTx, styleId: string): Promise<number> {
	const path = demoPath();
	let changed = 0;
	for (const v of await versionsGeometryOfStyle(db, styleId)) {
		const p = path.pieces.find((q) => q.name === v.pieceName);
		const fresh = p ? (v.number === 1 ? p.first : p.later[v.number - 2])?.geometry : undefined;
		const parsed = pieceSchema.safeParse(v.geometry);
		if (!fresh || !parsed.success || pieceGeometryDifference(parsed.data, fresh) !== null) continue;
		const next = withMarkings(v.geometry as Piece, fresh);
		if (JSON.stringify(next) === JSON.stringify(v.geometry)) continue;
		await versionsMarkingsSet(db, v.id, next);
		changed++;
	}
	return changed;
}
