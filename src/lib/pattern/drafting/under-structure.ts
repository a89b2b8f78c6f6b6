import {
	outlineArea,
	pointRotateAbout,
	polygonSignedArea,
	segmentMapPoints,
	vecAdd,
	vecAngleBetween,
	vecLerp,
	vecNormalize,
	vecScale,
	vecSub,
	type Segment,
	type Vec
} from '../../geometry';
import type { MeasurementsMm } from '../measurements/measurement-set';
import type { Piece } from '../piece-schema';
import { pieceSchema } from '../piece-schema';
import { blockFrame, type BlockFrame } from './block-frame';
import { frontArmhole, frontNeckline, frontShoulderDartSegments } from './block-front';
import { draftCautions, EASE_DEFAULT, type DraftCaution, type Ease } from './ease';
import { line } from './outline-build';

/**
 * Boned under-structure of 4 or 6 front panels (reference-values row 16, CP). "4 panels" / "6
 * panels" count the whole front: one half front is cut into 2 or 3 panels, each cut as a pair.
 * Geometry (README.md, "Under-structure"):
 *  1. Draft the front block (bust dart at the shoulder) and pivot the whole bust dart into the
 *     front waist dart (rigid turn about BP): all the front shaping Γ = bust dart + waist dart is
 *     now one wedge at BP opening to the waist.
 *  2. Seam A runs from the bust dart's old shoulder leg end straight down to BP, then down the legs of
 *     that wedge to the waist. Divergence point D_A = BP.
 *  3. (6 panels) Half of Γ (rule of thumb) is moved into a second wedge on the waist, further to the
 *     side, by turning the strip of waist between the two mouths about BP (rigid); that second wedge's
 *     point is then pulled back along its centre line to D_B, 25 mm from BP (rule of thumb, inside
 *     the ~38 mm of row 14, S). Seam B runs from the across-front point of the armhole straight to D_B,
 *     then down that wedge's legs.
 * Adjacent panels laid together along their lower seam edges (waist → D) coincide there; above D
 * their seam edges (identical on the flat pieces) separate as a wedge with apex D and angle equal to
 * the wedge angle at D.
 */
export interface UnderStructureOptions {
	readonly panels: 4 | 6;
	readonly idPrefix?: string;
	readonly nameSuffix?: string;
}

export interface SeamEdges {
	/** From the waist up to the divergence point. */
	readonly lower: readonly [Vec, Vec];
	/** From the divergence point up to the top edge. */
	readonly upper: readonly [Vec, Vec];
}

export interface UnderStructureSeam {
	readonly id: string;
	/** Panel nearer centre front. */
	readonly leftPanelId: string;
	/** Panel nearer the side. */
	readonly rightPanelId: string;
	readonly divergencePoint: Vec;
	/** Apex id of the divergence point (same id on both panels). */
	readonly divergenceApexId: string;
	/** Angle of the wedge at D when the panels are laid together along their lower edges. */
	readonly wedgeAngleRad: number;
	readonly left: SeamEdges;
	readonly right: SeamEdges;
}

export interface UnderStructureReport {
	/** Total front shaping angle at BP of the block (bust dart + front waist dart). */
	readonly totalShapingRad: number;
	/** Area of the front block outline (the block outside its darts). */
	readonly frontBlockAreaMm2: number;
	readonly panelAreaSumMm2: number;
	/** Cloth added when the second wedge's point is pulled back from BP to D_B (0 for 4 panels). */
	readonly pullBackAreaMm2: number;
	readonly areaRelation: string;
	readonly rules: string[];
	readonly cautions: DraftCaution[];
}

export interface UnderStructureDraft {
	readonly panels: Piece[];
	readonly seams: UnderStructureSeam[];
	/** The front block with all its shaping pivoted into the waist wedge (step 1). */
	readonly frontAllAtWaist: Piece;
	readonly report: UnderStructureReport;
}

export const UNDER_STRUCTURE_RULES = {
	/** Share of Γ moved to seam B in the 6-panel version (M). */
	seamBShare: 0.5,
	/** Where seam B's wedge opens on the waist, from seam A's mouth toward the side (M). */
	seamBWaistFraction: 0.4,
	/** D_B pulled back from BP along the second wedge's centre line (M; row 14: within ~38 mm, S). */
	seamBPullBackMm: 25
} as const;

function triangleArea(a: Vec, b: Vec, c: Vec): number {
	return Math.abs(polygonSignedArea([a, b, c]));
}

