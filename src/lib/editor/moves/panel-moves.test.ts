import { afterEach, describe, expect, it } from 'vitest';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import { twoPanelWedge } from '$lib/pattern/panels/fixtures/two-panel-wedge';
import type { SeamPairInfo } from '../api';
import { dragThrough, editorWith, editorsMade, undoRedoRoundTrip } from '../editor-fixture';
import type { MoveStateOf } from './registry';
import type { MoveId } from './types';

// every change a test made is undone and redone to the same documents
afterEach(() => {
	for (const { s, start } of editorsMade()) expect(undoRedoRoundTrip(s, start)).toBeNull();
});

/** The moves across panels (join, carry, true seam), on two panels sewn from the top to a divergence point D. */

function panels<K extends MoveId>(id: K) {
	const w = twoPanelWedge(12, 150);
	const wl = { x: 100 - 250 * Math.tan((6 * Math.PI) / 180), y: 400 };
	const wr = { x: 100 + 250 * Math.tan((6 * Math.PI) / 180), y: 400 };
	const pair: SeamPairInfo = {
		id: 'pair-1',
		label: 'panel seam',
		aPieceId: 'left',
		aEdge: { from: { x: 100, y: 0 }, to: wl },
		bPieceId: 'right',
		// stored in the outline's own order (the right panel's seam runs from the waist up)
		bEdge: { from: wr, to: { x: 100, y: 0 } },
		allowedEaseMm: 0,
		toleranceMm: 0.5
	};
	const s = editorWith([{ geometry: w.left, key: 'left' }, { geometry: w.right, key: 'right' }], [pair]);
	s.setMove(id);
	return { s, st: s.move as MoveStateOf<K>, w };
}

describe('join', () => {
	it('joins two panels along their stored seam into one new piece, kept as a pending change', () => {
		const { s, st } = panels('join');
		expect(st.seamPairId).toBe('pair-1');
		const pv = s.preview!;
		expect(pv.error).toBeNull();
		expect(pv.pieces).toHaveLength(1);
		expect(pv.hides).toEqual(['left', 'right']);
		s.commitMove();
		expect(s.docs.visible).toHaveLength(1);
		expect(s.docs.doc.pendingSteps?.map((p) => p.op)).toEqual(['join']);
	});
	it('refuses panels with unsaved steps: a joined piece starts from saved versions', () => {
		const { s } = panels('join');
		expect(s.apply('left', { op: 'notch', params: { id: 'n-1', at: { x: 0, y: 200 }, count: 1 } })).toBeNull();
		s.setMove('join');
		s.commitMove();
		expect(s.moveMessage).toContain('Save the changes');
		expect(s.docs.visible).toHaveLength(2);
	});
});

describe('true seam', () => {
	it('measures both edges of a seam and moves the end chosen to make it true', () => {
		// two panels whose sewn edges are 300 and 305 mm long
		const pair: SeamPairInfo = { id: 'side', label: 'side seam', aPieceId: 'left', aEdge: { from: { x: 100, y: 0 }, to: { x: 100, y: 300 } }, bPieceId: 'right', bEdge: { from: { x: 0, y: 305 }, to: { x: 0, y: 0 } }, allowedEaseMm: 0, toleranceMm: 0.5 };
		const s = editorWith([{ geometry: rectanglePiece('left', 100, 300), key: 'left' }, { geometry: rectanglePiece('right', 100, 305), key: 'right', offset: { x: 100, y: 0 } }], [pair]);
		s.setMove('true_seam');
		const st = s.move as MoveStateOf<'true_seam'>;
		expect(s.preview!.readouts.find((r) => r.label === 'Reads')?.tone).toBe('bad');
		st.adjust = 'b-end';
		expect(s.preview!.canCommit).toBe(true);
		s.commitMove();
		const left = s.docs.piece('right')!;
		expect(left.steps.map((x) => x.op)).toEqual(['reshape']);
		// the move changes the piece: declared as a labelled change, sent with the save
		expect(left.steps[0].declared?.[0].kind).toBe('trued_seam');
	});
	it('refuses to move an end of a seam that is already true', () => {
		const { s, st } = panels('true_seam');
		st.adjust = 'a-end';
		s.commitMove();
		expect(s.moveMessage).toBe('The seam is already true at that end: nothing to move.');
	});
});

describe('carry', () => {
	it('takes the row of panels the seam pairs join, draws the style line through D and carries the wedge into it', () => {
		const { s, st } = panels('carry');
		expect(st.keys).toEqual(['left', 'right']);
		dragThrough(s, 'left', [{ x: -5, y: 150 }, { x: 100, y: 150 }, { x: 205, y: 150 }]);
		expect(st.handles).toHaveLength(4);
		const pv = s.preview!;
		expect(pv.error).toBeNull();
		expect(pv.readouts.find((r) => r.label === 'Residuals')?.tone).toBe('ok');
		s.commitMove();
		expect(s.docs.doc.pendingSteps?.map((p) => p.op)).toEqual(['carry']);
		expect(s.move.id).toBe('select');
	});
	it('refuses one panel alone', () => {
		const { s, st } = panels('carry');
		st.keys = ['left'];
		expect(s.preview!.error).toContain('at least two panels');
		s.commitMove();
		expect(s.docs.doc.pendingSteps ?? []).toEqual([]);
	});
});
