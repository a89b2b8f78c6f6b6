import { pointRotateAbout, vecAdd, vecDistance, vecScale, vecSub, type Vec } from '../../geometry';
import { measurementsMmWithDerived } from '../measurements/derived';
import type { MeasurementsMm } from '../measurements/measurement-set';
import { bustDartIntakeMm, dartAngleRad } from './bust-dart';
import type { Ease } from './ease';

/**
 * The shared construction of the fitted bodice block (front and back in ONE frame: x from the centre
 * line toward the side seam, y down, nape at y = 0, waist line at y = back length). See README.md for
 * the method step by step. Every constant below marked "M" is a rule of thumb of ours.
 */
export const DRAFT_RULES = {
	/** Neck rise: side neck point above the nape level (M). */
	neckRiseMm: 20,
	/** Back and front neck width: neck base / 5 − 2 mm (M). */
	neckWidthFraction: 1 / 5,
	neckWidthOffsetMm: -2,
	/** Front neck depth below the side neck point: neck base / 5 + 8 mm (M). */
	frontNeckDepthOffsetMm: 8,
	/** Shoulder slope below the horizontal, back and front (dart closed) (M). */
	backShoulderSlopeRad: (18 * Math.PI) / 180,
	frontShoulderSlopeRad: (22 * Math.PI) / 180,
	/** Front is wider than a quarter of the drafted bust by this much, back narrower (M). */
	frontBackOffsetMm: 10,
	/** Share of the waist suppression per half body: each side seam, front dart, back dart (M). */
	suppressionShare: { sideEach: 0.2, frontDart: 0.25, backDart: 0.35 },
	/** Back shoulder dart: intake, sewn length, at the middle of the sewn shoulder (M). */
	backShoulderDartIntakeMm: 10,
	backShoulderDartLengthMm: 80,
	/** Back darts pivot this far beyond the sewn tip on the centre line (row 12, S). */
	backDartPivotBeyondTipMm: 38,
	/** Back waist dart centre: a quarter of the across back from centre back (M). */
	backWaistDartXFraction: 0.25,
	/** Bust dart leg end on the shoulder: at half the shoulder length from the neck (M). */
	shoulderDartPositionFraction: 0.5,
	/** Least vertical distance kept between the underarm line and the bust line (M). */
	minUnderarmToBustMm: 15,
	/** Side dart option: leg end on the side seam halfway between underarm and bust line (M). */
	sideDartPositionFraction: 0.5
} as const;

export interface BlockFrame {
	readonly m: ReturnType<typeof measurementsMmWithDerived>;
	readonly ease: Ease;
	readonly warnings: string[];
	readonly waistY: number;
	readonly underarmY: number;
	readonly bustY: number;
	readonly neckRiseMm: number;
	readonly neckWidthMm: number;
	readonly frontNeckY: number;
	/** Half-body widths at the bust line (darts closed). */
	readonly frontBustWidthMm: number;
	readonly backBustWidthMm: number;
	/** Half-body cloth widths at the waist (darts closed). */
	readonly frontWaistWidthMm: number;
	readonly backWaistWidthMm: number;
	readonly sideSuppressionMm: number;
	readonly frontWaistDartIntakeMm: number;
	readonly backWaistDartIntakeMm: number;
	readonly bustPoint: Vec;
	readonly bustDartIntakeMm: number;
	readonly bustDartAngleRad: number;
	readonly bustDartLegMm: number;
	/** Front points, bust dart at the shoulder. */
	readonly front: {
		readonly neckPoint: Vec; // centre front neck
		readonly sideNeckPoint: Vec;
		readonly dartLeg1: Vec;
		readonly dartLeg2: Vec;
		readonly shoulderPoint: Vec;
		readonly shoulderPointClosed: Vec;
		readonly acrossPoint: Vec;
		readonly acrossPointClosed: Vec;
		readonly acrossTangent: Vec; // unit, downward along the armhole, open state
		readonly shoulderOutDir: Vec; // unit, along the outer shoulder, open state
		readonly underarm: Vec;
		readonly sideBust: Vec;
		readonly sideWaist: Vec;
		readonly waistDartLeg1: Vec; // side-side leg end (first in outline order)
		readonly waistDartLeg2: Vec;
		readonly centreWaist: Vec;
	};
	readonly back: {
		readonly neckPoint: Vec; // nape
		readonly sideNeckPoint: Vec;
		readonly shoulderDartLeg1: Vec;
		readonly shoulderDartLeg2: Vec;
		readonly shoulderDartTip: Vec;
		readonly shoulderDartPivot: Vec;
		readonly shoulderPoint: Vec;
		readonly shoulderDir: Vec;
		readonly acrossPoint: Vec;
		readonly underarm: Vec;
		readonly sideBust: Vec;
		readonly sideWaist: Vec;
		readonly waistDartLeg1: Vec;
		readonly waistDartLeg2: Vec;
		readonly waistDartTip: Vec;
		readonly waistDartPivot: Vec;
		readonly centreWaist: Vec;
	};
}

