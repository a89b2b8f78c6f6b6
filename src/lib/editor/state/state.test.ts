import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '$lib/pattern/fixtures/front-bodice-block';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import type { EditorDoc, PieceEdit } from '../doc';
import { DEFAULT_PX_PER_MM, CALIBRATION_KEY, UNIT_KEY } from '../view';
import { Camera } from './camera.svelte';
import { docLayAsDrafted, docPendingSeamsRenamed, docPieceMoved, docStepApply } from './doc-edits';
import { DocumentStore } from './document.svelte';
import { historyEmpty, historyPush, historyRedo, historyUndo } from './history';
import { Selection } from './selection.svelte';

const edit = (key: string, geometry = rectanglePiece(key), x = 0): PieceEdit => ({
	key,
	name: geometry.name,
	cut: geometry.cut,
	fabric: geometry.fabric,
	baseVersionId: `v-${key}`,
	baseNumber: 1,
	base: geometry,
	geometry,
	steps: [],
	offset: { x, y: 0 },
	origin: null,
	retired: false,
	readOnly: false
});
const docOf = (...pieces: PieceEdit[]): EditorDoc => ({ pieces });

describe('history', () => {
	it('undoes to the document before a change and redoes to the one after', () => {
		let h = historyEmpty<string>();
		h = historyPush(h, 'a', 'first');
		h = historyPush(h, 'b', 'second');
		const u = historyUndo(h, 'c')!;
		expect(u.doc).toBe('b');
		expect(u.label).toBe('second');
		const r = historyRedo(u.history, u.doc)!;
		expect(r.doc).toBe('c');
		expect(r.history.past.map((e) => e.doc)).toEqual(['a', 'b']);
	});
	it('drops redo when a new change is made, and has nothing to undo when empty', () => {
		let h = historyPush(historyEmpty<string>(), 'a', 'first');
		h = historyUndo(h, 'b')!.history;
		expect(h.future).toHaveLength(1);
		h = historyPush(h, 'a', 'other');
		expect(h.future).toHaveLength(0);
		expect(historyUndo(historyEmpty<string>(), 'x')).toBeNull();
		expect(historyRedo(historyEmpty<string>(), 'x')).toBeNull();
	});
});

describe('the document store', () => {
	it('makes each change one undo step and finds pieces by key', () => {
		const d = new DocumentStore();
		d.reset(docOf(edit('a'), edit('b')));
		const moved = docPieceMoved(d.doc, 'a', { x: 50, y: 0 });
		if (!moved.ok) throw new Error(moved.error);
		d.push(moved.doc, moved.label);
		expect(d.piece('a')?.offset.x).toBe(50);
		expect(d.past).toHaveLength(1);
		expect(d.undo()).toBe(moved.label);
		expect(d.piece('a')?.offset.x).toBe(0);
		expect(d.redo()).toBe(moved.label);
		expect(d.piece('a')?.offset.x).toBe(50);
		expect(d.piece('nothing')).toBeNull();
	});
	it('keeps a drag as one undo step between its mark and its end', () => {
		const d = new DocumentStore();
		d.reset(docOf(edit('a')));
		d.begin();
		for (let x = 1; x <= 20; x++) {
			const m = docPieceMoved(d.doc, 'a', { x, y: 0 });
			if (m.ok) d.update(m.doc);
		}
		expect(d.past).toHaveLength(0);
		expect(d.commit('a dragged')).toBe(true);
		expect(d.past).toHaveLength(1);
		expect(d.piece('a')?.offset.x).toBe(20);
		d.undo();
		expect(d.piece('a')?.offset.x).toBe(0);
	});
	it('drops a drag that is rolled back, and makes no step for a drag that changed nothing', () => {
		const d = new DocumentStore();
		const start = docOf(edit('a'));
		d.reset(start);
		d.begin();
		const m = docPieceMoved(d.doc, 'a', { x: 9, y: 9 });
		if (m.ok) d.update(m.doc);
		d.rollback();
		expect(d.doc).toBe(start);
		d.begin();
		expect(d.commit('nothing')).toBe(false);
		expect(d.past).toHaveLength(0);
	});
	it('counts a piece with steps as changed (dirty), and a read-only or untouched one not', () => {
		const d = new DocumentStore();
		d.reset(docOf(edit('front', frontBodiceBlock()), { ...edit('back'), readOnly: true }));
		expect(d.dirty).toHaveLength(0);
		const r = docStepApply(d.doc, 'front', { op: 'pivot', params: { dartId: 'shoulder-dart', to: { x: 232, y: 290 } } });
		if (!r.ok) throw new Error(r.error);
		d.push(r.doc, r.label);
		expect(d.dirty.map((p) => p.key)).toEqual(['front']);
		expect(docStepApply(d.doc, 'back', { op: 'fold', params: { from: { x: 0, y: 0 }, to: { x: 0, y: 300 } } })).toEqual({ ok: false, error: 'This piece cannot be changed here.' });
	});
	it('relabels the pending seams of new pieces with the names given to them before the first save', () => {
		const edge = { segments: [] };
		const seam = (label: string) => ({ label, a: { pieceKey: 'n0', edge }, b: { pieceKey: 'n1', edge }, allowedEaseMm: 0, toleranceMm: 1.5 });
		const doc: EditorDoc = { pieces: [], pendingSeams: [seam('style seam 1 (Side panel (a))'), seam('style seam 2 (Centre panel (a))')] };
		const named = docPendingSeamsRenamed(doc, new Map([['Side panel (a)', 'Upper side front'], ['Centre panel (a)', 'Upper centre front']]));
		expect(named.pendingSeams!.map((s) => s.label)).toEqual(['style seam 1 (Upper side front)', 'style seam 2 (Upper centre front)']);
		expect(docPendingSeamsRenamed(doc, new Map())).toBe(doc);
	});
	it('lays pieces as drafted at the first one’s offset', () => {
		const r = docLayAsDrafted(docOf(edit('a', undefined, 10), edit('b', undefined, 300)), ['a', 'b']);
		expect(r.ok && r.doc.pieces.map((p) => p.offset.x)).toEqual([10, 10]);
	});
});

