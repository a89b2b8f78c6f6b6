import { outlineNearestPoint, outlinePerimeter, pathLengthAt, pathPointAtLength, vecSub, type Outline, type Vec } from '$lib/geometry';
import type { Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import { dartNear } from '../hit';
import { editorApply } from '../ops';
import { areaText, angleText, lengthReadoutText, type LengthUnit } from '$lib/pattern/measurements/units';
import type { MoveContext } from './context';
import { emptyPreview, type MovePreview, type OverlayItem, type PointerInfo, type Readout } from './types';

/** Helpers shared by the moves. */

/** The state every move on one piece has. */
export interface OnPiece {
	pieceKey: string | null;
}
export interface OnDart extends OnPiece {
	dartId: string | null;
}

export function movePiece(ctx: MoveContext, st: OnPiece): Piece | null {
	return ctx.piece(st.pieceKey)?.geometry ?? null;
}

/** The selected piece, when it can be changed (a move starts on it). */
export function editableSelected(ctx: MoveContext): string | null {
	const p = ctx.piece(ctx.selectedKey);
	return p && !p.readOnly && !p.retired ? p.key : null;
}

/** A move on a dart starts on the selected piece and its first dart. */
export function dartStart(ctx: MoveContext): OnDart {
	const key = editableSelected(ctx);
	const darts = ctx.piece(key)?.geometry.darts ?? [];
	const chosen = darts.find((d) => d.id === ctx.selection.dartId);
	return { pieceKey: key, dartId: (chosen ?? darts[0])?.id ?? null };
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
export function pickDart(ctx: MoveContext, st: OnDart, p: PointerInfo): boolean {
	const key = p.hit?.pieceKey;
	if (!key) return false;
	const g = ctx.piece(key)?.geometry;
	if (!g) return false;
	const id = dartNear(g, ctx.local(key, p.world), ctx.tolMm(14));
	if (!id) return false;
	st.pieceKey = key;
	st.dartId = id;
	ctx.select(key);
	return true;
}

export function dartApex(piece: Piece, dartId: string | null): { apex: Vec; leg1End: Vec; leg2End: Vec } | null {
	const d = piece.darts.find((x) => x.id === dartId);
	const a = d && piece.apexes.find((x) => x.id === d.apexId);
	return d && a ? { apex: a.point, leg1End: d.leg1End, leg2End: d.leg2End } : null;
}

/** Run a step on the move's piece for the preview, with readouts from the operation's report. */
export function stepPreview(ctx: MoveContext, st: OnPiece, step: RecipeStepData, overlay: OverlayItem[], readouts: (values: Readonly<Record<string, number>>) => Readout[]): MovePreview {
	const key = st.pieceKey;
	const piece = movePiece(ctx, st);
	if (!key || !piece) return emptyPreview(key);
	const r = editorApply(piece, step);
	if (!r.ok) return { ...emptyPreview(key, r.error.message), overlay };
	return { pieceKey: key, piece: r.piece, error: null, readouts: readouts(r.report.values), ledger: r.ledgerEntries, overlay, notes: [r.report.summary, ...r.report.notes], canCommit: true };
}

export const mm = (unit: LengthUnit, v: number | undefined) => (v === undefined ? '—' : lengthReadoutText(v, unit));
export const deg = (v: number | undefined) => (v === undefined ? '—' : angleText(v));

/** An operation's report values as readouts, named from their keys (unit suffixes read as units). */
export function reportReadouts(unit: LengthUnit) {
	return (v: Readonly<Record<string, number>>): Readout[] =>
		Object.entries(v).map(([k, x]) => {
			const words = k.replace(/([A-Z])/g, ' $1').replace(/ (Mm2|Mm|Rad|Deg)$/, '').toLowerCase();
			return {
				label: words.charAt(0).toUpperCase() + words.slice(1),
				value: k.endsWith('Mm2') ? areaText(x, unit) : k.endsWith('Mm') ? mm(unit, x) : k.endsWith('Rad') ? angleText(x) : Number.isInteger(x) ? String(x) : x.toFixed(2)
			};
		});
}

export function localOf(ctx: MoveContext, st: OnPiece, world: Vec): Vec {
	const p = ctx.piece(st.pieceKey);
	return p ? vecSub(world, p.offset) : world;
}

/** Pick an editable piece for a move on one piece (a new piece drops what was picked on the old). */
export function pickPiece(ctx: MoveContext, st: OnPiece, key: string | undefined): boolean {
	if (!key) return false;
	const p = ctx.piece(key);
	if (!p || p.readOnly) return false;
	st.pieceKey = key;
	ctx.select(key);
	return true;
}