const v = (x: number, y: number): Vec => ({ x, y });

/** x where the straight line through a and b crosses the level y. */
function xAtY(a: Vec, b: Vec, y: number): number {
	return a.x + ((b.x - a.x) * (y - a.y)) / (b.y - a.y);
}

/** Opening of the wedge (apex, leg1End, leg2End) along the horizontal line at y, 0 if the line misses. */
export function wedgeGapAtY(apex: Vec, leg1End: Vec, leg2End: Vec, y: number): number {
	const within = (e: Vec) => (y - apex.y) * (y - e.y) <= 0 && e.y !== apex.y;
	if (!within(leg1End) || !within(leg2End)) return 0;
	return Math.abs(xAtY(apex, leg2End, y) - xAtY(apex, leg1End, y));
}

export function blockFrame(measurements: MeasurementsMm, ease: Ease): BlockFrame {
	const R = DRAFT_RULES;
	const m = measurementsMmWithDerived(measurements);
	const warnings: string[] = [];

	const waistY = m.back_length;
	const neckWidthMm = m.neck_base * R.neckWidthFraction + R.neckWidthOffsetMm;
	const snpY = -R.neckRiseMm;
	const frontNeckY = snpY + m.neck_base * R.neckWidthFraction + R.frontNeckDepthOffsetMm;

	// Bust point: half the separation from centre front, at the side-neck-to-bust-point distance.
	const bpX = m.bust_point_separation / 2;
	const dx = bpX - neckWidthMm;
	const bustY = snpY + Math.sqrt(Math.max(0, m.shoulder_to_bust_point ** 2 - dx * dx));
	let underarmY = m.armhole_depth;
	if (underarmY > bustY - R.minUnderarmToBustMm) {
		underarmY = bustY - R.minUnderarmToBustMm;
		warnings.push(
			`Armhole depth moved up to ${underarmY.toFixed(0)} mm so that the underarm line stays ${R.minUnderarmToBustMm} mm above the bust line.`
		);
	}
	if (bustY > waistY - 60) warnings.push('The bust point is less than 60 mm above the waist line: check back length and side neck point to bust point.');
	const bustPoint = v(bpX, bustY);

	// Widths.
	const quarter = (m.bust + ease.bustMm) / 4;
	const frontBustWidthMm = quarter + R.frontBackOffsetMm;
	const backBustWidthMm = quarter - R.frontBackOffsetMm;
	const halfWaist = (m.waist + ease.waistMm) / 2;
	const suppression = frontBustWidthMm + backBustWidthMm - halfWaist;
	if (suppression < 0) warnings.push('The waist with ease is larger than the bust with ease: no waist shaping is drafted.');
	const S = Math.max(0, suppression);
	const sideSuppressionMm = S * R.suppressionShare.sideEach;
	const frontWaistDartIntakeMm = S * R.suppressionShare.frontDart;
	const backWaistDartIntakeMm = S * R.suppressionShare.backDart;
	const frontWaistWidthMm = frontBustWidthMm - sideSuppressionMm - frontWaistDartIntakeMm;
	const backWaistWidthMm = backBustWidthMm - sideSuppressionMm - backWaistDartIntakeMm;

	// ---- Front (bust dart at the shoulder).
	const fSnp = v(neckWidthMm, snpY);
	const fDir = v(Math.cos(R.frontShoulderSlopeRad), Math.sin(R.frontShoulderSlopeRad));
	const dartLeg1 = vecAdd(fSnp, vecScale(fDir, m.shoulder_length * R.shoulderDartPositionFraction));
	const bustDartLegMm = vecDistance(dartLeg1, bustPoint);
	const intake = bustDartIntakeMm(m.bust);
	const theta = dartAngleRad(intake, bustDartLegMm);
	const rot = (p: Vec) => pointRotateAbout(p, bustPoint, theta);
	const dartLeg2 = rot(dartLeg1);
	const shoulderPointClosed = vecAdd(fSnp, vecScale(fDir, m.shoulder_length));
	const shoulderPoint = rot(shoulderPointClosed);
	const shoulderOutDir = v(Math.cos(R.frontShoulderSlopeRad + theta), Math.sin(R.frontShoulderSlopeRad + theta));
	const fUnderarm = v(frontBustWidthMm, underarmY);
	// Across front, dart closed: the underarm seen in the dart-closed state fixes the level.
	const underarmClosed = pointRotateAbout(fUnderarm, bustPoint, -theta);
	const acrossPointClosed = v(m.across_front / 2, (shoulderPointClosed.y + underarmClosed.y) / 2);
	const acrossPoint = rot(acrossPointClosed);
	const acrossTangent = v(-Math.sin(theta), Math.cos(theta));
	const fSideBust = v(frontBustWidthMm, bustY);
	const fSideWaist = v(frontBustWidthMm - sideSuppressionMm, waistY);
	const front = {
		neckPoint: v(0, frontNeckY),
		sideNeckPoint: fSnp,
		dartLeg1,
		dartLeg2,
		shoulderPoint,
		shoulderPointClosed,
		acrossPoint,
		acrossPointClosed,
		acrossTangent,
		shoulderOutDir,
		underarm: fUnderarm,
		sideBust: fSideBust,
		sideWaist: fSideWaist,
		waistDartLeg1: v(bpX + frontWaistDartIntakeMm / 2, waistY),
		waistDartLeg2: v(bpX - frontWaistDartIntakeMm / 2, waistY),
		centreWaist: v(0, waistY)
	};

	// ---- Back.
	const bSnp = v(neckWidthMm, snpY);
	const bDir = v(Math.cos(R.backShoulderSlopeRad), Math.sin(R.backShoulderSlopeRad));
	const bInward = v(-bDir.y, bDir.x); // perpendicular, pointing into the piece (down)
	const bsdIntake = R.backShoulderDartIntakeMm;
	const bLeg1 = vecAdd(bSnp, vecScale(bDir, m.shoulder_length / 2));
	const bLeg2 = vecAdd(bLeg1, vecScale(bDir, bsdIntake));
	const bMid = vecAdd(bLeg1, vecScale(bDir, bsdIntake / 2));
	const bTip = vecAdd(bMid, vecScale(bInward, R.backShoulderDartLengthMm));
	const bPivot = vecAdd(bMid, vecScale(bInward, R.backShoulderDartLengthMm + R.backDartPivotBeyondTipMm));
	const bShoulderPoint = vecAdd(bSnp, vecScale(bDir, m.shoulder_length + bsdIntake));
	const bAcrossY = (bShoulderPoint.y + underarmY) / 2;
	const bAcrossX = m.across_back / 2 + wedgeGapAtY(bPivot, bLeg1, bLeg2, bAcrossY);
	const bwX = (m.across_back / 2) * R.backWaistDartXFraction * 2;
	const bwPivot = v(bwX, bustY);
	const back = {
		neckPoint: v(0, 0),
		sideNeckPoint: bSnp,
		shoulderDartLeg1: bLeg1,
		shoulderDartLeg2: bLeg2,
		shoulderDartTip: bTip,
		shoulderDartPivot: bPivot,
		shoulderPoint: bShoulderPoint,
		shoulderDir: bDir,
		acrossPoint: v(bAcrossX, bAcrossY),
		underarm: v(backBustWidthMm, underarmY),
		sideBust: v(backBustWidthMm, bustY),
		sideWaist: v(backBustWidthMm - sideSuppressionMm, waistY),
		waistDartLeg1: v(bwX + backWaistDartIntakeMm / 2, waistY),
		waistDartLeg2: v(bwX - backWaistDartIntakeMm / 2, waistY),
		waistDartTip: v(bwX, bustY + R.backDartPivotBeyondTipMm),
		waistDartPivot: bwPivot,
		centreWaist: v(0, waistY)
	};

	// Sanity of the construction (reported, never silently fixed).
	if (!(front.acrossPoint.x < front.underarm.x && front.acrossPoint.x < front.shoulderPoint.x)) {
		warnings.push('Front armhole: the across-front point is not inside the shoulder point and the underarm; check across front and bust.');
	}
	if (!(back.acrossPoint.x < back.underarm.x && back.acrossPoint.x < back.shoulderPoint.x)) {
		warnings.push('Back armhole: the across-back point is not inside the shoulder point and the underarm; check across back and bust.');
	}
	void vecSub;

	return {
		m,
		ease,
		warnings,
		waistY,
		underarmY,
		bustY,
		neckRiseMm: R.neckRiseMm,
		neckWidthMm,
		frontNeckY,
		frontBustWidthMm,
		backBustWidthMm,
		frontWaistWidthMm,
		backWaistWidthMm,
		sideSuppressionMm,
		frontWaistDartIntakeMm,
		backWaistDartIntakeMm,
		bustPoint,
		bustDartIntakeMm: intake,
		bustDartAngleRad: theta,
		bustDartLegMm,
		front,
		back
	};
}
