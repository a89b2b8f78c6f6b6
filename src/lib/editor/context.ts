import { getContext, setContext } from 'svelte';
import type { EditorState } from './editor-state.svelte';

const KEY = Symbol('dartelier-editor');

export function editorContextSet(state: EditorState): EditorState {
	return setContext(KEY, state);
}

export function editorContext(): EditorState {
	const s = getContext<EditorState | undefined>(KEY);
	if (!s) throw new Error('The editor state is missing: use the editor components inside the editor page.');
	return s;
}
