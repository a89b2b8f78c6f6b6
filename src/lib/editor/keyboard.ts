import { tinykeys } from 'tinykeys';
import type { EditorState } from './editor-state.svelte';
import { MOVE_ORDER, MOVES } from './moves/registry';
import { OFFER_KEYS, offersFor, type OfferId } from './moves/offers';

/** Keyboard shortcuts of the editor (tinykeys; `$mod` is Cmd on Mac, Ctrl elsewhere). */

export interface Shortcut {
	readonly keys: string;
	readonly label: string;
	readonly run: (s: EditorState) => void;
}

export function shortcuts(s: EditorState): Shortcut[] {
	const tools: Shortcut[] = MOVE_ORDER.filter((id) => !MOVES[id].edits || s.canEdit).map((id) => ({
		keys: MOVES[id].key,
		label: `${MOVES[id].name} tool`,
		run: (st) => st.setMove(id)
	}));
	// the offers that are not moves of their own: run only when the selection offers them
	const offered = (id: OfferId) => (st: EditorState) => {
		const o = offersFor(st.ctx)?.moves.find((m) => m.id === id);
		if (o) st.offerStart(o);
	};
	return [
		...tools,
		...(s.canEdit
			? [
					{ keys: OFFER_KEYS.divergence_point, label: 'Mark the selected apex as a divergence point', run: offered('divergence_point') },
					{ keys: OFFER_KEYS.pair_with, label: 'Pair the selected seam with…', run: offered('pair_with') }
				]
			: []),
		{ keys: '$mod+z', label: 'Undo', run: (st) => st.undo() },
		{ keys: '$mod+Shift+z', label: 'Redo', run: (st) => st.redo() },
		{ keys: '$mod+y', label: 'Redo', run: (st) => st.redo() },
		{ keys: '+', label: 'Zoom in', run: (st) => st.camera.zoomBy(1.25) },
		{ keys: '=', label: 'Zoom in', run: (st) => st.camera.zoomBy(1.25) },
		{ keys: '-', label: 'Zoom out', run: (st) => st.camera.zoomBy(0.8) },
		{ keys: '0', label: 'Fit the style', run: (st) => st.camera.fit() },
		{ keys: '1', label: 'True size (1:1 as calibrated)', run: (st) => st.camera.trueSize() },
		{ keys: 'ArrowLeft', label: 'Pan left', run: (st) => st.camera.panBy(60, 0) },
		{ keys: 'ArrowRight', label: 'Pan right', run: (st) => st.camera.panBy(-60, 0) },
		{ keys: 'ArrowUp', label: 'Pan up', run: (st) => st.camera.panBy(0, 60) },
		{ keys: 'ArrowDown', label: 'Pan down', run: (st) => st.camera.panBy(0, -60) },
		{ keys: 'Enter', label: 'Apply the tool', run: (st) => st.commitMove() },
		{ keys: 'Escape', label: 'Cancel the tool / close', run: (st) => st.escape() },
		{ keys: 'Shift+?', label: 'Show these shortcuts', run: (st) => (st.helpOpen = !st.helpOpen) }
	];
}

/** Typing in a field keeps its keys, except Enter/Escape which apply/cancel the tool. */
function inField(e: KeyboardEvent): boolean {
	const t = e.target as HTMLElement | null;
	if (!t) return false;
	const tag = t.tagName;
	return tag === 'INPUT' || tag === 'TEXTAREA' || tag === 'SELECT' || t.isContentEditable;
}

export function keyboardBind(target: Window, s: EditorState): () => void {
	const map: Record<string, (e: KeyboardEvent) => void> = {};
	for (const sc of shortcuts(s)) {
		map[sc.keys] = (e) => {
			const field = inField(e);
			const t = e.target as HTMLElement | null;
			if (field && sc.keys !== 'Escape' && !(sc.keys === 'Enter' && t?.dataset.toolField !== undefined)) return;
			if (!field && sc.keys === 'Enter' && t && (t.tagName === 'BUTTON' || t.tagName === 'A')) return;
			if (sc.keys === 'Enter' && s.move.id === 'select') return;
			e.preventDefault();
			sc.run(s);
		};
	}
	// `?` arrives as Shift+? on most layouts and as plain ? on some
	map['?'] = map['Shift+?'];
	return tinykeys(target, map);
}
