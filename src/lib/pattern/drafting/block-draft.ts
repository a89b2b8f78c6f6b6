import { vecDistance } from '../../geometry';
import type { MeasurementsMm } from '../measurements/measurement-set';
import { derivationRuleFor } from '../measurements/derived';
import type { MeasurementId } from '../measurements/measurement-ids';
import type { Piece } from '../piece-schema';
import { backPiece } from './block-back';
import { blockFrame, DRAFT_RULES, type BlockFrame } from './block-frame';
import { frontPiece, type BustDartPlacement } from './block-front';
import { BUST_DART_REFERENCE_BUST_MM, dartClearanceNote, dartClearanceSuggestionMm } from './bust-dart';
import { draftCautions, EASE_DEFAULT, EASE_SOURCE, type DraftCaution, type Ease } from './ease';

export interface BlockDraftOptions {
	/** Where the bust dart of the block sits. Default 'shoulder'. */
	readonly bustDart?: BustDartPlacement;
	/** Centre front on the fold (default) or cut as a pair with a centre front seam. */
	readonly frontCut?: 'on_fold' | 'pair';
	/** Centre back seam, cut as a pair (default), or on the fold. */
	readonly backCut?: 'pair' | 'on_fold';
	/** Prefix for piece ids (default 'bodice'). */
	readonly idPrefix?: string;
	/** Added to piece names, e.g. "size 12". */
	readonly nameSuffix?: string;
}

export interface UsedMeasurement {
	readonly id: MeasurementId;
	readonly valueMm: number;
	readonly derived: boolean;
	readonly rule?: string;
}

export interface BlockDraftReport {
	readonly method: string;
	readonly measurementsUsed: UsedMeasurement[];
	readonly ease: Ease & { readonly source: string };
	readonly bustDart: {
		readonly placement: BustDartPlacement;
		readonly intakeAtShoulderMm: number;
		readonly legLengthMm: number;
		readonly angleRad: number;
		readonly source: string;
	};
	/** Half-body widths (mm), darts closed. Doubled they give the drafted girths. */
	readonly widths: {
		readonly frontBustMm: number;
		readonly backBustMm: number;
		readonly frontWaistMm: number;
		readonly backWaistMm: number;
		readonly draftedBustGirthMm: number;
		readonly draftedWaistGirthMm: number;
	};
	readonly suppression: { readonly sideSeamEachMm: number; readonly frontWaistDartMm: number; readonly backWaistDartMm: number; readonly rule: string };
	readonly seams: {
		readonly frontSideSeamMm: number;
		readonly backSideSeamMm: number;
		readonly frontShoulderMm: number;
		/** Sewn back shoulder (dart closed) — equals the front shoulder. */
		readonly backShoulderSewnMm: number;
		/** Back shoulder ease taken out by the back shoulder dart. */
		readonly backShoulderDartIntakeMm: number;
	};
	readonly dartClearanceSuggestionMm: number;
	readonly dartClearanceNote: string;
	readonly rulesOfThumb: string[];
	readonly warnings: string[];
	readonly cautions: DraftCaution[];
}

export interface BlockDraft {
	readonly front: Piece;
	readonly back: Piece;
	readonly report: BlockDraftReport;
}

const USED: MeasurementId[] = [
	'bust',
	'underbust',
	'waist',
	'neck_base',
	'back_length',
	'armhole_depth',
	'shoulder_length',
	'across_back',
	'across_front',
	'bust_point_separation',
	'shoulder_to_bust_point'
];

export const BLOCK_METHOD =
	'Fitted bodice block after the metric block method (W. Aldrich, Metric Pattern Cutting for Women’s Wear, 5th ed., 2008, as far as its published numbers reach us: bust dart 70 mm at 88 cm bust, ± 6 mm per 4 cm); other proportions are our rules of thumb (M). See src/lib/pattern/drafting/README.md.';

export function blockRulesOfThumb(): string[] {
	const R = DRAFT_RULES;
	const deg = (r: number) => ((r * 180) / Math.PI).toFixed(0);
	return [
		`Front is ${R.frontBackOffsetMm} mm wider than a quarter of the drafted bust, back ${R.frontBackOffsetMm} mm narrower (M).`,
		`Waist suppression per half body: ${R.suppressionShare.sideEach * 100} % at each side seam, ${R.suppressionShare.frontDart * 100} % front waist dart, ${R.suppressionShare.backDart * 100} % back waist dart (M).`,
		`Neck width: neck base / 5 − 2 mm; front neck depth: neck base / 5 + 8 mm below the side neck point; side neck point ${R.neckRiseMm} mm above the nape (M).`,
		`Shoulder slopes below horizontal: back ${deg(R.backShoulderSlopeRad)}°, front ${deg(R.frontShoulderSlopeRad)}° with the bust dart closed (M).`,
		`Bust dart leg end at ${R.shoulderDartPositionFraction * 100} % of the shoulder from the neck (M).`,
		`Back shoulder dart ${R.backShoulderDartIntakeMm} mm intake, ${R.backShoulderDartLengthMm} mm long, at mid shoulder (M); back waist dart at a quarter of the across back, its pivot on the bust line (M).`,
		`Back darts pivot ${R.backDartPivotBeyondTipMm} mm beyond their tips on the dart centre line (row 12, S).`,
		`Across front and across back are placed halfway between shoulder point and underarm level, measured with darts closed (M).`
	];
}

