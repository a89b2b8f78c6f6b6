import { anchorBody, anchorBodyLike, anchorResolve, type Anchor, type AnchorBody } from '../anchors/anchor';
import { outlineTranslate, pointTranslate, segmentEnd, vecDistance, vecSub, type Outline, type Vec } from '../kernel';
import type { Piece } from '../piece-schema';

/**
 * The nest of a size run: one piece as every size made it, laid over each other so that a chosen anchor
 * of every size falls on the same point (the base size's), the way a pattern cutter stacks graded
 * pieces to read the grade. Every size's landmarks are named as the base's (`anchorBodyLike`), so the
 * same name is the same point of the recipe on every size; the increments between neighbouring sizes are
 * measured between those points. Pure: mm, y down.
 */

export interface NestSize {
	/** The size's key in the run (its measurement set's id). */
	readonly key: string;
	readonly name: string;
	readonly piece: Piece;
}

export interface NestShape {
	readonly key: string;
	readonly name: string;
	/** The stitching line, moved so the anchor falls on the base's anchor point. */
	readonly outline: Outline;
	/** How far this size was moved (mm). */
	readonly offset: Vec;
	/** Every landmark of this size under the base's name, moved with the outline. */
	readonly points: ReadonlyMap<string, Vec>;
}

export interface NestFailure {
	readonly key: string;
	readonly name: string;
	readonly message: string;
}

export type NestResult =
	| { readonly ok: true; readonly anchorPoint: Vec; readonly shapes: readonly NestShape[]; readonly failures: readonly NestFailure[] }
	| { readonly ok: false; readonly message: string };

/** The anchors a nest offers by default, in order: the first the base has is used. */
export const NEST_ANCHOR_DEFAULTS = ['centre front waist', 'centre back waist', 'centre front neck', 'nape'] as const;

/** The landmark names of a piece a nest can be aligned at or measured at (the base's, in its order). */
export function nestLandmarkNames(base: Piece): string[] {
	return anchorBody(base).landmarks.map((l) => l.name);
}

/** The points whose increments a nest measures by default: the base's apexes and named corners. */
export function nestPointsDefault(base: Piece): string[] {
	return anchorBody(base)
		.landmarks.filter((l) => l.kind !== 'point')
		.map((l) => l.name);
}

/** The default anchor of a nest: centre front waist where the base has one, else the next of the defaults, else its first landmark. */
export function nestAnchorDefault(base: Piece): Anchor | null {
	const names = nestLandmarkNames(base);
	const name = NEST_ANCHOR_DEFAULTS.find((n) => names.includes(n)) ?? names[0];
	return name === undefined ? null : { kind: 'landmark', name };
}

/**
 * Aligns every size at the anchor: each outline is moved so that the anchor, found again on that size,
 * falls on the anchor's point on the base. A size where the anchor cannot be found is left out and
 * reported; when it cannot be found on the base, nothing is aligned.
 */
export function nestAlign(base: Piece, sizes: readonly NestSize[], anchor: Anchor): NestResult {
	const baseBody = anchorBody(base);
	const at = anchorResolve(baseBody, anchor);
	if (!at.ok) return { ok: false, message: at.message };
	const shapes: NestShape[] = [];
	const failures: NestFailure[] = [];
	for (const s of sizes) {
		const body: AnchorBody = anchorBodyLike(s.piece, baseBody);
		const here = anchorResolve(body, anchor);
		if (!here.ok) {
			failures.push({ key: s.key, name: s.name, message: here.message });
			continue;
		}
		const offset = vecSub(at.point, here.point);
		const points = new Map<string, Vec>();
		for (const l of body.landmarks) if (!points.has(l.name)) points.set(l.name, pointTranslate(l.point, offset));
		shapes.push({ key: s.key, name: s.name, outline: outlineTranslate(s.piece.outline, offset), offset, points });
	}
	return { ok: true, anchorPoint: at.point, shapes, failures };
}

export interface NestIncrementPoint {
	readonly name: string;
	/** How far the point moves from the smaller size to the next (mm): across (x), down (y) and straight. */
	readonly dxMm: number;
	readonly dyMm: number;
	readonly distanceMm: number;
}

export interface NestIncrement {
	readonly fromKey: string;
	readonly toKey: string;
	readonly fromName: string;
	readonly toName: string;
	/** One per chosen point both sizes have, in the order asked. */
	readonly points: readonly NestIncrementPoint[];
}

/**
 * The increments between neighbouring sizes (in the order of `shapes`) at the named points: how far each
 * point of the aligned nest moves from one size to the next. At the anchor itself every increment is 0.
 */
export function nestIncrements(shapes: readonly NestShape[], pointNames: readonly string[]): NestIncrement[] {
	const out: NestIncrement[] = [];
	for (let i = 0; i + 1 < shapes.length; i++) {
		const a = shapes[i];
		const b = shapes[i + 1];
		const points: NestIncrementPoint[] = [];
		for (const name of pointNames) {
			const pa = a.points.get(name);
			const pb = b.points.get(name);
			if (!pa || !pb) continue;
			points.push({ name, dxMm: pb.x - pa.x, dyMm: pb.y - pa.y, distanceMm: vecDistance(pa, pb) });
		}
		out.push({ fromKey: a.key, toKey: b.key, fromName: a.name, toName: b.name, points });
	}
	return out;
}

/** The outline vertex (index of the segment it starts) where the nest spreads most from its first to its last size. */
export function nestSpreadVertex(shapes: readonly NestShape[]): number {
	if (shapes.length === 0) return 0;
	const first = shapes[0].outline.segments;
	const last = shapes[shapes.length - 1].outline.segments;
	if (first.length !== last.length) return 0;
	let best = 0;
	let bestD = -1;
	for (let i = 0; i < first.length; i++) {
		const d = vecDistance(first[i].p0, last[i].p0);
		if (d > bestD + 1e-9) {
			best = i;
			bestD = d;
		}
	}
	return best;
}

export interface NestLabel {
	readonly key: string;
	readonly name: string;
	/** The outline point the label names (mm). */
	readonly at: Vec;
	/** Where the label's text starts (mm): beside the point, moved down so labels do not overlap. */
	readonly text: Vec;
}

/**
 * Where each size is named: at the same vertex of every outline (the one that spreads most), the text
 * just beside it, stacked so that no two labels are closer than `lineMm` in height.
 */
export function nestLabels(shapes: readonly NestShape[], lineMm: number): NestLabel[] {
	const v = nestSpreadVertex(shapes);
	const placed = shapes.map((s) => {
		const segs = s.outline.segments;
		const at = segs.length === 0 ? { x: 0, y: 0 } : v < segs.length ? segs[v].p0 : segmentEnd(segs[segs.length - 1]);
		return { key: s.key, name: s.name, at, text: { x: at.x + lineMm * 0.6, y: at.y + lineMm * 0.35 } };
	});
	const byY = [...placed].sort((a, b) => a.text.y - b.text.y);
	for (let i = 1; i < byY.length; i++) {
		const above = byY[i - 1].text.y;
		if (byY[i].text.y < above + lineMm) byY[i].text = { x: byY[i].text.x, y: above + lineMm };
	}
	return placed;
}
