import { afterEach, describe, expect, it } from 'vitest';
import { vecLerp } from '$lib/geometry';
import { frontBodiceBlock, FRONT_BLOCK_BUST_POINT } from '$lib/pattern/fixtures/front-bodice-block';
import { dragThrough, editorWith, editorsMade, undoRedoRoundTrip } from '../editor-fixture';
import type { MoveStateOf } from './registry';
import type { MoveId } from './types';

// every change a test made is undone and redone to the same documents
afterEach(() => {
	for (const { s, start } of editorsMade()) expect(undoRedoRoundTrip(s, start)).toBeNull();
});

/** The moves on a dart (pivot, share, pleat, pull back, cap), on the front bodice block, without a browser. */

const block = frontBodiceBlock();
const shoulder = block.darts.find((d) => d.id === 'shoulder-dart')!;
const SIDE_SEAM_AT_300 = { x: 235 - (10 * 70) / 210, y: 300 };

function editing<K extends MoveId>(id: K, readOnly = false) {
	const s = editorWith([{ geometry: block, key: 'front', readOnly }]);
	s.setMove(id);
	return { s, st: s.move as MoveStateOf<K> };
}
const ops = (s: ReturnType<typeof editorWith>) => s.docs.piece('front')!.steps.map((x) => x.op);

describe('pivot', () => {
	it('starts on the selected piece’s first dart and previews the dart opening where it is dragged', () => {
		const { s, st } = editing('pivot');
		expect(st.dartId).toBe('shoulder-dart');
		st.target = SIDE_SEAM_AT_300;
		const pv = s.preview!;
		expect(pv.canCommit).toBe(true);
		expect(pv.piece!.darts.find((d) => d.id === 'shoulder-dart')!.leg1End.x).toBeGreaterThan(200);
		expect(pv.readouts.map((r) => r.label)).toContain('Intake after');
	});
	it('pivots in one undo step when the opening is dragged from the dart to the side seam', () => {
		const { s } = editing('pivot');
		dragThrough(s, 'front', [vecLerp(FRONT_BLOCK_BUST_POINT, shoulder.leg1End, 0.85), { x: 233, y: 260 }, SIDE_SEAM_AT_300]);
		expect(ops(s)).toEqual(['pivot']);
		expect(s.docs.past).toHaveLength(1);
		// the next pivot starts with choosing its dart again
		expect(s.move.id === 'pivot' && s.move.dartId).toBeNull();
	});
	it('refuses to open a dart on the fold, and says so on the canvas', () => {
		const { s, st } = editing('pivot');
		st.target = { x: 0, y: 300 };
		expect(s.preview!.canCommit).toBe(false);
		expect(s.preview!.error).toBeTruthy();
		expect(s.preview!.overlay.some((o) => o.kind === 'label' && o.text.includes('fold'))).toBe(true);
		s.commitMove();
		expect(s.moveMessage).toBeTruthy();
		expect(ops(s)).toEqual([]);
	});
});

describe('share', () => {
	it('shares the dart equally between the points clicked on the outline', () => {
		const { s, st } = editing('share');
		dragThrough(s, 'front', [SIDE_SEAM_AT_300]);
		dragThrough(s, 'front', [{ x: 229, y: 400 }]);
		expect(st.fractions).toEqual([0.5, 0.5]);
		expect(s.preview!.readouts.find((r) => r.label === 'Shares total')?.tone).toBe('ok');
		s.commitMove();
		expect(ops(s)).toEqual(['share']);
	});
	it('refuses shares that do not add up to the whole dart', () => {
		const { s, st } = editing('share');
		st.points = [SIDE_SEAM_AT_300];
		st.fractions = [0.6];
		expect(s.preview!.error).toBeTruthy();
		expect(s.preview!.canCommit).toBe(false);
		s.commitMove();
		expect(ops(s)).toEqual([]);
	});
});

describe('pleat', () => {
	it('turns the shoulder dart into two pleats along the shoulder seam', () => {
		const { s, st } = editing('pleat');
		expect([st.count, st.firstAtMm, st.spacingMm]).toEqual([2, 15, 30]);
		const pv = s.preview!;
		expect(pv.error).toBeNull();
		expect(pv.piece!.pleats).toHaveLength(2);
		expect(pv.readouts.map((r) => r.label)).toContain('Pleat 2 intake');
		s.commitMove();
		expect(ops(s)).toEqual(['pleat']);
		// the numbers stay for the next dart
		expect(s.move.id === 'pleat' && s.move.count).toBe(2);
	});
	it('refuses a dart that is not on the piece', () => {
		const { s, st } = editing('pleat');
		st.dartId = 'no-such-dart';
		expect(s.preview!.error).toBe('That dart is not on this piece.');
		s.commitMove();
		expect(ops(s)).toEqual([]);
	});
});

describe('pull back', () => {
	it('moves the dart point back from the apex by the clearance', () => {
		const { s, st } = editing('pull_back');
		st.clearanceMm = 25;
		expect(s.preview!.canCommit).toBe(true);
		s.commitMove();
		expect(ops(s)).toEqual(['pull_back']);
	});
	it('refuses a clearance longer than the dart', () => {
		const { s, st } = editing('pull_back');
		st.clearanceMm = 2000;
		expect(s.preview!.error).toBeTruthy();
		s.commitMove();
		expect(ops(s)).toEqual([]);
	});
});

describe('cap', () => {
	it('trues the dart’s mouth for the side it is pressed to', () => {
		const { s, st } = editing('cap');
		st.pressToward = 'leg2';
		expect(s.preview!.canCommit).toBe(true);
		s.commitMove();
		expect(ops(s)).toEqual(['cap']);
	});
	it('is not offered on a piece the role may only look at', () => {
		const { st } = editing('cap', true);
		expect(st.pieceKey).toBeNull();
		expect(st.dartId).toBeNull();
	});
});
