import { vecDistance, vecLerp, type Vec } from '$lib/geometry';
import type { Piece } from '$lib/pattern/piece-schema';
import { anchoredOn, pickedPoint } from './anchored';
import { editableSelected, localOf, mm, movePiece, stepPreview, type OnPiece } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef, type OverlayItem } from './types';

export interface StyleLineState extends OnPiece {
	id: 'style_line';
	/** Start, handle 1, handle 2, end (piece coordinates); fewer while the ends are being placed. */
	handles: Vec[];
	dragIndex: number;
}

export function styleLineStep(piece: Piece | null, h: readonly Vec[]) {
	if (h.length !== 4 || !piece) return null;
	let n = piece.internalLines.length + 1;
	while (piece.internalLines.some((l) => l.id === `style-${n}`)) n++;
	// the ends carry the anchors they were picked with; the handles are offsets from the nearest landmark
	const [p0, p1, p2, p3] = h.map((q) => anchoredOn(piece, q));
	return { op: 'style_line', params: { id: `style-${n}`, label: 'style line', path: { segments: [{ kind: 'cubic', p0, p1, p2, p3 }] } } };
}

export const straightHandles = (a: Vec, b: Vec): Vec[] => [a, vecLerp(a, b, 1 / 3), vecLerp(a, b, 2 / 3), b];

/** Style line: a new line across a piece, a Bézier with two handles; ends on the outline. */
export const styleLineMove: MoveDef<StyleLineState> = {
	id: 'style_line',
	name: 'Style line',
	key: 's',
	icon: 'M3 17 C8 5 14 21 21 8 M8 5 L8 5.1 M14 21 L14 21.1 M3 17 L8 5 M21 8 L14 21',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'style_line', pieceKey: prev ? prev.pieceKey : editableSelected(ctx), handles: [], dragIndex: -1 }),
	started: (st) => st.handles.length > 0,
	hint(_ctx, st) {
		const n = st.handles.length;
		if (n === 0) return 'Click the outline where the style line starts.';
		if (n === 1) return 'Click the outline where it ends.';
		return 'Drag the ends along the outline or the round handles to curve it; Enter applies.';
	},
	down(ctx, st, p) {
		const h = st.handles;
		if (h.length === 4) {
			const local = localOf(ctx, st, p.world);
			const i = h.findIndex((q) => vecDistance(q, local) < ctx.tolMm(10));
			if (i >= 0) {
				st.dragIndex = i;
				return true;
			}
			return false;
		}
		const hit = p.hit;
		if (!hit || !(hit.kind === 'edge' || hit.kind === 'point')) return false;
		if (h.length === 0) {
			st.pieceKey = hit.pieceKey;
			ctx.select(hit.pieceKey);
			st.handles = [pickedPoint(ctx, hit.pieceKey, hit.local)];
			return false;
		}
		if (hit.pieceKey !== st.pieceKey) return false;
		st.handles = straightHandles(h[0], pickedPoint(ctx, st.pieceKey, hit.local));
		return false;
	},
	move(ctx, st, p) {
		const i = st.dragIndex;
		if (i < 0 || !st.pieceKey) return;
		let q: Vec;
		if (i === 0 || i === 3) {
			const snap = ctx.snapAt(p.world, { onlyPiece: st.pieceKey, outlineOnly: true });
			ctx.showSnap(snap);
			q = pickedPoint(ctx, st.pieceKey, snap.local ?? localOf(ctx, st, p.world));
		} else {
			// a handle snaps to 15° steps from the end it belongs to
			const end = st.handles[i === 1 ? 0 : 3];
			const o = ctx.piece(st.pieceKey)?.offset ?? { x: 0, y: 0 };
			const snap = ctx.snapAt(p.world, { angleFrom: end ? { x: end.x + o.x, y: end.y + o.y } : null });
			ctx.showSnap(snap.kind === 'free' ? null : snap);
			q = localOf(ctx, st, snap.world);
		}
		st.handles = st.handles.map((x, k) => (k === i ? q : x));
	},
	up(ctx, st) {
		st.dragIndex = -1;
		ctx.showSnap(null);
	},
	commit(ctx, st) {
		const step = styleLineStep(movePiece(ctx, st), st.handles);
		if (!step || !st.pieceKey) return NOTHING;
		return outcome(ctx.apply(st.pieceKey, step), 'again', 'Style line drawn. Use Separate to cut the piece along it.');
	},
	preview(ctx, st) {
		const h = st.handles;
		const piece = movePiece(ctx, st);
		if (!piece || h.length === 0) return null;
		const overlay: OverlayItem[] = h.map((q, i) => ({ kind: 'handle' as const, at: q, active: i === st.dragIndex }));
		if (h.length === 4) overlay.unshift({ kind: 'line', points: [h[0], h[1]], tone: 'select' }, { kind: 'line', points: [h[3], h[2]], tone: 'select' });
		const step = styleLineStep(piece, h);
		if (!step) return { ...emptyPreview(st.pieceKey), overlay };
		return stepPreview(ctx, st, step, overlay, (v) => [
			{ label: 'Line length', value: mm(ctx.unit, v.lengthMm) },
			{ label: 'Start snapped by', value: mm(ctx.unit, v.startSnapMm) },
			{ label: 'End snapped by', value: mm(ctx.unit, v.endSnapMm) }
		]);
	}
};
