import type { Outline, Path, Segment, Vec } from '$lib/pattern/kernel';
import { outlineArea, outlineProblems, pathLength } from '$lib/pattern/kernel';
import { pieceSchema, type Piece } from '$lib/pattern/piece-schema';

/** A notch read from a file: where it sits on the net outline, and how many slits it has. */
export interface ImportedNotch {
	readonly at: Vec;
	readonly count: 1 | 2;
}

/**
 * What an imported file holds, before it becomes pieces: per piece a boundary (the cut line), maybe a
 * sew line, grain, notches, internal lines and drill holes, in millimetres, y down. Pure.
 */
export interface ImportedPiece {
	readonly name: string;
	/** Where in the file it came from (block, path id), for messages. */
	readonly source: string;
	readonly boundary: Outline;
	readonly sewLine?: Outline;
	/** Corners where the net outline touches itself (shared dart apexes). */
	readonly touchPoints?: readonly Vec[];
	readonly grainline?: { from: Vec; to: Vec };
	readonly notches: readonly ImportedNotch[];
	readonly internalLines: readonly Path[];
	readonly drillHoles: readonly Vec[];
	readonly cut: Piece['cut'];
	readonly fabric: string;
}

/** A refusal of the whole file: nothing is stored. `where` names the entity or path. */
export class ImportRefusal extends Error {
	constructor(
		readonly status: 415 | 413 | 422,
		readonly code: string,
		message: string,
		readonly where?: string
	) {
		super(message);
	}
}

/** Points closer than this are one (mm): shorter segments than the kernel accepts are merged. */
const MERGE_MM = 0.02;

/** A closed outline of straight segments through the points (a repeated last point is dropped). */
export function polygonOutline(points: readonly Vec[]): Outline {
	const pts: Vec[] = [];
	for (const p of points) {
		const last = pts[pts.length - 1];
		if (!last || Math.hypot(p.x - last.x, p.y - last.y) >= MERGE_MM) pts.push(p);
	}
	while (pts.length > 1 && Math.hypot(pts[0].x - pts[pts.length - 1].x, pts[0].y - pts[pts.length - 1].y) < MERGE_MM) pts.pop();
	return { segments: pts.map((p, i): Segment => ({ kind: 'line', p0: p, p1: pts[(i + 1) % pts.length] })) };
}

export function polylinePath(points: readonly Vec[]): Path {
	const segments: Segment[] = [];
	for (let i = 0; i + 1 < points.length; i++) segments.push({ kind: 'line', p0: points[i], p1: points[i + 1] });
	return { segments };
}

/** Is p a corner of the outline (where a dart's legs meet, the outline may touch itself)? */
function isCorner(outline: Outline, p: Vec): boolean {
	return outline.segments.some((s) => Math.hypot(s.p0.x - p.x, s.p0.y - p.y) < 1e-3);
}

/**
 * Refuses an outline that is open, too small or crosses itself, naming where it came from. Touching
 * itself at a corner (the apex two darts share) is no crossing: those points are returned, to be kept
 * as apexes of the piece.
 */
export function boundaryChecked(outline: Outline, where: string): { outline: Outline; touchPoints: Vec[] } {
	if (outline.segments.length < 3) throw new ImportRefusal(422, 'open_boundary', `${where}: the boundary has fewer than three corners.`, where);
	const touchPoints: Vec[] = [];
	const problems = outlineProblems(outline).filter((p) => {
		if (p.code === 'segment-too-short') return false;
		if (p.code === 'self-intersection' && p.point && isCorner(outline, p.point)) {
			if (!touchPoints.some((t) => Math.hypot(t.x - p.point!.x, t.y - p.point!.y) < 1e-3)) touchPoints.push(p.point);
			return false;
		}
		return true;
	});
	if (problems.length) throw new ImportRefusal(422, problems[0].code === 'self-intersection' ? 'self_crossing_boundary' : 'bad_boundary', `${where}: ${problems[0].message}`, where);
	if (outlineArea(outline) < 1) throw new ImportRefusal(422, 'bad_boundary', `${where}: the boundary encloses no area.`, where);
	return { outline, touchPoints };
}

/** The pieces an import makes (version 1 each). Ids are the file order; the server gives database ids. */
export function importedPieces(items: readonly ImportedPiece[]): Piece[] {
	return items.map((it, i) => {
		let outline = it.boundary;
		let seamAllowance = null;
		const net = it.sewLine ? outlineArea(it.sewLine) : 0;
		// a sew line on the boundary itself is no allowance
		if (it.sewLine && Math.abs(outlineArea(it.boundary) - net) > 1e-4 * net) {
			const widthMm = Math.max(0, (outlineArea(it.boundary) - net) / pathLength(it.sewLine));
			outline = it.sewLine;
			seamAllowance = { defaultWidthMm: Math.round(widthMm * 10) / 10, cutLine: it.boundary };
		}
		return pieceSchema.parse({
			schemaVersion: 1,
			id: `import-${i + 1}`,
			name: it.name.slice(0, 120) || `Imported piece ${i + 1}`,
			outline,
			apexes: (it.touchPoints ?? []).map((point, k) => ({ id: `a${k + 1}`, kind: 'dart_pivot', label: 'shared corner', point })),
			seamAllowance,
			grainline: it.grainline ? { ...it.grainline, arrowheads: 'both' } : null,
			notches: it.notches.map((n, k) => ({ id: `n${k + 1}`, at: n.at, count: n.count })),
			internalLines: it.internalLines.filter((l) => l.segments.length).map((path, k) => ({ id: `l${k + 1}`, path })),
			drillHoles: it.drillHoles.map((at, k) => ({ id: `h${k + 1}`, at })),
			cut: it.cut,
			fabric: it.fabric.slice(0, 120) || 'self'
		});
	});
}
