import { outlineNearestPoint, outlinePerimeter, pathLengthAt, pathPointAtLength, vecSub, type Outline, type Vec } from '$lib/geometry';
import type { Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import type { EditorState } from '../editor-state.svelte';
import { dartNear } from '../hit';
import { editorApply } from '../ops';
import { fmtDeg, fmtLength } from '../units';
import { emptyPreview, type OverlayItem, type PointerInfo, type Readout, type ToolPreview } from './types';

/** Helpers shared by the tools. */

export function toolPiece(s: EditorState): Piece | null {
	return s.piece(s.input.pieceKey)?.geometry ?? null;
}

/** Point at a signed distance along the outline from a point on it (wraps round). */
export function pointAlongOutline(outline: Outline, from: Vec, distanceMm: number): Vec {
	const loc = outlineNearestPoint(outline, from);
	const total = outlinePerimeter(outline);
	const at = pathLengthAt(outline, loc) + distanceMm;
	return pathPointAtLength(outline, ((at % total) + total) % total).point;
}

/** Signed distance along the outline from `from` forward to `to` (shortest way, sign = direction). */
export function distanceAlongOutline(outline: Outline, from: Vec, to: Vec): number {
	const total = outlinePerimeter(outline);
	const a = pathLengthAt(outline, outlineNearestPoint(outline, from));
	const b = pathLengthAt(outline, outlineNearestPoint(outline, to));
	const fwd = (((b - a) % total) + total) % total;
	return fwd <= total / 2 ? fwd : fwd - total;
}

/** Pick the piece under the pointer and a dart near it; true if a dart was picked. */
export function pickDart(s: EditorState, p: PointerInfo): boolean {
	const key = p.hit?.pieceKey;
	if (!key) return false;
	const g = s.piece(key)?.geometry;
	if (!g) return false;
	const id = dartNear(g, s.local(key, p.world), s.tolMm(14));
	if (!id) return false;
	s.input.pieceKey = key;
	s.input.dartId = id;
	s.selection.pieceKey = key;
	return true;
}

export function dartApex(piece: Piece, dartId: string | null): { apex: Vec; leg1End: Vec; leg2End: Vec } | null {
	const d = piece.darts.find((x) => x.id === dartId);
	const a = d && piece.apexes.find((x) => x.id === d.apexId);
	return d && a ? { apex: a.point, leg1End: d.leg1End, leg2End: d.leg2End } : null;
}

/** Run a step on the tool's piece for the preview, with readouts from the operation's report. */
export function stepPreview(
	s: EditorState,
	step: RecipeStepData,
	overlay: OverlayItem[],
	readouts: (values: Readonly<Record<string, number>>) => Readout[]
): ToolPreview {
	const key = s.input.pieceKey;
	const piece = toolPiece(s);
	if (!key || !piece) return emptyPreview(key);
	const r = editorApply(piece, step);
	if (!r.ok) return { ...emptyPreview(key, r.error.message), overlay };
	return {
		pieceKey: key,
		piece: r.piece,
		error: null,
		readouts: readouts(r.report.values),
		ledger: r.ledgerEntries,
		overlay,
		notes: [r.report.summary, ...r.report.notes],
		canCommit: true
	};
}

export const mm = (s: EditorState, v: number | undefined) => (v === undefined ? '—' : fmtLength(v, s.unit));
export const deg = (v: number | undefined) => (v === undefined ? '—' : fmtDeg(v));

export function localOf(s: EditorState, world: Vec): Vec {
	const p = s.piece(s.input.pieceKey);
	return p ? vecSub(world, p.offset) : world;
}
