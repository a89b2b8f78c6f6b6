import { afterEach, describe, expect, it } from 'vitest';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import { clickOn, dragThrough, editorWith, editorsMade, pointerAt, undoRedoRoundTrip } from '../editor-fixture';
import type { MoveStateOf } from './registry';
import type { MoveId } from './types';

// every change a test made is undone and redone to the same documents
afterEach(() => {
	for (const { s, start } of editorsMade()) expect(undoRedoRoundTrip(s, start)).toBeNull();
});

/** The moves on a whole piece (style line, separate, spread, notch, grain, fold, allowance) and the table's own (select, tape measure). */

function editing<K extends MoveId>(id: K) {
	const s = editorWith([{ geometry: rectanglePiece('panel', 200, 300), key: 'panel', offset: { x: 100, y: 50 } }]);
	s.setMove(id);
	return { s, st: s.move as MoveStateOf<K> };
}
const ops = (s: ReturnType<typeof editorWith>) => s.docs.piece('panel')!.steps.map((x) => x.op);

describe('style line', () => {
	it('draws a line from one side of the outline to the other and applies it', () => {
		const { s, st } = editing('style_line');
		clickOn(s, 'panel', { x: 0, y: 150 });
		expect(s.preview!.canCommit).toBe(false);
		clickOn(s, 'panel', { x: 200, y: 150 });
		expect(st.handles).toHaveLength(4);
		expect(s.preview!.readouts[0].label).toBe('Line length');
		s.commitMove();
		expect(ops(s)).toEqual(['style_line']);
		expect(s.announce).toContain('Separate');
	});
	it('has nothing to apply before both ends are placed', () => {
		const { s } = editing('style_line');
		clickOn(s, 'panel', { x: 0, y: 150 });
		s.commitMove();
		expect(ops(s)).toEqual([]);
		expect(s.moveMessage).toBeNull();
	});
});

describe('separate', () => {
	function withLine() {
		const e = editing('style_line');
		clickOn(e.s, 'panel', { x: 0, y: 150 });
		clickOn(e.s, 'panel', { x: 200, y: 150 });
		e.s.commitMove();
		e.s.setMove('separate');
		return { s: e.s, st: e.s.move as MoveStateOf<'separate'> };
	}
	it('cuts the piece along its style line into two new pieces, kept as one pending change', () => {
		const { s, st } = withLine();
		expect(st.lineId).toBe('style-1');
		expect(s.preview!.pieces).toHaveLength(2);
		s.commitMove();
		expect(s.docs.visible).toHaveLength(2);
		expect(s.docs.doc.pendingSteps?.map((p) => p.op)).toEqual(['separate']);
		expect(s.move.id).toBe('select');
		s.undo();
		expect(s.docs.visible.map((p) => p.key)).toEqual(['panel']);
	});
	it('refuses a style line the piece does not have', () => {
		const { s, st } = withLine();
		st.lineId = 'style-9';
		expect(s.preview!.error).toBeTruthy();
		s.commitMove();
		expect(s.docs.visible).toHaveLength(1);
	});
});

describe('spread', () => {
	it('slashes from one edge to a hinge on the other and opens it by the width typed', () => {
		const { s, st } = editing('spread');
		clickOn(s, 'panel', { x: 100, y: 300 });
		clickOn(s, 'panel', { x: 100, y: 0 });
		st.widthMm = 40;
		expect(s.preview!.canCommit).toBe(true);
		s.commitMove();
		expect(ops(s)).toEqual(['spread']);
	});
	it('refuses a slash that does not cross the piece', () => {
		const { s, st } = editing('spread');
		st.pieceKey = 'panel';
		st.ends = [{ x: 100, y: 300 }, { x: 100, y: 299 }];
		expect(s.preview!.canCommit).toBe(false);
		s.commitMove();
		expect(ops(s)).toEqual([]);
	});
});

describe('notch', () => {
	it('places one notch where the stitching line is clicked', () => {
		const { s, st } = editing('notch');
		clickOn(s, 'panel', { x: 200, y: 120 });
		expect(st.target).toMatchObject({ x: 200, y: 120 });
		s.commitMove();
		expect(s.docs.piece('panel')!.geometry.notches).toHaveLength(1);
	});
	it('refuses a notch away from the stitching line', () => {
		const { s, st } = editing('notch');
		st.target = { x: 100, y: 150 };
		expect(s.preview!.canCommit).toBe(false);
	});
});

