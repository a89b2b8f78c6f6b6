import type { Vec } from '$lib/geometry';
import type { EditorState } from './editor-state.svelte';

/**
 * A read-only window into the editor for browser tests and the benchmark: where a piece's point is on
 * the screen (CSS px in the page) and a few counts. It never changes state.
 */
export interface EditorProbe {
	pieceKeys(): string[];
	pieceNamed(name: string): string | null;
	toPage(pieceKey: string, local: Vec): Vec;
	geometry(pieceKey: string): unknown;
	historyLength(): number;
}

declare global {
	interface Window {
		dartelierEditor?: EditorProbe;
	}
}

export function testProbe(s: EditorState): () => void {
	const canvas = () => document.querySelector('[data-testid="editor-canvas"]')?.getBoundingClientRect();
	window.dartelierEditor = {
		pieceKeys: () => s.docs.visible.map((p) => p.key),
		pieceNamed: (name) => s.docs.visible.find((p) => p.name === name)?.key ?? null,
		toPage(key, local) {
			const p = s.docs.piece(key);
			const r = canvas();
			const scr = s.camera.toScreen({ x: local.x + (p?.offset.x ?? 0), y: local.y + (p?.offset.y ?? 0) });
			return { x: scr.x + (r?.left ?? 0), y: scr.y + (r?.top ?? 0) };
		},
		geometry: (key) => JSON.parse(JSON.stringify(s.docs.piece(key)?.geometry ?? null)),
		historyLength: () => s.docs.past.length
	};
	return () => {
		delete window.dartelierEditor;
	};
}
