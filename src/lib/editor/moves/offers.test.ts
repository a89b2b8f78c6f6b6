import { afterEach, describe, expect, it } from 'vitest';
import { vecLerp } from '$lib/geometry';
import { frontBodiceBlock, FRONT_BLOCK_BUST_POINT } from '$lib/pattern/fixtures/front-bodice-block';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import { twoPanelWedge } from '$lib/pattern/panels/fixtures/two-panel-wedge';
import type { SeamPairInfo } from '../api';
import { clickOn, editorWith, editorsMade, pointerAt, undoRedoRoundTrip } from '../editor-fixture';
import { offersFor } from './offers';

// every change a test made is undone and redone to the same documents
afterEach(() => {
	for (const { s, start } of editorsMade()) expect(undoRedoRoundTrip(s, start)).toBeNull();
});

/** Object first: what is clicked on the table is selected, and the moves that apply to it are offered. */

const ids = (s: ReturnType<typeof editorWith>) => offersFor(s.ctx)?.moves.map((m) => m.id) ?? [];

describe('offered moves', () => {
	it('a dart clicked on the table offers pivot, share, pleats, pull back and cap, and a move starts on that dart', () => {
		const block = frontBodiceBlock();
		const waist = block.darts.find((d) => d.id === 'waist-dart')!;
		const s = editorWith([{ geometry: block, key: 'front' }]);
		clickOn(s, 'front', vecLerp(FRONT_BLOCK_BUST_POINT, waist.leg1End, 0.7));
		expect(s.selection.dartId).toBe('waist-dart');
		const o = offersFor(s.ctx)!;
		expect(o.on).toContain('waist-dart');
		expect(o.moves.map((m) => m.label)).toEqual(['Pivot', 'Share', 'Pleats', 'Pull back', 'Cap']);
		s.offerStart(o.moves[0]);
		expect(s.move.id === 'pivot' && s.move.dartId).toBe('waist-dart');
	});
	it('a piece offers grain, fold, allowance, reshape, notch, spread and the moves of its darts', () => {
		const s = editorWith([{ geometry: frontBodiceBlock(), key: 'front' }]);
		expect(ids(s)).toEqual(expect.arrayContaining(['grain', 'fold', 'allowance', 'reshape', 'notch', 'spread', 'pivot', 'pleat']));
	});
	it('an apex on the stitching line offers to be marked as a divergence point, and the mark applies', () => {
		const w = twoPanelWedge();
		const piece = { ...w.left, apexes: [{ ...w.left.apexes[0], kind: 'bust_point' as const }] };
		const s = editorWith([{ geometry: piece, key: 'left' }]);
		clickOn(s, 'left', w.D);
		expect(s.selection.apexId).toBe('d');
		const o = offersFor(s.ctx)!;
		expect(o.moves.map((m) => m.id)).toEqual(['divergence_point']);
		s.offerStart(o.moves[0]);
		expect(s.docs.piece('left')!.steps.map((x) => x.op)).toEqual(['divergence_point']);
	});
	it('a paired seam clicked offers true, notch and join; two panels picked together offer join and carry', () => {
		const w = twoPanelWedge();
		const pair: SeamPairInfo = { id: 'p1', label: 'panel seam', aPieceId: 'left', aEdge: { from: { x: 100, y: 0 }, to: w.D }, bPieceId: 'right', bEdge: { from: w.D, to: { x: 100, y: 0 } }, allowedEaseMm: 0, toleranceMm: 0.5 };
		const s = editorWith([{ geometry: w.left, key: 'left' }, { geometry: w.right, key: 'right', offset: { x: 300, y: 0 } }], [pair]);
		clickOn(s, 'left', { x: 100, y: 60 });
		expect(s.selection.seamPairId).toBe('p1');
		expect(ids(s)).toEqual(['true_seam', 'notch', 'join']);
		s.setMove('true_seam');
		expect(s.move.id === 'true_seam' && s.move.seamPairId).toBe('p1');
		s.setMove('select');
		s.pointerDown(pointerAt(s, { x: 460, y: 300 }, true));
		expect(s.selection.panels).toEqual(['left', 'right']);
		expect(ids(s)).toEqual(['join', 'carry']);
		s.setMove('carry');
		expect(s.move.id === 'carry' && s.move.keys).toEqual(['left', 'right']);
	});
	it('an edge of a seam not yet paired offers to pair it with another edge, its two ends picked already', () => {
		const s = editorWith([{ geometry: rectanglePiece('a'), key: 'a' }]);
		clickOn(s, 'a', { x: 200, y: 150 });
		const o = offersFor(s.ctx)!;
		const pair = o.moves.find((m) => m.id === 'pair_with')!;
		s.offerStart(pair);
		expect(s.move.id === 'true_seam' && s.move.edgePicks.length).toBe(2);
	});
	it('offers nothing to change on a piece the role may only look at', () => {
		const s = editorWith([{ geometry: rectanglePiece('a'), key: 'a', readOnly: true }]);
		expect(offersFor(s.ctx)?.moves).toEqual([]);
	});
});

describe('a panel seam offered for pairing', () => {
	it('runs on through the divergence point, where the panels part, to the waist', () => {
		const w = twoPanelWedge(12, 150);
		const s = editorWith([{ geometry: w.left, key: 'left' }]);
		clickOn(s, 'left', { x: 100, y: 60 });
		const pair = offersFor(s.ctx)!.moves.find((m) => m.id === 'pair_with')!;
		const ends = [pair.seam!.from, pair.seam!.to].map((v) => Math.round(v.y));
		expect(ends.sort((a, b) => a - b)).toEqual([0, 400]);
	});
});
