import { afterEach, describe, expect, it } from 'vitest';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import { reshapeDeclaredEntries } from '$lib/pattern/reshape-declaration';
import { dragThrough, editorWith, editorsMade, undoRedoRoundTrip } from '../editor-fixture';
import { reshapeApply, reshapeRun } from './reshape';
import type { MoveStateOf } from './registry';

// every change a test made is undone and redone to the same documents
afterEach(() => {
	for (const { s, start } of editorsMade()) expect(undoRedoRoundTrip(s, start)).toBeNull();
});

/** Reshape by hand: outline points dragged with snapping, the change declared before it is applied. */

function reshaping() {
	const s = editorWith([{ geometry: rectanglePiece('band', 200, 300), key: 'band', offset: { x: 100, y: 50 } }]);
	s.setMove('reshape');
	return { s, st: s.move as MoveStateOf<'reshape'> };
}

describe('reshape by hand', () => {
	it('drags a corner, snapping to the 15° direction from its neighbour, and shows the new seam lengths live', () => {
		const { s, st } = reshaping();
		dragThrough(s, 'band', [{ x: 200, y: 300 }, { x: 201, y: 305 }, { x: 201.5, y: 312 }]);
		expect(st.moves).toHaveLength(1);
		expect(st.moves[0].to.x).toBeCloseTo(200, 9);
		expect(st.moves[0].to.y).toBeCloseTo(312, 1);
		const pv = s.preview!;
		expect(pv.piece).not.toBeNull();
		expect(pv.readouts.some((r) => r.tone === 'warn')).toBe(true);
		// each changed seam is named in the readouts as the declaration form (and the server) names it
		const seamLabels = reshapeRun(s.ctx, st)!.changes.filter((c) => c.subject === 'seam').map((c) => c.label);
		expect(seamLabels.length).toBeGreaterThan(0);
		expect(pv.readouts.filter((r) => r.tone === 'warn').map((r) => r.label)).toEqual(seamLabels);
		// the ledger shows the change as it would be declared
		expect(pv.ledger.length).toBeGreaterThan(0);
	});
	it('asks what the change is before applying it, and the browser’s own check of the save then passes', () => {
		const { s, st } = reshaping();
		st.moves = [{ from: { x: 200, y: 300 }, to: { x: 200, y: 310 } }, { from: { x: 0, y: 300 }, to: { x: 0, y: 310 } }];
		s.commitMove();
		expect(st.declaring).toBe(true);
		expect(s.docs.piece('band')!.steps).toHaveLength(0);
		const run = reshapeRun(s.ctx, st)!;
		expect(run.changes.length).toBeGreaterThan(0);
		const entries = reshapeDeclaredEntries(run.changes);
		if (!entries.ok) throw new Error('not declared');
		s.settle(reshapeApply(s.ctx, st, entries.entries));
		const band = s.docs.piece('band')!;
		expect(band.steps.map((x) => x.op)).toEqual(['reshape']);
		expect(band.steps[0].declared?.length).toBe(entries.entries.length);
		expect(s.selectedVerify?.ok).toBe(true);
	});
	it('applies at once a reshape that keeps the area and every seam length', () => {
		const { s, st } = reshaping();
		// a handle-free move along the edge's own line keeps everything: the corner slides nowhere
		st.moves = [{ from: { x: 200, y: 300 }, to: { x: 200, y: 300.00001 } }];
		s.commitMove();
		expect(s.docs.piece('band')!.steps.map((x) => x.op)).toEqual(['reshape']);
	});
	it('refuses a declaration of “other” without a note', () => {
		const { s, st } = reshaping();
		st.moves = [{ from: { x: 200, y: 300 }, to: { x: 200, y: 310 } }];
		const run = reshapeRun(s.ctx, st)!;
		const r = reshapeDeclaredEntries(run.changes, Object.fromEntries(run.changes.map((c) => [c.key, { choice: 'other' as const }])));
		expect(r.ok).toBe(false);
	});
	it('takes back one drag at a time, brings it back on redo, and leaves one undo step when applied', () => {
		const { s, st } = reshaping();
		dragThrough(s, 'band', [{ x: 200, y: 300 }, { x: 200, y: 305 }, { x: 200, y: 310 }]);
		dragThrough(s, 'band', [{ x: 0, y: 300 }, { x: 0, y: 305 }, { x: 0, y: 310 }]);
		expect(st.moves).toHaveLength(2);
		s.undo();
		expect(st.moves).toHaveLength(1);
		expect(st.moves[0].from).toEqual({ x: 200, y: 300 });
		s.undo();
		expect(st.moves).toHaveLength(0);
		s.redo();
		s.redo();
		expect(st.moves).toHaveLength(2);
		const run = reshapeRun(s.ctx, st)!;
		const entries = reshapeDeclaredEntries(run.changes);
		if (!entries.ok) throw new Error('not declared');
		s.settle(reshapeApply(s.ctx, st, entries.entries));
		expect(s.docs.past).toHaveLength(1);
		expect(s.move.id === 'reshape' && s.move.moves).toEqual([]);
		// the applied reshape is undone as one step on the document
		s.undo();
		expect(s.docs.piece('band')!.steps).toHaveLength(0);
	});
	it('makes no undo step for a press on a point that does not move it', () => {
		const { s, st } = reshaping();
		dragThrough(s, 'band', [{ x: 200, y: 300 }]);
		expect(st.past).toHaveLength(0);
	});
});