function panelPiece(
	id: string,
	name: string,
	segments: Segment[],
	apexes: { id: string; point: Vec; label: string }[],
	grain: { x: number; yBottom: number; lengthMm: number },
	notches: { id: string; at: Vec }[],
	centreLabelAt?: Vec
): Piece {
	return pieceSchema.parse({
		schemaVersion: 1,
		id,
		name,
		outline: { segments },
		apexes: apexes.map((a) => ({ ...a, kind: 'divergence' })),
		notches: notches.map((n) => ({ ...n, count: 1 })),
		grainline: { from: { x: grain.x, y: grain.yBottom - grain.lengthMm }, to: { x: grain.x, y: grain.yBottom }, arrowheads: 'both' },
		labels: [
			{ id: 'name', text: `${name} — cut 2 (a pair)`, at: { x: grain.x + 8, y: grain.yBottom - grain.lengthMm / 2 }, angleRad: -Math.PI / 2 },
			// the centre front marked as on the block, so moves keep it still and press darts toward it
			...(centreLabelAt ? [{ id: 'centre', text: 'CF', at: centreLabelAt, angleRad: -Math.PI / 2 }] : [])
		],
		cut: 'pair'
	});
}

const mid = (a: Vec, b: Vec) => vecLerp(a, b, 0.5);

