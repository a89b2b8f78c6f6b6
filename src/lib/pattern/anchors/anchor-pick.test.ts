import { describe, expect, it } from 'vitest';
import { blockDraft, EASE_DEFAULT } from '../drafting';
import { vecDistance, type Vec } from '../kernel';
import { astmD5585MeasurementSet, measurementsMm } from '../measurements';
import { seamPointAt } from '../piece-seams';
import { pathFromPolyline } from '../kernel';
import { rectanglePiece } from '../panels/fixtures/simple-pieces';
import { changeRecompute } from '../recipe/change';
import { recipeStepApply } from '../recipe/registry';
import { versionVerify } from '../verify/version-verify';
import { anchorBody, anchorResolve, anchorSchema, type Anchor, type AnchorBody } from './anchor';
import { stepAnchorProblems } from './anchor-check';
import { stepParamsCarry } from './step-anchors';
import { anchoredPoint, anchorOffsetFrom, anchorPick } from './anchor-pick';
import { anchorText } from './anchor-text';

// The front block drafted from ASTM D5585-11e1 Table 1, curvy size 10 (reference-values row 1, C).
const front = (size: '10' | '14' = '10') => blockDraft(measurementsMm(astmD5585MeasurementSet('curvy', size)), EASE_DEFAULT, { bustDart: 'shoulder' }).front;
const mm = (v: number) => `${v.toFixed(1)} mm`;

function onSeam(body: AnchorBody, name: string, from: 'start' | 'end', d: number): Vec {
	const seam = body.seams.find((s) => s.name === name)!;
	const r = seamPointAt(body.piece, seam, from, d);
	if (!r.ok) throw new Error(r.message);
	return r.point;
}

/** The anchor found again on the same piece, and how far from the clicked point. */
function backDistance(body: AnchorBody, a: Anchor, clicked: Vec): number {
	expect(anchorSchema.safeParse(a).success).toBe(true);
	const r = anchorResolve(body, a);
	return r.ok ? vecDistance(r.point, clicked) : Infinity;
}

