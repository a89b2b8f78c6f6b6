import { describe, expect, it } from 'vitest';
import { blockDraft, EASE_DEFAULT } from './drafting';
import { demoPath } from './fixtures/demo-path';
import { frontBodiceBlock } from './fixtures/front-bodice-block';
import { vecLerp, vecSub, type Vec } from './kernel';
import { astmD5585MeasurementSet, measurementsMm } from './measurements';
import { pivot } from './operations/pivot';
import type { Dart, Piece } from './piece-schema';
import { dartPressByPractice } from './press-practice';

// The rule checked here: "press vertical darts toward centre, horizontal down"
// (reference-values row 11, Erwin 1954 p. 30, C; also common practice, CP).

const apexOf = (piece: Piece, d: Dart): Vec => piece.apexes.find((a) => a.id === d.apexId)!.point;
const pressedEnd = (d: Dart) => (d.pressToward === 'leg1' ? d.leg1End : d.leg2End);
const otherEnd = (d: Dart) => (d.pressToward === 'leg1' ? d.leg2End : d.leg1End);
const isVertical = (piece: Piece, d: Dart) => {
	const axis = vecSub(vecLerp(d.leg1End, d.leg2End, 0.5), apexOf(piece, d));
	return Math.abs(axis.y) >= Math.abs(axis.x);
};
/** Centre front or back of the drafted blocks and of the demo pieces: the line x = 0. */
const centreX = 0;

function expectPressedByPractice(piece: Piece) {
	expect(piece.darts.length).toBeGreaterThan(0);
	for (const d of piece.darts) {
		expect(d.pressToward, `${piece.name}, dart ${d.id}`).toBeDefined();
		if (isVertical(piece, d)) expect(Math.abs(pressedEnd(d).x - centreX)).toBeLessThan(Math.abs(otherEnd(d).x - centreX));
		else expect(pressedEnd(d).y).toBeGreaterThan(otherEnd(d).y);
	}
}

describe('pressing direction of drafted darts (common practice)', () => {
	const m = measurementsMm(astmD5585MeasurementSet('curvy', '10'));
	for (const bustDart of ['side', 'shoulder'] as const) {
		it(`presses vertical darts toward the centre and horizontal darts down (${bustDart} bust dart)`, () => {
			const { front, back } = blockDraft(m, EASE_DEFAULT, { bustDart });
			expectPressedByPractice(front);
			expectPressedByPractice(back);
		});
	}

	it('gives every dart of the demo style a pressing direction, toward the centre front on the upper front', () => {
		for (const p of demoPath().pieces) {
			for (const v of [p.first, ...p.later]) if (v.geometry.darts.length) expectPressedByPractice(v.geometry);
		}
	});
});

describe('pressing direction after a move', () => {
	it('a dart pivoted to the side seam is horizontal and pressed down, and the report says so', () => {
		const r = pivot(frontBodiceBlock(), { dartId: 'shoulder-dart', to: vecLerp({ x: 235, y: 230 }, { x: 225, y: 440 }, 0.3) });
		if (!r.ok) throw new Error(r.error.message);
		const d = r.piece.darts.find((x) => x.id === 'shoulder-dart')!;
		expect(isVertical(r.piece, d)).toBe(false);
		expect(pressedEnd(d).y).toBeGreaterThan(otherEnd(d).y);
		expect(r.report.notes.join(' ')).toMatch(/common practice/);
	});

	it('a vertical dart on a piece that marks no centre gets no direction', () => {
		const block = frontBodiceBlock();
		const bare: Piece = { ...block, foldLine: null, labels: [] };
		const d = bare.darts.find((x) => isVertical(bare, x))!;
		expect(dartPressByPractice(bare, d)).toBeUndefined();
	});
});
