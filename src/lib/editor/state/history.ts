/**
 * Undo and redo over immutable documents: one entry is the document before a change and the change's
 * name. A mark opens a run of changes (a drag) that ends as one entry, or is dropped as a whole.
 */

export interface HistoryEntry<D> {
	readonly doc: D;
	readonly label: string;
}

export interface History<D> {
	readonly past: readonly HistoryEntry<D>[];
	readonly future: readonly HistoryEntry<D>[];
}

export const historyEmpty = <D>(): History<D> => ({ past: [], future: [] });

/** `before` becomes undoable under `label`; redo is gone. */
export function historyPush<D>(h: History<D>, before: D, label: string): History<D> {
	return { past: [...h.past, { doc: before, label }], future: [] };
}

/** The document to go back to and the history after it, or null when there is nothing to undo. */
export function historyUndo<D>(h: History<D>, current: D): { doc: D; label: string; history: History<D> } | null {
	const last = h.past.at(-1);
	if (!last) return null;
	return { doc: last.doc, label: last.label, history: { past: h.past.slice(0, -1), future: [{ doc: current, label: last.label }, ...h.future] } };
}

export function historyRedo<D>(h: History<D>, current: D): { doc: D; label: string; history: History<D> } | null {
	const next = h.future[0];
	if (!next) return null;
	return { doc: next.doc, label: next.label, history: { past: [...h.past, { doc: current, label: next.label }], future: h.future.slice(1) } };
}