describe('the camera', () => {
	const box = { minX: 0, minY: 0, maxX: 400, maxY: 200 };
	it('keeps the world point under the pointer while zooming', () => {
		const c = new Camera(() => box, null);
		c.resize(1000, 600);
		const at = { x: 300, y: 200 };
		const w = c.toWorld(at);
		c.zoomBy(1.5, at);
		const back = c.toScreen(w);
		expect(back.x).toBeCloseTo(at.x, 9);
		expect(back.y).toBeCloseTo(at.y, 9);
	});
	it('fits the content on first sizing and shows true size as calibrated', () => {
		const c = new Camera(() => box, null);
		c.resize(1000, 600);
		expect(c.toScreen({ x: 0, y: 100 }).x).toBeGreaterThanOrEqual(39.99);
		c.trueSize();
		expect(c.scale).toBeCloseTo(DEFAULT_PX_PER_MM, 9);
		expect(c.zoomPercent).toBe(100);
	});
	it('remembers calibration and unit in the settings and keeps the zoom factor on recalibrating', () => {
		const store = new Map<string, string>();
		const settings = { getItem: (k: string) => store.get(k) ?? null, setItem: (k: string, v: string) => void store.set(k, v) };
		const c = new Camera(() => box, settings);
		c.resize(1000, 600);
		c.trueSize();
		c.zoomBy(2);
		expect(c.setCalibration(5)).toBe(true);
		expect(c.scale).toBeCloseTo(10, 6);
		expect(c.setCalibration(0.1)).toBe(false);
		c.setUnit('in');
		expect(store.get(CALIBRATION_KEY)).toBe('5');
		expect(store.get(UNIT_KEY)).toBe('in');
		const again = new Camera(() => box, settings);
		expect(again.calibration).toBe(5);
		expect(again.unit).toBe('in');
	});
	it('remembers the pattern paper chosen, and starts on inches for a user who measures in inches', () => {
		const store = new Map<string, string>([[UNIT_KEY, 'in']]);
		const settings = { getItem: (k: string) => store.get(k) ?? null, setItem: (k: string, v: string) => void store.set(k, v) };
		const c = new Camera(() => box, settings);
		expect(c.paperGrid).toBe('1in');
		c.setPaperGrid('2cm');
		expect(new Camera(() => box, settings).paperGrid).toBe('2cm');
	});
	it('turns a few screen pixels into millimetres at the current zoom', () => {
		const c = new Camera(() => box, null);
		c.scale = 4;
		expect(c.tolMm(8)).toBe(2);
	});
});

describe('the selection', () => {
	it('selects what a click hit: an edge, a point, or only the piece', () => {
		const s = new Selection();
		s.hit({ pieceKey: 'a', kind: 'point', local: { x: 1, y: 2 }, segmentIndex: 3, t: 0 });
		expect([s.pieceKey, s.segmentIndex, s.point]).toEqual(['a', 3, { x: 1, y: 2 }]);
		s.hit({ pieceKey: 'b', kind: 'inside', local: { x: 0, y: 0 }, segmentIndex: -1, t: 0 });
		expect([s.pieceKey, s.segmentIndex, s.point]).toEqual(['b', -1, null]);
		s.hit(null);
		expect(s.pieceKey).toBe('b');
	});
	it('selects a dart, an apex or a seam pair of the piece, and panels picked together', () => {
		const s = new Selection();
		s.piece('a');
		s.part('a', { dartId: 'd1' });
		expect([s.pieceKey, s.dartId, s.apexId]).toEqual(['a', 'd1', null]);
		s.part('b', { seamPairId: 'p' });
		expect([s.pieceKey, s.dartId, s.seamPairId]).toEqual(['b', null, 'p']);
		s.togglePanel('c');
		expect(s.panels).toEqual(['b', 'c']);
		s.togglePanel('b');
		expect(s.panels).toEqual(['c']);
		s.piece('a');
		expect(s.panels).toEqual([]);
	});
	it('moves to a shown piece when its piece is gone, and follows a new key', () => {
		const s = new Selection();
		s.piece('gone');
		s.fix([{ key: 'x' }, { key: 'y' }]);
		expect(s.pieceKey).toBe('x');
		s.rekey('x', 'stored-x');
		expect(s.pieceKey).toBe('stored-x');
	});
});
