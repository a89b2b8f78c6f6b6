import { z } from 'zod';
import { piecePressByPractice } from '../press-practice';
import { ledgerEntry, DEFAULT_SHAPING_TOLERANCES, type LedgerEntry } from '../ledger';
import { fmtDeg, fmtMm, refuse, succeed, type OperationResult } from '../operation-result';
import { apexById, dartById, wedgeGeometry } from '../piece';
import { vecSchema, type Dart, type Piece } from '../piece-schema';
import { carryMarkings, rotationMotion } from './carry-markings';
import { openWedgesKeepingStill } from './still-side';
import { reapplyPullBack } from './pull-back';

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });

/** One share: a fraction of the dart angle or an angle in radians (give exactly one). */
const shareAmountSchema = z
	.object({ fraction: finite().optional(), angleRad: finite().optional() })
	.refine((s) => (s.fraction === undefined) !== (s.angleRad === undefined), {
		message: 'give either a fraction or an angle, not both'
	});

export const shareParamsSchema = z.object({
	dartId: z.string().min(1),
	parts: z
		.array(
			z.object({
				to: vecSchema,
				fraction: finite().optional(),
				angleRad: finite().optional(),
				newDartId: z.string().min(1).optional()
			})
		)
		.min(1)
		.max(12),
	/** What stays in the old dart (default nothing). */
	keep: shareAmountSchema.optional()
});
export type ShareParams = z.infer<typeof shareParamsSchema>;

/** Resolve fractions/angles of a share against the whole angle; refuse unless they sum to it. */
export function resolveShares(
	wholeRad: number,
	amounts: readonly { fraction?: number; angleRad?: number }[],
	toleranceRad = DEFAULT_SHAPING_TOLERANCES.angleRad
): { ok: true; anglesRad: number[] } | { ok: false; code: 'shares_do_not_sum' | 'share_not_positive' | 'invalid_params'; message: string } {
	const angles: number[] = [];
	for (const a of amounts) {
		if ((a.fraction === undefined) === (a.angleRad === undefined)) {
			return { ok: false, code: 'invalid_params', message: 'Each share needs either a fraction or an angle (not both).' };
		}
		angles.push(a.fraction !== undefined ? a.fraction * wholeRad : (a.angleRad as number));
	}
	if (angles.some((a) => !(a > 0))) {
		return { ok: false, code: 'share_not_positive', message: 'Every share must be more than zero.' };
	}
	const sum = angles.reduce((s, a) => s + a, 0);
	if (Math.abs(sum - wholeRad) > toleranceRad) {
		return {
			ok: false,
			code: 'shares_do_not_sum',
			message: `The shares add up to ${fmtDeg(sum)} but the dart is ${fmtDeg(wholeRad)} (${fmtDeg(wholeRad - sum)} ${sum < wholeRad ? 'missing' : 'too much'}); they must sum to the whole dart.`
		};
	}
	// absorb the rounding so the ledger balances exactly
	return { ok: true, anglesRad: angles.map((a) => (a * wholeRad) / sum) };
}

export function uniqueId(existing: ReadonlySet<string>, wanted: string): string {
	if (!existing.has(wanted)) return wanted;
	for (let i = 2; ; i++) if (!existing.has(`${wanted}-${i}`)) return `${wanted}-${i}`;
}

