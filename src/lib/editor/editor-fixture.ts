import type { Vec } from '$lib/geometry';
import type { Piece } from '$lib/pattern/piece-schema';
import type { SeamPairInfo } from './api';
import type { EditorDoc, PieceEdit } from './doc';
import { EditorState } from './editor-state.svelte';
import type { Hit } from './hit';
import type { PointerInfo } from './moves/types';

/**
 * An editor over given pieces, without a page or a server: for the unit tests of the state and the
 * moves. Pieces lie at their own coordinates unless an offset is given.
 */
export function editorWith(pieces: readonly { geometry: Piece; key?: string; offset?: Vec; readOnly?: boolean }[], seamPairs: readonly SeamPairInfo[] = []): EditorState {
	const s = new EditorState('studio-1', 'style-1', true, null);
	const list: PieceEdit[] = pieces.map((p, i) => ({
		key: p.key ?? p.geometry.id ?? `piece-${i}`,
		name: p.geometry.name,
		cut: p.geometry.cut,
		fabric: p.geometry.fabric,
		baseVersionId: `version-${i}`,
		baseNumber: 1,
		base: p.geometry,
		geometry: p.geometry,
		steps: [],
		offset: p.offset ?? { x: 0, y: 0 },
		origin: null,
		retired: false,
		readOnly: p.readOnly ?? false
	}));
	s.docs.reset({ pieces: list });
	s.seamPairs = seamPairs;
	s.selection.piece(list[0]?.key ?? null);
	s.loading = false;
	// a view as large as a laptop's, at 1 px per mm: pointer tolerances are a few mm
	s.camera.viewW = 1200;
	s.camera.viewH = 800;
	s.camera.scale = 1;
	made.push({ s, start: s.docs.doc });
	return s;
}

const made: { s: EditorState; start: EditorDoc }[] = [];

/** The editors made since the last call (and the document each began with); the list starts again. */
export function editorsMade(): { s: EditorState; start: EditorDoc }[] {
	return made.splice(0);
}

/**
 * Undo every step of the editor's history, then redo them all: each undo must land on the document the
 * step started from (the first on the document the editor began with), each redo on the one it left.
 * The reason it does not, or null.
 */
export function undoRedoRoundTrip(s: EditorState, start: EditorDoc): string | null {
	s.setMove('select');
	while (s.docs.future.length) s.redo();
	const end = s.docs.doc;
	const before = s.docs.past.map((e) => e.doc);
	const after = before.length ? [...before.slice(1), end] : [];
	if (before.length && before[0] !== start) return 'the first undo step does not start from the document the editor began with';
	for (let i = before.length - 1; i >= 0; i--) {
		s.undo();
		if (s.docs.doc !== before[i]) return `undo ${before.length - i} did not go back to the document before “${s.docs.future[0]?.label}”`;
	}
	if (s.docs.past.length) return 'steps are left to undo';
	for (let i = 0; i < after.length; i++) {
		s.redo();
		if (s.docs.doc !== after[i]) return `redo ${i + 1} did not come back to the document after “${s.docs.past.at(-1)?.label}”`;
	}
	return s.docs.future.length ? 'steps are left to redo' : null;
}

/** A pointer at a world point, with what lies under it as the canvas would find it. */
export function pointerAt(s: EditorState, world: Vec, shift = false): PointerInfo {
	return { world, screen: s.camera.toScreen(world), hit: s.hitAt(world), snap: s.snapAt(world), shift };
}

/** A pointer on a piece's outline point (its own coordinates), hit as an outline point or edge. */
export function pointerOn(s: EditorState, key: string, local: Vec): PointerInfo {
	const o = s.docs.piece(key)!.offset;
	return pointerAt(s, { x: local.x + o.x, y: local.y + o.y });
}

/** Press, drag through the points, release: as a hand on the canvas. */
export function dragThrough(s: EditorState, key: string, points: readonly Vec[]): void {
	const [first, ...rest] = points;
	const follow = s.pointerDown(pointerOn(s, key, first));
	for (const q of rest) if (follow) s.pointerMove(pointerOn(s, key, q));
	s.pointerUp(pointerOn(s, key, points[points.length - 1]), rest.length > 0);
}

export function clickOn(s: EditorState, key: string, local: Vec): Hit | null {
	const p = pointerOn(s, key, local);
	s.pointerDown(p);
	s.pointerUp(p, false);
	return p.hit;
}