describe('the anchor of a point the pattern cutter picked', () => {
	const body = anchorBody(front());

	it('reads a click on the side seam as a fraction of the seam, found again within 1e-6 mm', () => {
		const seam = body.seams.find((s) => s.name === 'side seam')!;
		const p = onSeam(body, 'side seam', 'start', seam.lengthMm * 0.4);
		const pick = anchorPick(body, p)!;
		expect(pick.anchor).toMatchObject({ kind: 'edge', edge: 'side seam', from: 'start' });
		expect(pick.anchor.kind === 'edge' && pick.anchor.fraction).toBeCloseTo(0.4, 9);
		expect(backDistance(body, pick.anchor, p)).toBeLessThan(1e-6);
		expect(vecDistance(pick.point, p)).toBeLessThan(1e-6);
	});

	it('reads a place near the end of the shoulder as a distance from that nearer end, found again within 1e-6 mm', () => {
		const p = onSeam(body, 'shoulder', 'end', 23.5);
		const pick = anchorPick(body, p, { edgeBy: 'distance' })!;
		expect(pick.anchor).toMatchObject({ kind: 'edge', edge: 'shoulder', from: 'end' });
		expect(pick.anchor.kind === 'edge' && pick.anchor.distanceMm).toBeCloseTo(23.5, 9);
		expect(backDistance(body, pick.anchor, p)).toBeLessThan(1e-6);
	});

	it('snaps a click within the tolerance of a landmark to the landmark itself', () => {
		const waist = body.landmarks.find((l) => l.name === 'side waist')!.point;
		const clicked = { x: waist.x + 0.6, y: waist.y - 0.5 };
		const pick = anchorPick(body, clicked, { landmarkTolMm: 1.5 })!;
		expect(pick.anchor).toEqual({ kind: 'landmark', name: 'side waist' });
		expect(vecDistance(pick.point, waist)).toBe(0);
		expect(backDistance(body, pick.anchor, pick.point)).toBeLessThan(1e-6);
		// exactly on the landmark it is that landmark with the default (tight) tolerance too
		expect(anchorPick(body, waist)!.anchor).toEqual({ kind: 'landmark', name: 'side waist' });
	});

	it('falls back to an offset from the nearest landmark for a point inside the piece, found again within 1e-6 mm', () => {
		const bp = body.landmarks.find((l) => l.name === 'bust-point')!.point;
		const p = { x: bp.x + 12, y: bp.y + 5 };
		const pick = anchorPick(body, p)!;
		expect(pick.anchor).toMatchObject({ kind: 'offset', of: { kind: 'landmark', name: 'bust-point' } });
		expect(pick.anchor.kind === 'offset' && [pick.anchor.dxMm, pick.anchor.dyMm]).toEqual([expect.closeTo(12, 9), expect.closeTo(5, 9)]);
		expect(backDistance(body, pick.anchor, p)).toBeLessThan(1e-6);
	});

	it('says each anchor in the trade’s words and in the person’s unit', () => {
		const seam = body.seams.find((s) => s.name === 'side seam')!;
		const at40 = anchorPick(body, onSeam(body, 'side seam', 'start', seam.lengthMm * 0.4))!.anchor;
		expect(anchorText(at40, body, mm)).toBe(`side seam, 40 % from the ${seam.startNeighbour}`);
		const shoulder = anchorPick(body, onSeam(body, 'shoulder', 'start', 30), { edgeBy: 'distance' })!.anchor;
		expect(anchorText(shoulder, body, mm)).toBe('30.0 mm from the side neck point along the shoulder');
		expect(anchorText(shoulder, body, (v) => `${(v / 10).toFixed(2)} cm`)).toBe('3.00 cm from the side neck point along the shoulder');
		expect(anchorText({ kind: 'landmark', name: 'bust-point' }, body, mm)).toBe('bust point');
		expect(anchorText({ kind: 'offset', of: { kind: 'landmark', name: 'bust-point' }, dxMm: 12, dyMm: 5 }, body, mm)).toBe('offset 12.0 mm right, 5.0 mm down from the bust point');
	});
});

describe('a save checks the anchors sent with a step', () => {
	const piece = front();
	const body = anchorBody(piece);
	const seam = body.seams.find((s) => s.name === 'side seam')!;
	const to = anchoredPoint(body, onSeam(body, 'side seam', 'start', seam.lengthMm * 0.5));
	const step = { op: 'pivot', params: { dartId: piece.darts[0].id, to } };

	it('accepts a step whose anchor gives its point, and the version verifies', () => {
		expect(stepAnchorProblems(step.params, [piece], false)).toEqual([]);
		const r = recipeStepApply(piece, step);
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(versionVerify(piece, r.piece, [step], recipeStepApply).ok).toBe(true);
	});

	it('refuses a step whose anchor says another place than its point, saying how far', () => {
		const lying = { ...step, params: { ...step.params, to: { ...to, anchor: { kind: 'landmark', name: 'side waist' } } } };
		const problems = stepAnchorProblems(lying.params, [piece], false);
		expect(problems[0]).toMatch(/is anchored at the side waist, which is \d+\.\d\d mm away/);
		const r = recipeStepApply(piece, lying);
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		const v = versionVerify(piece, r.piece, [lying], recipeStepApply);
		expect(!v.ok && v.problem.message).toMatch(/^Step 1 \(pivot\): the point .* is anchored at the side waist/);
	});
});