function used(measurements: MeasurementsMm, f: BlockFrame): UsedMeasurement[] {
	return USED.map((id): UsedMeasurement => {
		const given = measurements[id];
		if (given !== undefined) return { id, valueMm: given, derived: false };
		return { id, valueMm: f.m[id] as number, derived: true, rule: derivationRuleFor(id)?.text };
	});
}

/**
 * Draft the fitted bodice block, front and back half pieces, from body measurements (mm) and ease
 * (mm, whole girth). Pure: data in, data out. Missing measurements are derived by stated rules of
 * thumb (reported as derived). Needs at least the bust girth.
 */
export function blockDraft(measurements: MeasurementsMm, ease: Ease = EASE_DEFAULT, options: BlockDraftOptions = {}): BlockDraft {
	const placement = options.bustDart ?? 'shoulder';
	const prefix = options.idPrefix ?? 'bodice';
	const suffix = options.nameSuffix ? `, ${options.nameSuffix}` : '';
	const f = blockFrame(measurements, ease);
	const front = frontPiece(f, {
		bustDart: placement,
		cut: options.frontCut ?? 'on_fold',
		id: `${prefix}-front`,
		name: `Bodice block front${suffix}`
	});
	const back = backPiece(f, { cut: options.backCut ?? 'pair', id: `${prefix}-back`, name: `Bodice block back${suffix}` });

	const F = f.front;
	const B = f.back;
	const frontSide = vecDistance(F.underarm, F.sideBust) + vecDistance(F.sideBust, F.sideWaist);
	const backSide = vecDistance(B.underarm, B.sideBust) + vecDistance(B.sideBust, B.sideWaist);
	const frontShoulder =
		placement === 'shoulder'
			? vecDistance(F.sideNeckPoint, F.dartLeg1) + vecDistance(F.dartLeg2, F.shoulderPoint)
			: vecDistance(F.sideNeckPoint, F.shoulderPointClosed);
	const backShoulderSewn = vecDistance(B.sideNeckPoint, B.shoulderDartLeg1) + vecDistance(B.shoulderDartLeg2, B.shoulderPoint);
	const underbust = f.m.underbust;

	const report: BlockDraftReport = {
		method: BLOCK_METHOD,
		measurementsUsed: used(measurements, f),
		ease: { ...ease, source: EASE_SOURCE },
		bustDart: {
			placement,
			intakeAtShoulderMm: f.bustDartIntakeMm,
			legLengthMm: f.bustDartLegMm,
			angleRad: f.bustDartAngleRad,
			source: `Metric block method: 70 mm at ${BUST_DART_REFERENCE_BUST_MM / 10} cm bust, ± 6 mm per 4 cm (Aldrich 5th ed. 2008, via a published tutorial); angle θ = 2·asin(w/2r).`
		},
		widths: {
			frontBustMm: f.frontBustWidthMm,
			backBustMm: f.backBustWidthMm,
			frontWaistMm: f.frontWaistWidthMm,
			backWaistMm: f.backWaistWidthMm,
			draftedBustGirthMm: 2 * (f.frontBustWidthMm + f.backBustWidthMm),
			draftedWaistGirthMm: 2 * (f.frontWaistWidthMm + f.backWaistWidthMm)
		},
		suppression: {
			sideSeamEachMm: f.sideSuppressionMm,
			frontWaistDartMm: f.frontWaistDartIntakeMm,
			backWaistDartMm: f.backWaistDartIntakeMm,
			rule: 'Per half body, bust width minus waist width, shared 20 % / 20 % side seams, 25 % front dart, 35 % back dart (rule of thumb, M).'
		},
		seams: {
			frontSideSeamMm: frontSide,
			backSideSeamMm: backSide,
			frontShoulderMm: frontShoulder,
			backShoulderSewnMm: backShoulderSewn,
			backShoulderDartIntakeMm: DRAFT_RULES.backShoulderDartIntakeMm
		},
		dartClearanceSuggestionMm: dartClearanceSuggestionMm(f.m.bust, underbust),
		dartClearanceNote: dartClearanceNote(f.m.bust, underbust),
		rulesOfThumb: blockRulesOfThumb(),
		warnings: [...f.warnings],
		cautions: draftCautions(ease, { waistMm: f.m.waist })
	};
	return { front, back, report };
}
