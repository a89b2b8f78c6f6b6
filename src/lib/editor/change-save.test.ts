import { describe, expect, it } from 'vitest';
import { pathFromPolyline } from '$lib/geometry';
import { rectanglePiece } from '$lib/pattern/panels/fixtures/simple-pieces';
import { changeRecompute } from '$lib/pattern/recipe/change';
import { changeVerify } from '$lib/pattern/verify/change-verify';
import type { Piece } from '$lib/pattern/piece-schema';
import { changeBodyBuild, changeNewPieces, namingProblem, pieceRenamed, type PendingStep } from './change-save';
import type { EditorDoc, PieceEdit } from './doc';

const edit = (key: string, g: Piece, extra: Partial<PieceEdit> = {}): PieceEdit => ({
	key, name: g.name, cut: g.cut, fabric: g.fabric, baseVersionId: key.startsWith('new-') ? null : `${key}-v1`, baseNumber: key.startsWith('new-') ? 0 : 1,
	base: g, geometry: g, steps: [], offset: { x: 0, y: 0 }, origin: key.startsWith('new-') ? { op: 'change_result' } : null, retired: false, readOnly: false, ...extra
});

/** A stored rectangle separated in the editor, then its two parts joined back: two pending steps. */
function separatedAndJoined() {
	const rect = rectanglePiece('rect');
	const path = pathFromPolyline([{ x: 0, y: 120 }, { x: 200, y: 120 }]);
	const first = changeRecompute(new Map([['piece-1', rect]]), [{ op: 'separate', sources: [{ pieceId: 'piece-1' }], params: { path } }]);
	if (!first.ok) throw new Error(first.message);
	const [a, b] = first.steps[0].result.pieces;
	const seam = first.steps[0].result.seamPairs[0];
	const joined = changeRecompute(new Map([['piece-1', rect]]), [
		{ op: 'separate', sources: [{ pieceId: 'piece-1' }], params: { path } },
		{ op: 'join', sources: [{ step: 0, result: 0 }, { step: 0, result: 1 }], params: { seam, name: 'Whole again' } }
	]);
	if (!joined.ok) throw new Error(joined.message);
	const whole = joined.steps[1].result.pieces[0];
	const steps: PendingStep[] = [
		{ op: 'separate', params: { path }, sources: [{ key: 'piece-1', recipe: [] }], resultKeys: ['new-a-0', 'new-a-1'] },
		{ op: 'join', params: { seam, name: 'Whole again' }, sources: [{ key: 'new-a-0', recipe: [] }, { key: 'new-a-1', recipe: [] }], resultKeys: ['new-b-0'] }
	];
	const doc: EditorDoc = {
		pieces: [edit('piece-1', rect, { retired: true }), edit('new-a-0', a, { retired: true }), edit('new-a-1', b, { retired: true }), edit('new-b-0', whole)],
		pendingSteps: steps
	};
	return { doc, rect };
}

describe('editor: a multi-piece change as one save', () => {
	it('sends every pending step with its sources (stored pieces by base version, earlier results by step) and the new pieces no later step used', () => {
		const { doc, rect } = separatedAndJoined();
		expect(changeNewPieces(doc).map((p) => p.key)).toEqual(['new-b-0']);
		const built = changeBodyBuild(doc, 'Cut and joined back', () => [], () => []);
		if (typeof built === 'string') throw new Error(built);
		expect(built.body.bases).toEqual([{ pieceId: 'piece-1', versionId: 'piece-1-v1' }]);
		expect(built.body.steps[1].sources).toEqual([{ step: 0, result: 0, recipe: [] }, { step: 0, result: 1, recipe: [] }]);
		expect(built.body.pieces.map((p) => [p.step, p.result])).toEqual([[1, 0]]);
		// what the server will do with it: the same recomputation gives the same piece
		const v = changeVerify(new Map([['piece-1', rect]]), JSON.parse(JSON.stringify(built.body.steps)), JSON.parse(JSON.stringify(built.body.pieces)));
		expect(v.ok).toBe(true);
	});

	it('refuses names a new piece may not have: empty, a source\'s name, or twice the same', () => {
		expect(namingProblem([{ name: ' ' }], [])).toMatch(/Give new piece 1 a name/);
		expect(namingProblem([{ name: 'Centre front panel' }], ['Centre front panel'])).toMatch(/name of a piece it was made from/);
		expect(namingProblem([{ name: 'Band' }, { name: 'band' }], [])).toMatch(/both called/);
		expect(namingProblem([{ name: 'Band' }, { name: 'Upper front' }], ['Centre front panel'])).toBeNull();
	});

	it('gives a renamed piece one label with its own name and cut, inside the piece, in place of its sources\' labels', () => {
		const g = { ...rectanglePiece('rect'), labels: [{ id: 'name', text: 'Centre front panel — cut 2 (a pair)', at: { x: 10, y: 10 }, angleRad: 0 }, { id: 'cut', text: 'Cut 2 (a pair)', at: { x: 20, y: 20 }, angleRad: 0 }] };
		const r = pieceRenamed(g, 'Midriff', 'on_fold');
		expect(r.name).toBe('Midriff');
		expect(r.cut).toBe('on_fold');
		expect(r.labels.map((l) => l.text)).toEqual(['Midriff — cut 1 on fold']);
		expect(r.labels[0].at.x).toBeGreaterThan(0);
		expect(r.labels[0].at.x).toBeLessThan(200);
	});
});
