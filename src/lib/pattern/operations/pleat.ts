import { z } from 'zod';
import { vecAdd, vecDistance, vecLength, vecNormalize, vecScale, vecSub, type Vec } from '../kernel';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import { fmtDeg, fmtMm, refuse, succeed, type OperationResult } from '../operation-result';
import { apexById, dartById, wedgeGeometry } from '../piece';
import { legSideSchema, pleatKindSchema, vecSchema, type LegSide, type Piece, type Pleat } from '../piece-schema';
import { carryMarkings, rotationMotion } from './carry-markings';
import { type OpenedWedge } from './open-wedges';
import { openWedgesKeepingStill } from './still-side';
import { uniqueId } from './share';

/** Largest radius for substitute pivots round the apex (reference-values row 13, P: ≤ 25.4 mm). */
export const SUBSTITUTE_PIVOT_MAX_RADIUS_MM = 25.4;
export const PLEAT_MAX_COUNT = 12;

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });

export const pleatParamsSchema = z.object({
	dartId: z.string().min(1),
	/** One point on the seam per pleat. */
	at: z.array(vecSchema).min(1).max(PLEAT_MAX_COUNT),
	mode: z.enum(['equal_angle', 'equal_intake']),
	kind: pleatKindSchema.default('pleat'),
	/** Side each fold is laid toward; default by the customary rule (vertical → centre, horizontal → down). */
	foldToward: legSideSchema.optional(),
	/** Parallel pleats: substitute pivots on a circle of this radius round the apex. */
	parallel: z.object({ pivotRadiusMm: finite() }).optional(),
	/** Tucks: stitched length from the seam. */
	stitchLengthMm: finite().optional(),
	pleatIds: z.array(z.string().min(1)).optional()
});
export type PleatParams = z.input<typeof pleatParamsSchema>;

/** Equal intake: angles φᵢ with 2rᵢ·sin(φᵢ/2) the same for all i and Σφᵢ = θ (bisection on the intake). */
export function equalIntakeAngles(radiiMm: readonly number[], totalRad: number): number[] {
	const f = (w: number) => radiiMm.reduce((s, r) => s + 2 * Math.asin(Math.min(1, w / (2 * r))), 0) - totalRad;
	let lo = 0;
	let hi = 2 * Math.min(...radiiMm);
	for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
		const mid = (lo + hi) / 2;
		if (f(mid) > 0) hi = mid;
		else lo = mid;
	}
	const w = (lo + hi) / 2;
	const angles = radiiMm.map((r) => 2 * Math.asin(Math.min(1, w / (2 * r))));
	const sum = angles.reduce((s, a) => s + a, 0);
	return angles.map((a) => (a * totalRad) / sum);
}

function defaultFoldToward(piece: Piece, o: OpenedWedge, apex: Vec): { side: LegSide; note?: string } {
	const mid = vecScale(vecAdd(o.leg1End, o.leg2End), 0.5);
	const axis = vecSub(mid, apex);
	if (Math.abs(axis.x) > Math.abs(axis.y)) {
		// horizontal pleat: press downward (y grows downward)
		return { side: o.leg1End.y >= o.leg2End.y ? 'leg1' : 'leg2' };
	}
	if (piece.foldLine) {
		const a = piece.foldLine.from;
		const d = vecNormalize(vecSub(piece.foldLine.to, a));
		const dist = (p: Vec) => Math.abs((p.x - a.x) * d.y - (p.y - a.y) * d.x);
		return { side: dist(o.leg1End) <= dist(o.leg2End) ? 'leg1' : 'leg2' };
	}
	return { side: 'leg1', note: 'The piece has no centre fold line, so the folds were laid toward leg 1: check the fold arrows.' };
}

/**
 * pleat (primer §3): turn a dart that already sits at the seam into N pleats or tucks, by closing it and
 * opening N wedges at the given seam points (equal angles, or angles that give equal intakes).
 */
