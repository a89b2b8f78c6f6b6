import { piecePressByPractice } from '../press-practice';
import { pointRotateAbout, segmentMapPoints, vecLerp, vecNormalize, vecSub, type Segment, type Vec } from '../../geometry';
import type { Apex, CutInstruction, Dart, Notch, Piece } from '../piece-schema';
import { pieceSchema } from '../piece-schema';
import { DRAFT_RULES, type BlockFrame } from './block-frame';
import { cubicByTangents, line } from './outline-build';

export type BustDartPlacement = 'shoulder' | 'side';

export const FRONT_BUST_POINT_ID = 'bust-point';
export const FRONT_BUST_DART_ID = 'bust-dart';
export const FRONT_WAIST_DART_ID = 'front-waist-dart';

const right: Vec = { x: 1, y: 0 };
const down: Vec = { x: 0, y: 1 };
const up: Vec = { x: 0, y: -1 };

/** Front neckline: leaves centre front square (horizontal), reaches the side neck point going up. */
export function frontNeckline(f: BlockFrame): Segment {
	return cubicByTangents(f.front.neckPoint, right, f.front.sideNeckPoint, up, 0.45, 0.45);
}

/** The front armhole in the shoulder-dart state: shoulder point → across point → underarm. */
export function frontArmhole(f: BlockFrame): [Segment, Segment] {
	const F = f.front;
	const perp = { x: -F.shoulderOutDir.y, y: F.shoulderOutDir.x }; // square off the shoulder, into the piece
	const a = cubicByTangents(F.shoulderPoint, perp, F.acrossPoint, F.acrossTangent, 0.35, 0.35);
	const b = cubicByTangents(F.acrossPoint, F.acrossTangent, F.underarm, right, 0.45, 0.5);
	return [a, b];
}

/**
 * Outline segments of the front with the bust dart at the shoulder, in outline order:
 * neck, shoulder to dart, dart legs to BP, outer shoulder, armhole (2), side seam (2), waist with its
 * dart, centre front.
 */
export function frontShoulderDartSegments(f: BlockFrame): Segment[] {
	const F = f.front;
	const bp = f.bustPoint;
	const [arm1, arm2] = frontArmhole(f);
	return [
		frontNeckline(f),
		line(F.sideNeckPoint, F.dartLeg1),
		line(F.dartLeg1, bp),
		line(bp, F.dartLeg2),
		line(F.dartLeg2, F.shoulderPoint),
		arm1,
		arm2,
		line(F.underarm, F.sideBust),
		line(F.sideBust, F.sideWaist),
		line(F.sideWaist, F.waistDartLeg1),
		line(F.waistDartLeg1, bp),
		line(bp, F.waistDartLeg2),
		line(F.waistDartLeg2, F.centreWaist),
		line(F.centreWaist, F.neckPoint)
	];
}

export interface FrontGeometry {
	readonly segments: Segment[];
	readonly bustDart: { leg1End: Vec; leg2End: Vec };
	readonly acrossPoint: Vec;
	/** Side seam leg end of a side dart (fixed part), when the dart is at the side. */
	readonly sideDartPoint?: Vec;
}

/**
 * Front geometry for a dart placement. The side dart is obtained from the shoulder dart by a rigid
 * pivot about the bust point: the chain from the outer shoulder leg down the armhole to the side
 * dart point turns by −θ, which closes the shoulder dart and opens the same angle at the side.
 */
export function frontGeometry(f: BlockFrame, placement: BustDartPlacement): FrontGeometry {
	const F = f.front;
	const bp = f.bustPoint;
	if (placement === 'shoulder') {
		return { segments: frontShoulderDartSegments(f), bustDart: { leg1End: F.dartLeg1, leg2End: F.dartLeg2 }, acrossPoint: F.acrossPoint };
	}
	const s = vecLerp(F.sideBust, F.underarm, DRAFT_RULES.sideDartPositionFraction);
	const turn = (p: Vec) => pointRotateAbout(p, bp, -f.bustDartAngleRad);
	const [arm1, arm2] = frontArmhole(f);
	const sTurned = turn(s);
	const segments: Segment[] = [
		frontNeckline(f),
		line(F.sideNeckPoint, F.shoulderPointClosed),
		segmentMapPoints(arm1, turn),
		segmentMapPoints(arm2, turn),
		line(turn(F.underarm), sTurned),
		line(sTurned, bp),
		line(bp, s),
		line(s, F.sideBust),
		line(F.sideBust, F.sideWaist),
		line(F.sideWaist, F.waistDartLeg1),
		line(F.waistDartLeg1, bp),
		line(bp, F.waistDartLeg2),
		line(F.waistDartLeg2, F.centreWaist),
		line(F.centreWaist, F.neckPoint)
	];
	// The closed shoulder is one straight line: make the shared points identical.
	return { segments, bustDart: { leg1End: sTurned, leg2End: s }, acrossPoint: turn(F.acrossPoint), sideDartPoint: s };
}

export interface FrontPieceOptions {
	readonly bustDart: BustDartPlacement;
	readonly cut: Extract<CutInstruction, 'on_fold' | 'pair'>;
	readonly id: string;
	readonly name: string;
}

/** The front bodice block as a Piece (block darts: both wedges cut to the bust point). */
export function frontPiece(f: BlockFrame, o: FrontPieceOptions): Piece {
	const F = f.front;
	const g = frontGeometry(f, o.bustDart);
	const bp = f.bustPoint;
	const apexes: Apex[] = [{ id: FRONT_BUST_POINT_ID, kind: 'bust_point', label: 'BP', point: bp }];
	const darts: Dart[] = [
		{ id: FRONT_BUST_DART_ID, apexId: FRONT_BUST_POINT_ID, leg1End: g.bustDart.leg1End, leg2End: g.bustDart.leg2End, movingLeg: 'leg2' },
		{ id: FRONT_WAIST_DART_ID, apexId: FRONT_BUST_POINT_ID, leg1End: F.waistDartLeg1, leg2End: F.waistDartLeg2, movingLeg: 'leg2' }
	];
	const notches: Notch[] = [
		{ id: 'front-armhole', at: g.acrossPoint, count: 1 },
		{ id: 'front-side-bust', at: F.sideBust, count: 1 }
	];
	const grainX = F.waistDartLeg2.x / 2;
	const piece = {
		schemaVersion: 1 as const,
		id: o.id,
		name: o.name,
		outline: { segments: g.segments },
		apexes,
		darts,
		notches,
		grainline: { from: { x: grainX, y: f.frontNeckY + 40 }, to: { x: grainX, y: f.waistY - 30 }, arrowheads: 'both' as const },
		foldLine: o.cut === 'on_fold' ? { from: F.neckPoint, to: F.centreWaist } : null,
		labels: [
			{ id: 'name', text: o.name, at: { x: (F.waistDartLeg1.x + F.sideWaist.x) / 2, y: (f.bustY + f.waistY) / 2 }, angleRad: -Math.PI / 2 },
			{
				id: 'cut',
				text: o.cut === 'on_fold' ? 'Cut 1 on fold (centre front)' : 'Cut 2 (a pair)',
				at: { x: grainX + 12, y: (f.bustY + f.waistY) / 2 },
				angleRad: -Math.PI / 2
			},
			{ id: 'centre', text: 'CF', at: { x: 8, y: (f.frontNeckY + f.waistY) / 2 }, angleRad: -Math.PI / 2 }
		],
		cut: o.cut
	};
	void vecNormalize;
	void vecSub;
	void down;
	return piecePressByPractice(pieceSchema.parse(piece));
}