export function underStructureDraft(measurements: MeasurementsMm, ease: Ease = EASE_DEFAULT, options: UnderStructureOptions = { panels: 4 }): UnderStructureDraft {
	const f: BlockFrame = blockFrame(measurements, ease);
	const F = f.front;
	const bp = f.bustPoint;
	const prefix = options.idPrefix ?? 'under';
	const suffix = options.nameSuffix ? `, ${options.nameSuffix}` : '';
	const R = UNDER_STRUCTURE_RULES;

	// Step 1: pivot the bust dart into the waist dart.
	const turn = (p: Vec) => pointRotateAbout(p, bp, -f.bustDartAngleRad);
	const [arm1, arm2] = frontArmhole(f).map((s) => segmentMapPoints(s, turn));
	const sp0 = F.shoulderPointClosed;
	const u0 = turn(F.underarm);
	const sb0 = turn(F.sideBust);
	const c0 = turn(F.sideWaist);
	const w2 = turn(F.waistDartLeg1);
	const w1 = F.waistDartLeg2;
	const d1 = F.dartLeg1;
	const a0 = arm1.kind === 'cubic' ? arm1.p3 : arm1.p1;
	const neck = frontNeckline(f);
	const allAtWaistSegments: Segment[] = [
		neck,
		line(F.sideNeckPoint, d1),
		line(d1, sp0),
		arm1,
		arm2,
		line(u0, sb0),
		line(sb0, c0),
		line(c0, w2),
		line(w2, bp),
		line(bp, w1),
		line(w1, F.centreWaist),
		line(F.centreWaist, F.neckPoint)
	];
	const frontAllAtWaist = pieceSchema.parse({
		schemaVersion: 1,
		id: `${prefix}-front-shaping-at-waist`,
		name: `Front block, shaping at the waist${suffix}`,
		outline: { segments: allAtWaistSegments },
		apexes: [{ id: 'bust-point', kind: 'bust_point', label: 'BP', point: bp }],
		darts: [{ id: 'waist-dart', apexId: 'bust-point', leg1End: w2, leg2End: w1 }],
		cut: 'on_fold'
	});
	const gammaSigned = vecAngleBetween(vecSub(w2, bp), vecSub(w1, bp));
	const gamma = Math.abs(gammaSigned);

	const frontBlockAreaMm2 = outlineArea({ segments: frontShoulderDartSegments(f) });
	const idA = 'divergence-a';
	const idB = 'divergence-b';
	const cfId = `${prefix}-panel-cf`;
	const cfPanel = panelPiece(
		cfId,
		`Under-structure centre front panel${suffix}`,
		[neck, line(F.sideNeckPoint, d1), line(d1, bp), line(bp, w1), line(w1, F.centreWaist), line(F.centreWaist, F.neckPoint)],
		[{ id: idA, point: bp, label: 'D (seam A)' }],
		{ x: w1.x / 2, yBottom: f.waistY - 20, lengthMm: 0.6 * (f.waistY - f.frontNeckY) },
		[{ id: 'seam-a-lower', at: mid(w1, bp) }],
		{ x: 8, y: (f.frontNeckY + f.waistY) / 2 }
	);
	const panels: Piece[] = [cfPanel];
	const seams: UnderStructureSeam[] = [];
	let pullBackAreaMm2 = 0;
	const grainBottom = (a: Vec, b: Vec) => Math.min(a.y, b.y) - 20;
	const grainLength = 0.3 * (f.waistY - f.bustY);

	if (options.panels === 4) {
		const sideId = `${prefix}-panel-side`;
		panels.push(
			panelPiece(
				sideId,
				`Under-structure side front panel${suffix}`,
				[line(d1, sp0), arm1, arm2, line(u0, sb0), line(sb0, c0), line(c0, w2), line(w2, bp), line(bp, d1)],
				[{ id: idA, point: bp, label: 'D (seam A)' }],
				{ x: (w2.x + c0.x) / 2, yBottom: grainBottom(w2, c0), lengthMm: grainLength },
				[{ id: 'seam-a-lower', at: mid(w2, bp) }]
			)
		);
		seams.push({
			id: 'seam-a',
			leftPanelId: cfId,
			rightPanelId: sideId,
			divergencePoint: bp,
			divergenceApexId: idA,
			wedgeAngleRad: gamma,
			left: { lower: [w1, bp], upper: [bp, d1] },
			right: { lower: [w2, bp], upper: [bp, d1] }
		});
	} else {
		// Step 3: split off a share of Γ into a second wedge on the waist, then pull its point back.
		const psi = gamma * R.seamBShare;
		const s = vecLerp(w2, c0, R.seamBWaistFraction);
		const rot = (p: Vec) => pointRotateAbout(p, bp, Math.sign(gammaSigned) * psi);
		const w2r = rot(w2);
		const sr = rot(s);
		const bis = vecNormalize(vecAdd(vecNormalize(vecSub(s, bp)), vecNormalize(vecSub(sr, bp))));
		const db = vecAdd(bp, vecScale(bis, R.seamBPullBackMm));
		pullBackAreaMm2 = triangleArea(bp, s, sr) - triangleArea(db, s, sr);
		const midId = `${prefix}-panel-middle`;
		const sideId = `${prefix}-panel-side`;
		panels.push(
			panelPiece(
				midId,
				`Under-structure middle front panel${suffix}`,
				[line(d1, sp0), arm1, line(a0, db), line(db, sr), line(sr, w2r), line(w2r, bp), line(bp, d1)],
				[
					{ id: idA, point: bp, label: 'D (seam A)' },
					{ id: idB, point: db, label: 'D (seam B)' }
				],
				{ x: (w2r.x + sr.x) / 2, yBottom: grainBottom(w2r, sr), lengthMm: grainLength * 0.6 },
				[
					{ id: 'seam-a-lower', at: mid(w2r, bp) },
					{ id: 'seam-b-lower', at: mid(sr, db) }
				]
			),
			panelPiece(
				sideId,
				`Under-structure side front panel${suffix}`,
				[arm2, line(u0, sb0), line(sb0, c0), line(c0, s), line(s, db), line(db, a0)],
				[{ id: idB, point: db, label: 'D (seam B)' }],
				{ x: (s.x + c0.x) / 2, yBottom: grainBottom(s, c0), lengthMm: grainLength },
				[{ id: 'seam-b-lower', at: mid(s, db) }]
			)
		);
		seams.push(
			{
				id: 'seam-a',
				leftPanelId: cfId,
				rightPanelId: midId,
				divergencePoint: bp,
				divergenceApexId: idA,
				wedgeAngleRad: Math.abs(vecAngleBetween(vecSub(w1, bp), vecSub(w2r, bp))),
				left: { lower: [w1, bp], upper: [bp, d1] },
				right: { lower: [w2r, bp], upper: [bp, d1] }
			},
			{
				id: 'seam-b',
				leftPanelId: midId,
				rightPanelId: sideId,
				divergencePoint: db,
				divergenceApexId: idB,
				wedgeAngleRad: Math.abs(vecAngleBetween(vecSub(sr, db), vecSub(s, db))),
				left: { lower: [sr, db], upper: [db, a0] },
				right: { lower: [s, db], upper: [db, a0] }
			}
		);
	}

	const panelAreaSumMm2 = panels.reduce((sum, p) => sum + outlineArea(p.outline), 0);
	return {
		panels,
		seams,
		frontAllAtWaist,
		report: {
			totalShapingRad: gamma,
			frontBlockAreaMm2,
			panelAreaSumMm2,
			pullBackAreaMm2,
			areaRelation:
				options.panels === 4
					? 'Panels are the front block cut along its darts after a rigid pivot: their areas sum exactly to the block area outside the darts.'
					: 'Panel areas sum to the block area outside the darts plus the small cloth added when seam B’s wedge point is pulled back from BP to D_B (pullBackAreaMm2); every other step is rigid.',
			rules: [
				'Under-structure of 4 or 6 front panels (common practice, row 16, CP); the count is for the whole front, 2 or 3 panels per half, each cut as a pair.',
				`6 panels: ${R.seamBShare * 100} % of the front shaping goes to seam B (M); seam B opens on the waist ${R.seamBWaistFraction * 100} % of the way from seam A to the side (M); D_B is ${R.seamBPullBackMm} mm from BP (M; panel seams within ~38 mm of BP, row 14, S).`,
				'Seam A reaches the shoulder where the block’s bust dart was; seam B reaches the armhole at the across-front notch (M).'
			],
			cautions: draftCautions(ease, { waistMm: f.m.waist })
		}
	};
}
