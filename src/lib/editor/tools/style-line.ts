import { vecDistance, vecLerp, type Vec } from '$lib/geometry';
import type { EditorState } from '../editor-state.svelte';
import { emptyPreview, type OverlayItem, type ToolDef } from './types';
import { localOf, mm, stepPreview, toolPiece } from './common';

export function styleLineStep(s: EditorState) {
	const h = s.input.handles;
	const piece = toolPiece(s);
	if (h.length !== 4 || !piece) return null;
	let n = piece.internalLines.length + 1;
	while (piece.internalLines.some((l) => l.id === `style-${n}`)) n++;
	return {
		op: 'style_line',
		params: { id: `style-${n}`, label: 'style line', path: { segments: [{ kind: 'cubic', p0: h[0], p1: h[1], p2: h[2], p3: h[3] }] } }
	};
}

function straightHandles(a: Vec, b: Vec): Vec[] {
	return [a, vecLerp(a, b, 1 / 3), vecLerp(a, b, 2 / 3), b];
}

/** Style line: a new line across a piece, a Bézier with two handles; ends on the outline. */
export const styleLineTool: ToolDef = {
	id: 'style_line',
	name: 'Style line',
	key: 's',
	icon: 'M3 17 C8 5 14 21 21 8 M8 5 L8 5.1 M14 21 L14 21.1 M3 17 L8 5 M21 8 L14 21',
	edits: true,
	hint(s) {
		const n = s.input.handles.length;
		if (n === 0) return 'Click the outline where the style line starts.';
		if (n === 1) return 'Click the outline where it ends.';
		return 'Drag the ends along the outline or the round handles to curve it; Enter applies.';
	},
	down(s, p) {
		const h = s.input.handles;
		if (h.length === 4) {
			const local = localOf(s, p.world);
			const i = h.findIndex((q) => vecDistance(q, local) < s.tolMm(10));
			if (i >= 0) {
				s.input.dragIndex = i;
				return true;
			}
			return false;
		}
		const hit = p.hit;
		if (!hit || !(hit.kind === 'edge' || hit.kind === 'point')) return false;
		if (h.length === 0) {
			s.input.pieceKey = hit.pieceKey;
			s.selection.pieceKey = hit.pieceKey;
			s.input.handles = [hit.local];
			return false;
		}
		if (hit.pieceKey !== s.input.pieceKey) return false;
		s.input.handles = straightHandles(h[0], hit.local);
		return false;
	},
	move(s, p) {
		const i = s.input.dragIndex;
		if (i < 0 || !s.input.pieceKey) return;
		let q: Vec;
		if (i === 0 || i === 3) {
			const snap = s.snapAt(p.world, { onlyPiece: s.input.pieceKey, outlineOnly: true });
			s.snapShown = snap;
			q = snap.local ?? localOf(s, p.world);
		} else {
			const snap = s.snapAt(p.world);
			s.snapShown = snap.kind === 'free' ? null : snap;
			q = localOf(s, snap.world);
		}
		s.input.handles = s.input.handles.map((x, k) => (k === i ? q : x));
	},
	up(s) {
		s.input.dragIndex = -1;
		s.snapShown = null;
	},
	commit(s) {
		const st = styleLineStep(s);
		if (st && s.commitStep(st)) s.announce = 'Style line drawn. Use Separate to cut the piece along it.';
	},
	preview(s) {
		const h = s.input.handles;
		if (!toolPiece(s) || h.length === 0) return null;
		const overlay: OverlayItem[] = h.map((q, i) => ({ kind: 'handle' as const, at: q, active: i === s.input.dragIndex }));
		if (h.length === 4) {
			overlay.unshift({ kind: 'line', points: [h[0], h[1]], tone: 'select' }, { kind: 'line', points: [h[3], h[2]], tone: 'select' });
		}
		const st = styleLineStep(s);
		if (!st) return { ...emptyPreview(s.input.pieceKey), overlay };
		return stepPreview(s, st, overlay, (v) => [
			{ label: 'Line length', value: mm(s, v.lengthMm) },
			{ label: 'Start snapped by', value: mm(s, v.startSnapMm) },
			{ label: 'End snapped by', value: mm(s, v.endSnapMm) }
		]);
	}
};
