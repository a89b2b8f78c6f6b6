import { piecePressByPractice } from '../press-practice';
import { vecAdd, vecDistance, vecScale, type Segment, type Vec } from '../../geometry';
import type { Apex, CutInstruction, Dart, Piece } from '../piece-schema';
import { pieceSchema } from '../piece-schema';
import { DRAFT_RULES, type BlockFrame } from './block-frame';
import { dartAngleRad } from './bust-dart';
import { cubicByTangents, line } from './outline-build';

export const BACK_SHOULDER_PIVOT_ID = 'back-shoulder-pivot';
export const BACK_WAIST_PIVOT_ID = 'back-waist-pivot';
export const BACK_SHOULDER_DART_ID = 'back-shoulder-dart';
export const BACK_WAIST_DART_ID = 'back-waist-dart';

const right: Vec = { x: 1, y: 0 };
const up: Vec = { x: 0, y: -1 };
const down: Vec = { x: 0, y: 1 };

export function backSegments(f: BlockFrame): Segment[] {
	const B = f.back;
	const inward = { x: -B.shoulderDir.y, y: B.shoulderDir.x };
	return [
		cubicByTangents(B.neckPoint, right, B.sideNeckPoint, up, 0.5, 0.3),
		line(B.sideNeckPoint, B.shoulderDartLeg1),
		line(B.shoulderDartLeg1, B.shoulderDartPivot),
		line(B.shoulderDartPivot, B.shoulderDartLeg2),
		line(B.shoulderDartLeg2, B.shoulderPoint),
		cubicByTangents(B.shoulderPoint, inward, B.acrossPoint, down, 0.35, 0.35),
		cubicByTangents(B.acrossPoint, down, B.underarm, right, 0.45, 0.5),
		line(B.underarm, B.sideBust),
		line(B.sideBust, B.sideWaist),
		line(B.sideWaist, B.waistDartLeg1),
		line(B.waistDartLeg1, B.waistDartPivot),
		line(B.waistDartPivot, B.waistDartLeg2),
		line(B.waistDartLeg2, B.centreWaist),
		line(B.centreWaist, B.neckPoint)
	];
}

/** Sewn dart data for a back dart pulled back from its pivot to its tip (primer §4, row 12). */
function sewn(leg1End: Vec, leg2End: Vec, tip: Vec) {
	const legMm = vecDistance(leg1End, tip);
	return {
		clearanceMm: DRAFT_RULES.backDartPivotBeyondTipMm,
		sewnPoint: tip,
		sewnLegLengthMm: legMm,
		sewnAngleRad: dartAngleRad(vecDistance(leg1End, leg2End), legMm)
	};
}

export interface BackPieceOptions {
	readonly cut: Extract<CutInstruction, 'on_fold' | 'pair'>;
	readonly id: string;
	readonly name: string;
}

export function backPiece(f: BlockFrame, o: BackPieceOptions): Piece {
	const B = f.back;
	const apexes: Apex[] = [
		{ id: BACK_SHOULDER_PIVOT_ID, kind: 'dart_pivot', label: 'shoulder dart pivot', point: B.shoulderDartPivot },
		{ id: BACK_WAIST_PIVOT_ID, kind: 'dart_pivot', label: 'waist dart pivot', point: B.waistDartPivot }
	];
	const darts: Dart[] = [
		{
			id: BACK_SHOULDER_DART_ID,
			apexId: BACK_SHOULDER_PIVOT_ID,
			leg1End: B.shoulderDartLeg1,
			leg2End: B.shoulderDartLeg2,
			movingLeg: 'leg2',
			pullBack: sewn(B.shoulderDartLeg1, B.shoulderDartLeg2, B.shoulderDartTip)
		},
		{
			id: BACK_WAIST_DART_ID,
			apexId: BACK_WAIST_PIVOT_ID,
			leg1End: B.waistDartLeg1,
			leg2End: B.waistDartLeg2,
			movingLeg: 'leg2',
			pullBack: sewn(B.waistDartLeg1, B.waistDartLeg2, B.waistDartTip)
		}
	];
	const grainX = B.waistDartLeg2.x / 2;
	const labelAt = vecAdd(vecScale(vecAdd(B.waistDartLeg1, B.sideWaist), 0.5), { x: 0, y: -(f.waistY - f.bustY) / 2 });
	return piecePressByPractice(pieceSchema.parse({
		schemaVersion: 1,
		id: o.id,
		name: o.name,
		outline: { segments: backSegments(f) },
		apexes,
		darts,
		notches: [
			{ id: 'back-armhole', at: B.acrossPoint, count: 2 },
			{ id: 'back-side-bust', at: B.sideBust, count: 1 }
		],
		grainline: { from: { x: grainX, y: 40 }, to: { x: grainX, y: f.waistY - 30 }, arrowheads: 'both' },
		foldLine: o.cut === 'on_fold' ? { from: B.neckPoint, to: B.centreWaist } : null,
		labels: [
			{ id: 'name', text: o.name, at: labelAt, angleRad: -Math.PI / 2 },
			{ id: 'cut', text: o.cut === 'on_fold' ? 'Cut 1 on fold (centre back)' : 'Cut 2 (a pair)', at: { x: grainX + 12, y: (f.bustY + f.waistY) / 2 }, angleRad: -Math.PI / 2 },
			{ id: 'centre', text: 'CB', at: { x: 8, y: f.waistY / 2 }, angleRad: -Math.PI / 2 }
		],
		cut: o.cut
	}));
}