export function pleat(piece: Piece, input: PleatParams): OperationResult {
	const parsed = pleatParamsSchema.safeParse(input);
	if (!parsed.success) return refuse('invalid_params', z.prettifyError(parsed.error));
	const params = parsed.data;
	const dart = dartById(piece, params.dartId);
	if (!dart) return refuse('unknown_dart', `There is no dart "${params.dartId}" on this piece.`);
	const apex = apexById(piece, dart.apexId);
	if (!apex) return refuse('unknown_apex', `Dart "${dart.id}" refers to apex "${dart.apexId}", which is not on the piece.`);
	const P = apex.point;
	const g = wedgeGeometry(P, dart.leg1End, dart.leg2End);
	const count = params.at.length;
	const radii = params.at.map((s) => vecDistance(P, s));
	if (radii.some((r) => r < 1e-6)) return refuse('target_inside_dart', 'A pleat point lies on the apex itself.');
	const angles = params.mode === 'equal_angle' ? params.at.map(() => g.angleRad / count) : equalIntakeAngles(radii, g.angleRad);

	let pivots: (Vec | undefined)[] = params.at.map(() => undefined);
	if (params.parallel) {
		const rho = params.parallel.pivotRadiusMm;
		if (!(rho > 0) || rho > SUBSTITUTE_PIVOT_MAX_RADIUS_MM) {
			return refuse(
				'pivot_radius_too_large',
				`Substitute pivots must sit within ${SUBSTITUTE_PIVOT_MAX_RADIUS_MM} mm of the apex (got ${fmtMm(rho)}); larger offsets distort the pleats.`
			);
		}
		// pleat lines run parallel, from each seam point toward the apex side, to the circle of radius rho
		const mean = vecScale(params.at.reduce((s, p) => vecAdd(s, p), { x: 0, y: 0 }), 1 / count);
		const d = vecNormalize(vecSub(P, mean));
		pivots = [];
		for (const S of params.at) {
			// |S + u·d − P|² = rho², nearest root
			const f = vecSub(S, P);
			const b = f.x * d.x + f.y * d.y;
			const c = f.x * f.x + f.y * f.y - rho * rho;
			const disc = b * b - c;
			if (disc < 0) {
				return refuse(
					'pleat_line_misses_pivot_circle',
					`The parallel pleat line from (${S.x.toFixed(1)}, ${S.y.toFixed(1)}) passes ${fmtMm(Math.sqrt(Math.max(0, vecLength(f) ** 2 - b * b)))} from the apex and misses the ${fmtMm(rho)} pivot circle; place the pleats closer together or use a larger radius (≤ ${SUBSTITUTE_PIVOT_MAX_RADIUS_MM} mm).`
				);
			}
			const u = -b - Math.sqrt(disc);
			pivots.push(vecAdd(S, vecScale(d, u)));
		}
	}

	const r = openWedgesKeepingStill(
		piece,
		dart,
		params.at.map((at, i) => ({ at, angleRad: angles[i], pivot: pivots[i] })),
		0,
		(i) => `${params.kind === 'tuck' ? 'Tuck' : 'Pleat'} ${i + 1}`
	);
	if (!r.ok) return refuse(r.code, r.message);
	const carried = carryMarkings(piece, (p) => rotationMotion(P, r.value.rotationForPoint(p)), new Set([dart.id]), [P], { grainlineKeepsDirection: true });
	const ids = new Set(piece.pleats.map((p) => p.id));
	const notes = [...r.value.notes];
	const pleats: Pleat[] = [];
	const opened = [...r.value.openings].sort((a, b) => a.requestIndex - b.requestIndex);
	for (const o of opened) {
		const id = uniqueId(ids, params.pleatIds?.[o.requestIndex] ?? `${dart.id}-${params.kind}-${o.requestIndex + 1}`);
		ids.add(id);
		let side: LegSide;
		if (params.foldToward) side = params.foldToward;
		else {
			const def = defaultFoldToward(piece, o, P);
			side = def.side;
			if (def.note && !notes.includes(def.note)) notes.push(def.note);
		}
		const leg1Inner = o.pivot1 ?? P;
		const leg2Inner = o.pivot2 ?? P;
		const leg1Line = { from: o.leg1End, to: leg1Inner };
		const leg2Line = { from: o.leg2End, to: leg2Inner };
		// the fold is laid onto the placement line: placement on the side it is laid toward
		const placementLine = side === 'leg1' ? leg1Line : leg2Line;
		const foldLine = side === 'leg1' ? leg2Line : leg1Line;
		const intakeMm = vecDistance(o.leg1End, o.leg2End);
		pleats.push({
			id,
			apexId: apex.id,
			kind: params.kind,
			leg1End: o.leg1End,
			leg2End: o.leg2End,
			pivot1: o.pivot1,
			pivot2: o.pivot2,
			foldLine,
			placementLine,
			foldToward: side,
			foldArrow: { from: foldLine.from, to: placementLine.from },
			intakeMm,
			depthMm: intakeMm / 2,
			stitchLengthMm: params.kind === 'tuck' ? params.stitchLengthMm : undefined
		});
	}
	const next: Piece = {
		...piece,
		...carried,
		outline: r.value.outline,
		darts: carried.darts.filter((d) => d.id !== dart.id),
		pleats: [...carried.pleats, ...pleats]
	};
	const entries: LedgerEntry[] = [
		ledgerEntry({ apexId: apex.id, kind: 'dart', refId: dart.id, label: `dart "${dart.id}" closed`, angleRad: -g.angleRad }),
		...pleats.map((p) =>
			ledgerEntry({
				apexId: apex.id,
				kind: params.kind,
				refId: p.id,
				label: `${params.kind} "${p.id}" opened`,
				angleRad: wedgeGeometry(P, p.leg1End, p.leg2End).angleRad
			})
		)
	];
	const values: Record<string, number> = { angleRad: g.angleRad, count };
	pleats.forEach((p, i) => {
		values[`pleat${i + 1}AngleRad`] = wedgeGeometry(P, p.leg1End, p.leg2End).angleRad;
		values[`pleat${i + 1}IntakeMm`] = p.intakeMm;
		values[`pleat${i + 1}DepthMm`] = p.depthMm;
	});
	return succeed(next, entries, {
		op: 'pleat',
		summary: `Dart "${dart.id}" (${fmtDeg(g.angleRad)}) became ${count} ${params.kind}${count > 1 ? 's' : ''}: ${pleats
			.map((p) => `${fmtMm(p.intakeMm)} intake, ${fmtMm(p.depthMm)} deep`)
			.join('; ')}.`,
		values,
		notes
	});
}