describe('grain', () => {
	it('draws the grainline through the point clicked, at the length typed', () => {
		const { s, st } = editing('grain');
		clickOn(s, 'panel', { x: 60, y: 150 });
		st.lengthMm = 120;
		s.commitMove();
		const g = s.docs.piece('panel')!.geometry.grainline!;
		expect(Math.hypot(g.to.x - g.from.x, g.to.y - g.from.y)).toBeCloseTo(120, 6);
	});
	it('refuses a grainline longer than the piece', () => {
		const { s, st } = editing('grain');
		st.target = { x: 100, y: 150 };
		st.lengthMm = 5000;
		expect(s.preview!.canCommit).toBe(false);
	});
});

describe('fold', () => {
	it('puts the straight edge clicked end to end on the fold', () => {
		const { s } = editing('fold');
		clickOn(s, 'panel', { x: 0, y: 0 });
		clickOn(s, 'panel', { x: 0, y: 300 });
		s.commitMove();
		expect(s.docs.piece('panel')!.geometry.foldLine).toBeTruthy();
	});
	it('refuses two points that are not one straight edge', () => {
		const { s, st } = editing('fold');
		st.ends = [{ x: 0, y: 0 }, { x: 200, y: 300 }];
		expect(s.preview!.canCommit).toBe(false);
	});
});

describe('allowance', () => {
	it('adds the seam allowance round the piece, an edge clicked given its own width', () => {
		const { s, st } = editing('allowance');
		clickOn(s, 'panel', { x: 100, y: 300 });
		expect(st.edgeWidths).toHaveLength(1);
		st.edgeWidths = st.edgeWidths.map((e) => ({ ...e, widthMm: 30 }));
		s.commitMove();
		expect(ops(s)).toEqual(['allowance']);
	});
	it('refuses a negative width', () => {
		const { s, st } = editing('allowance');
		st.defaultWidthMm = -5;
		expect(s.preview!.canCommit).toBe(false);
	});
});

describe('the table’s own moves', () => {
	it('select: a piece dragged on the table moves in one undo step', () => {
		const { s } = editing('select');
		// the piece follows the pointer, so the pointer is given on the table (the piece lies at 100, 50)
		const path = [{ x: 200, y: 200 }, { x: 220, y: 210 }, { x: 250, y: 220 }].map((w) => pointerAt(s, w));
		s.pointerDown(path[0]);
		s.pointerMove(path[1]);
		s.pointerMove(path[2]);
		s.pointerUp(path[2], true);
		expect(s.docs.piece('panel')!.offset).toEqual({ x: 150, y: 70 });
		expect(s.docs.past).toHaveLength(1);
		expect(s.moving).toBeNull();
		s.undo();
		expect(s.docs.piece('panel')!.offset).toEqual({ x: 100, y: 50 });
		s.redo();
		expect(s.docs.piece('panel')!.offset).toEqual({ x: 150, y: 70 });
	});
	it('select: while a piece is dragged the document follows it inside a mark; Escape puts it back with no undo step', () => {
		const { s } = editing('select');
		const key = 'panel';
		s.pointerDown(pointerAt(s, { x: 200, y: 200 }));
		s.pointerMove(pointerAt(s, { x: 230, y: 200 }));
		expect(s.docs.marking).toBe(true);
		expect(s.moving?.offset).toEqual({ x: 130, y: 50 });
		expect(s.docs.piece(key)!.offset).toEqual({ x: 130, y: 50 });
		s.escape();
		expect(s.docs.piece(key)!.offset).toEqual({ x: 100, y: 50 });
		expect(s.docs.past).toHaveLength(0);
	});
	it('tape measure: the straight distance between two points, and along the outline', () => {
		const { s } = editing('measure');
		for (const w of [{ x: 100, y: 50 }, { x: 300, y: 50 }]) {
			const p = pointerAt(s, w);
			s.pointerDown(p);
			s.pointerUp(p, false);
		}
		const r = Object.fromEntries(s.preview!.readouts.map((x) => [x.label, x.value]));
		expect(r['Straight distance']).toBe('200.0 mm');
		expect(r['Along the outline (back)']).toBe('800.0 mm');
		expect(s.preview!.canCommit).toBe(false);
	});
});