describe('a style change checks the anchors of its steps', () => {
	const rect = rectanglePiece('rect');
	const body = anchorBody(rect);
	const path = (anchorAt: (p: Vec) => unknown) => {
		const p = pathFromPolyline([{ x: 0, y: 120 }, { x: 200, y: 120 }]);
		return { segments: p.segments.map((seg) => ({ ...seg, p0: { ...seg.p0, anchor: anchorAt(seg.p0) } })) };
	};

	it('recomputes a separate whose cut line starts at its anchor', () => {
		const r = changeRecompute(new Map([['piece-1', rect]]), [{ op: 'separate', sources: [{ pieceId: 'piece-1' }], params: { path: path((p) => anchoredPoint(body, p).anchor) } }]);
		expect(r.ok).toBe(true);
	});

	it('refuses a separate whose cut line says it starts elsewhere, and a source recipe step whose anchor is wrong', () => {
		const far = changeRecompute(new Map([['piece-1', rect]]), [{ op: 'separate', sources: [{ pieceId: 'piece-1' }], params: { path: path(() => ({ kind: 'edge', edge: body.seams[0].name, fraction: 1 })) } }]);
		expect(!far.ok && far.code).toBe('replay_refused');
		expect(!far.ok && far.message).toMatch(/^Step 1 \(separate\): the point \(0\.0, 120\.0\) is anchored at /);
		const notch = { op: 'notch' as const, params: { id: 'n1', at: { x: 200, y: 60, anchor: { kind: 'landmark', name: body.landmarks[0].name } }, count: 1 } };
		const src = changeRecompute(new Map([['piece-1', rect]]), [{ op: 'separate', sources: [{ pieceId: 'piece-1', recipe: [notch] }], params: { path: path((p) => anchoredPoint(body, p).anchor) } }]);
		expect(!src.ok && src.message).toMatch(/step 1 \(notch\) made on source 1: the point \(200\.0, 60\.0\) is anchored at /);
	});
});

describe('anchors the editor recorded, found again on another size', () => {
	it('keeps a notch picked by distance at that distance from the same end, and a pivot picked by fraction at that fraction', () => {
		const base = anchorBody(front('10'));
		const bigger = anchorBody(front('14'));
		const notch = anchoredPoint(base, onSeam(base, 'shoulder', 'start', 30), { edgeBy: 'distance' });
		const side = base.seams.find((x) => x.name === 'waist')!;
		const to = anchoredPoint(base, onSeam(base, 'waist', 'start', side.lengthMm * 0.4));
		const r = stepParamsCarry({ notch, to }, [base.piece], [bigger.piece], false);
		if (!r.ok) throw new Error(r.message);
		const moved = r.params as { notch: Vec; to: Vec };
		expect(vecDistance(moved.notch, onSeam(bigger, 'shoulder', 'start', 30))).toBeLessThan(1e-6);
		const bigSide = bigger.seams.find((x) => x.name === 'waist')!;
		expect(vecDistance(moved.to, onSeam(bigger, 'waist', 'start', bigSide.lengthMm * 0.4))).toBeLessThan(1e-6);
		expect(Math.abs(bigSide.lengthMm - side.lengthMm)).toBeGreaterThan(5);
	});

	it('moves the corner a reshape took by its landmark on the larger size, by the same offset', () => {
		const base = anchorBody(front('10'));
		const bigger = anchorBody(front('14'));
		const at = (b: AnchorBody) => b.landmarks.find((l) => l.name === 'side waist')!.point;
		const from = anchoredPoint(base, at(base));
		expect(from.anchor).toEqual({ kind: 'landmark', name: 'side waist' });
		const off = anchorOffsetFrom(base, { kind: 'landmark', name: 'side waist' }, { x: at(base).x + 4, y: at(base).y + 10 })!;
		const params = { moves: [{ from, to: { ...off.point, anchor: off.anchor } }] };
		expect(recipeStepApply(base.piece, { op: 'reshape', params }).ok).toBe(true);
		const r = stepParamsCarry(params, [base.piece], [bigger.piece], false);
		if (!r.ok) throw new Error(r.message);
		const m = (r.params as { moves: { from: Vec; to: Vec }[] }).moves[0];
		expect(vecDistance(m.from, at(bigger))).toBeLessThan(1e-9);
		expect(vecDistance(m.to, { x: at(bigger).x + 4, y: at(bigger).y + 10 })).toBeLessThan(1e-9);
		expect(recipeStepApply(bigger.piece, { op: 'reshape', params: r.params }).ok).toBe(true);
	});
});