/** share (partial transfer, primer §1): split a dart among several new points by fractions or angles. */
export function share(piece: Piece, params: ShareParams): OperationResult {
	const dart = dartById(piece, params.dartId);
	if (!dart) return refuse('unknown_dart', `There is no dart "${params.dartId}" on this piece.`);
	const apex = apexById(piece, dart.apexId);
	if (!apex) return refuse('unknown_apex', `Dart "${dart.id}" refers to apex "${dart.apexId}", which is not on the piece.`);
	const g = wedgeGeometry(apex.point, dart.leg1End, dart.leg2End);
	const amounts = [...params.parts, ...(params.keep ? [params.keep] : [])];
	const resolved = resolveShares(g.angleRad, amounts);
	if (!resolved.ok) return refuse(resolved.code, `Dart "${dart.id}": ${resolved.message}`);
	const partAngles = resolved.anglesRad.slice(0, params.parts.length);
	const keepAngle = params.keep ? resolved.anglesRad[params.parts.length] : 0;
	const r = openWedgesKeepingStill(
		piece,
		dart,
		params.parts.map((p, i) => ({ at: p.to, angleRad: partAngles[i] })),
		keepAngle,
		(i) => `Part ${i + 1} of dart "${dart.id}"`
	);
	if (!r.ok) return refuse(r.code, r.message);
	const carried = carryMarkings(piece, (p) => rotationMotion(apex.point, r.value.rotationForPoint(p)), new Set([dart.id]), [apex.point], {
		grainlineKeepsDirection: true
	});
	const ids = new Set(piece.darts.map((d) => d.id));
	if (!r.value.remainingDart) ids.delete(dart.id);
	const newDarts: Dart[] = [];
	const opened = [...r.value.openings].sort((a, b) => a.requestIndex - b.requestIndex);
	for (const o of opened) {
		const id = uniqueId(ids, params.parts[o.requestIndex].newDartId ?? `${dart.id}-${o.requestIndex + 1}`);
		ids.add(id);
		newDarts.push({
			id,
			apexId: dart.apexId,
			leg1End: o.leg1End,
			leg2End: o.leg2End,
			movingLeg: o.movedLeg,
			pullBack: reapplyPullBack(apex.point, dart, o.leg1End, o.leg2End)
		});
	}
	const darts: Dart[] = [];
	for (const d of carried.darts) {
		if (d.id !== dart.id) darts.push(d);
		else {
			if (r.value.remainingDart) {
				const rd = r.value.remainingDart;
				darts.push({ ...dart, leg1End: rd.leg1End, leg2End: rd.leg2End, cap: undefined, pullBack: reapplyPullBack(apex.point, dart, rd.leg1End, rd.leg2End) });
			}
			darts.push(...newDarts);
		}
	}
	const next: Piece = piecePressByPractice({ ...piece, ...carried, outline: r.value.outline, darts });
	const entries: LedgerEntry[] = [
		ledgerEntry({ apexId: apex.id, kind: 'dart', refId: dart.id, label: `dart "${dart.id}" closed`, angleRad: -g.angleRad })
	];
	if (r.value.remainingDart) {
		entries.push(ledgerEntry({ apexId: apex.id, kind: 'dart', refId: dart.id, label: `dart "${dart.id}" keeps part`, angleRad: keepAngle }));
	}
	for (const d of newDarts) {
		entries.push(
			ledgerEntry({ apexId: apex.id, kind: 'dart', refId: d.id, label: `dart "${d.id}" opened`, angleRad: wedgeGeometry(apex.point, d.leg1End, d.leg2End).angleRad })
		);
	}
	const values: Record<string, number> = { angleRad: g.angleRad, keepAngleRad: keepAngle };
	newDarts.forEach((d, i) => {
		const ng = wedgeGeometry(apex.point, d.leg1End, d.leg2End);
		values[`part${i + 1}AngleRad`] = ng.angleRad;
		values[`part${i + 1}IntakeMm`] = ng.intakeMm;
	});
	return succeed(next, entries, {
		op: 'share',
		summary: `Dart "${dart.id}" (${fmtDeg(g.angleRad)}) shared into ${newDarts
			.map((d) => {
				const ng = wedgeGeometry(apex.point, d.leg1End, d.leg2End);
				return `"${d.id}" ${fmtDeg(ng.angleRad)} (${fmtMm(ng.intakeMm)})`;
			})
			.join(', ')}${keepAngle > 0 ? `, ${fmtDeg(keepAngle)} left in place` : ''}.`,
		values,
		notes: r.value.notes
	});
}
