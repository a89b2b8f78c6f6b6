import { afterEach, describe, expect, it } from 'vitest';
import { vecLerp } from '$lib/geometry';
import { stepAnchorProblems } from '$lib/pattern/anchors/anchor-check';
import { frontBodiceBlock, FRONT_BLOCK_BUST_POINT } from '$lib/pattern/fixtures/front-bodice-block';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import type { Piece } from '$lib/pattern/piece-schema';
import { clickOn, dragThrough, editorWith, editorsMade, undoRedoRoundTrip } from '../editor-fixture';
import { editorApply } from '../ops';
import { recipeAnchorTexts, stepAnchorsGiven } from '../recipe-anchors';
import { reshapeDeclaredEntries } from '$lib/pattern/reshape-declaration';
import { reshapeApply, reshapeRun } from './reshape';
import type { SeamPairInfo } from '../api';
import { twoPanelWedge } from '$lib/pattern/panels/fixtures/two-panel-wedge';
import { changeRecompute } from '$lib/pattern/recipe/change';
import type { MoveStateOf } from './registry';
import type { MoveId } from './types';

// every change a test made is undone and redone to the same documents
afterEach(() => {
	for (const { s, start } of editorsMade()) expect(undoRedoRoundTrip(s, start)).toBeNull();
});

/**
 * Every move that takes a point from a click or a snap stores the point with its anchor (a landmark, a
 * place along a named seam, an offset from a landmark); the anchor gives the point again on the piece the
 * step was made on (what the server checks on saving), and the recipe list says it in the trade's words.
 */

const block = frontBodiceBlock();
const shoulder = block.darts.find((d) => d.id === 'shoulder-dart')!;
const SIDE_SEAM_AT_300 = { x: 235 - (10 * 70) / 210, y: 300 };
const mm = (v: number) => `${v.toFixed(1)} mm`;

function editing<K extends MoveId>(id: K, geometry: Piece, key: string) {
	const s = editorWith([{ geometry, key }]);
	s.setMove(id);
	return { s, st: s.move as MoveStateOf<K> };
}

/** The last step on the piece: its anchors, whether they give its points on the piece before it, and its words. */
function lastStep(s: ReturnType<typeof editorWith>, key: string) {
	const p = s.docs.piece(key)!;
	const steps = p.steps;
	const step = steps[steps.length - 1];
	let before = p.base!;
	for (const earlier of steps.slice(0, -1)) {
		const r = editorApply(before, earlier);
		if (r.ok) before = r.piece;
	}
	const anchors = stepAnchorsGiven(step.params);
	const problems = stepAnchorProblems(step.params, [before], false);
	const words = recipeAnchorTexts(p.base, steps, mm).at(-1) ?? [];
	return { op: step.op, anchors, problems, words, verified: s.selectedVerify?.ok ?? false };
}

describe('points of dart moves carry their anchors', () => {
	it('pivot: the opening dragged to the side seam is anchored along the side seam', () => {
		const { s } = editing('pivot', block, 'front');
		dragThrough(s, 'front', [vecLerp(FRONT_BLOCK_BUST_POINT, shoulder.leg1End, 0.85), { x: 233, y: 260 }, SIDE_SEAM_AT_300]);
		const r = lastStep(s, 'front');
		expect(r.op).toBe('pivot');
		expect(r.anchors).toEqual([expect.objectContaining({ kind: 'edge', from: 'start', fraction: expect.any(Number) })]);
		expect(r.problems).toEqual([]);
		expect(r.verified).toBe(true);
		expect(r.words[0]).toMatch(/ %, from the | % from the /);
	});

	it('share: each point clicked on the outline is anchored', () => {
		const { s } = editing('share', block, 'front');
		dragThrough(s, 'front', [SIDE_SEAM_AT_300]);
		dragThrough(s, 'front', [{ x: 229, y: 400 }]);
		s.commitMove();
		const r = lastStep(s, 'front');
		expect(r.op).toBe('share');
		expect(r.anchors).toHaveLength(2);
		expect(r.anchors.every((a) => a.kind === 'edge')).toBe(true);
		expect(r.problems).toEqual([]);
		expect(r.verified).toBe(true);
	});

	it('pleat: every pleat position is anchored along its seam', () => {
		const { s } = editing('pleat', block, 'front');
		s.commitMove();
		const r = lastStep(s, 'front');
		expect(r.op).toBe('pleat');
		expect(r.anchors).toHaveLength(2);
		expect(r.anchors.every((a) => a.kind === 'edge')).toBe(true);
		expect(r.problems).toEqual([]);
		expect(r.verified).toBe(true);
	});
});

describe('points of piece moves carry their anchors', () => {
	const panel = rectanglePiece('panel', 200, 300);

	it('notch: a click on the stitching line is anchored by its distance from the nearer end of the seam', () => {
		const { s, st } = editing('notch', panel, 'panel');
		clickOn(s, 'panel', { x: 200, y: 120 });
		expect(st.target).toMatchObject({ x: 200, y: 120, anchor: { kind: 'edge', from: 'start', distanceMm: 120 } });
		s.commitMove();
		const r = lastStep(s, 'panel');
		expect(r.problems).toEqual([]);
		expect(r.words).toEqual([expect.stringMatching(/^120\.0 mm (from the .* along|along the .* from) /)]);
	});

	it('spread: both ends of the slash are anchored along their seams', () => {
		const { s, st } = editing('spread', panel, 'panel');
		clickOn(s, 'panel', { x: 100, y: 300 });
		clickOn(s, 'panel', { x: 100, y: 0 });
		st.widthMm = 40;
		s.commitMove();
		const r = lastStep(s, 'panel');
		expect(r.anchors.map((a) => a.kind === 'edge' && a.fraction)).toEqual([expect.closeTo(0.5, 9), expect.closeTo(0.5, 9)]);
		expect(r.problems).toEqual([]);
		expect(r.words.every((w) => w.includes('50 % from'))).toBe(true);
	});

	it('style line: its ends are anchored along the seams they were clicked on, its handles from a landmark', () => {
		const { s } = editing('style_line', panel, 'panel');
		clickOn(s, 'panel', { x: 0, y: 150 });
		clickOn(s, 'panel', { x: 200, y: 150 });
		s.commitMove();
		const r = lastStep(s, 'panel');
		expect(r.anchors.map((a) => a.kind)).toEqual(['edge', 'offset', 'offset', 'edge']);
		expect(r.problems).toEqual([]);
		expect(r.verified).toBe(true);
	});

	it('grain: the point inside the piece is anchored as an offset from the nearest landmark', () => {
		const { s } = editing('grain', panel, 'panel');
		clickOn(s, 'panel', { x: 60, y: 150 });
		s.commitMove();
		const r = lastStep(s, 'panel');
		expect(r.anchors).toEqual([expect.objectContaining({ kind: 'offset' })]);
		expect(r.problems).toEqual([]);
		expect(r.words[0]).toMatch(/^offset .* (right|left).* (down|up) from the /);
	});

	it('reshape: the corner dragged is taken by its landmark, where it goes as an offset from it', () => {
		const { s, st } = editing('reshape', panel, 'panel');
		st.moves = [{ from: { x: 200, y: 300 }, to: { x: 200, y: 310 } }, { from: { x: 0, y: 300 }, to: { x: 0, y: 310 } }];
		s.commitMove();
		expect(st.declaring).toBe(true);
		const entries = reshapeDeclaredEntries(reshapeRun(s.ctx, st)!.changes);
		if (!entries.ok) throw new Error('not declared');
		s.settle(reshapeApply(s.ctx, st, entries.entries));
		const r = lastStep(s, 'panel');
		expect(r.op).toBe('reshape');
		expect(r.anchors.map((a) => a.kind)).toEqual(['landmark', 'offset', 'landmark', 'offset']);
		expect(r.problems).toEqual([]);
		expect(r.verified).toBe(true);
		expect(r.words[1]).toMatch(/^offset 10\.0 mm down from the /);
	});
});

describe('points of a trued seam carry their anchors', () => {
	it('true seam: the end moved is taken by its landmark, where it goes as an offset from it', () => {
		const pair: SeamPairInfo = { id: 'side', label: 'side seam', aPieceId: 'left', aEdge: { from: { x: 100, y: 0 }, to: { x: 100, y: 300 } }, bPieceId: 'right', bEdge: { from: { x: 0, y: 305 }, to: { x: 0, y: 0 } }, allowedEaseMm: 0, toleranceMm: 0.5 };
		const s = editorWith([{ geometry: rectanglePiece('left', 100, 300), key: 'left' }, { geometry: rectanglePiece('right', 100, 305), key: 'right', offset: { x: 100, y: 0 } }], [pair]);
		s.setMove('true_seam');
		(s.move as MoveStateOf<'true_seam'>).adjust = 'b-end';
		s.commitMove();
		s.selection.piece('right');
		const r = lastStep(s, 'right');
		expect(r.op).toBe('reshape');
		expect(r.anchors.length).toBeGreaterThan(0);
		expect(r.anchors.filter((a) => a.kind === 'offset').length).toBe(r.anchors.length / 2);
		expect(r.problems).toEqual([]);
		expect(r.verified).toBe(true);
	});
});

describe('points of a carry carry their anchors among the panels', () => {
	it('carry: the style line’s points are anchored on the panels they lie on, and the change recomputes from its sources', () => {
		const w = twoPanelWedge(12, 150);
		const wl = { x: 100 - 250 * Math.tan((6 * Math.PI) / 180), y: 400 };
		const wr = { x: 100 + 250 * Math.tan((6 * Math.PI) / 180), y: 400 };
		const pair: SeamPairInfo = { id: 'pair-1', label: 'panel seam', aPieceId: 'left', aEdge: { from: { x: 100, y: 0 }, to: wl }, bPieceId: 'right', bEdge: { from: wr, to: { x: 100, y: 0 } }, allowedEaseMm: 0, toleranceMm: 0.5 };
		const s = editorWith([{ geometry: w.left, key: 'left' }, { geometry: w.right, key: 'right' }], [pair]);
		s.setMove('carry');
		dragThrough(s, 'left', [{ x: -5, y: 150 }, { x: 100, y: 150 }, { x: 205, y: 150 }]);
		s.commitMove();
		const step = s.docs.doc.pendingSteps![0];
		const anchors = stepAnchorsGiven(step.params);
		expect(anchors).toHaveLength(4);
		expect(anchors.every((a) => (a.kind === 'offset' ? a.of.piece : a.piece) !== undefined)).toBe(true);
		const sources = [w.left, w.right];
		expect(stepAnchorProblems(step.params, sources, true)).toEqual([]);
		const rc = changeRecompute(new Map([['left', w.left], ['right', w.right]]), [{ op: 'carry', sources: [{ pieceId: 'left' }, { pieceId: 'right' }], params: step.params }]);
		expect(rc.ok).toBe(true);
	});
});
